/**
 * Builds the web app only when its sources changed: a SHA-256 over every file the build reads
 * (the web app, the shared packages it imports, the build configuration and the locked
 * dependencies) is compared with the one stamped into dist/web by the last build. `pnpm start`
 * runs this, so restarting an unchanged app starts at once. `pnpm build` always builds.
 */
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { existsSync, readdirSync, readFileSync, statSync, writeFileSync } from 'node:fs';
import { join } from 'node:path';

const INPUTS = ['index.html', 'vite.config.ts', 'scripts/precompress.ts', 'package.json', 'pnpm-lock.yaml', 'tsconfig.json', 'apps/web', 'packages/shared', 'packages/calc'];
const STAMP = 'dist/web/.source-hash';

function filesOf(path: string): string[] {
  if (!existsSync(path)) return [];
  if (!statSync(path).isDirectory()) return [path];
  return readdirSync(path, { recursive: true, encoding: 'utf8' })
    .filter((name) => !name.split('/').includes('node_modules'))
    .map((name) => join(path, name))
    .filter((file) => statSync(file).isFile());
}

/** One hash over the names and contents of every input file, in a fixed order. */
function sourceHash(root = '.'): string {
  const hash = createHash('sha256');
  for (const file of INPUTS.flatMap((input) => filesOf(join(root, input))).sort()) {
    hash.update(`${file}\0`).update(readFileSync(file)).update('\0');
  }
  return hash.digest('hex');
}

const current = sourceHash();
const built = existsSync(STAMP) ? readFileSync(STAMP, 'utf8').trim() : null;
if (built === current && existsSync('dist/web/index.html')) {
  console.log('The web app is up to date (dist/web).');
} else {
  const vite = spawnSync(join('node_modules', '.bin', 'vite'), ['build'], { stdio: 'inherit' });
  if (vite.status !== 0) process.exit(vite.status ?? 1);
  writeFileSync(STAMP, `${current}\n`);
}
