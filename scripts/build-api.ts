/**
 * Builds the API into plain JavaScript (dist/api) for `pnpm start`, so the app's processes and
 * their background threads run without the TypeScript loader: tsx costs each of them a loader
 * thread and its compiled sources, about 35 MB apiece. Busbar's own packages are bundled in; every
 * other package stays in node_modules and is imported by its resolved path (pnpm keeps a package's
 * dependencies beside it, not where dist/ can find them by name), so dist/ is for this checkout
 * only. Takes about a second; `pnpm start` runs it every time.
 */
import { build, type Plugin } from 'esbuild';
import { dirname } from 'node:path';

export const API_DIST = 'dist/api';
/** The files that start it and that its background threads load (threads/job-thread.ts finds them beside main.mjs). */
const ENTRIES = {
  main: 'apps/api/src/main.ts',
  jobs: 'apps/api/src/threads/jobs.ts',
  'job-worker': 'apps/api/src/threads/job-worker.mjs',
  'getting-ready': 'apps/api/src/start/getting-ready.ts',
};

/** Packages that are not Busbar's own, imported from where they are installed. */
const installedPackages: Plugin = {
  name: 'installed-packages',
  setup(b) {
    b.onResolve({ filter: /^[^./]/ }, async ({ path, importer, kind, pluginData }) => {
      // Busbar's packages are bundled; `installed` marks the resolve below, asking esbuild itself.
      if (path.startsWith('@busbar/') || pluginData === 'installed') return undefined;
      if (path.startsWith('node:')) return { path, external: true };
      const found = await b.resolve(path, { kind, resolveDir: dirname(importer), pluginData: 'installed' });
      if (found.errors.length > 0) return { errors: found.errors };
      return { path: found.path, external: true };
    });
  },
};

export async function buildApi(outdir = API_DIST): Promise<void> {
  await build({
    entryPoints: ENTRIES,
    outdir,
    outExtension: { '.js': '.mjs' },
    bundle: true,
    platform: 'node',
    format: 'esm',
    target: 'node20',
    logLevel: 'warning',
    plugins: [installedPackages],
  });
}

if (import.meta.url === `file://${process.argv[1]}`) await buildApi();
