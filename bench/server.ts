import { spawn, type ChildProcess } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { createServer } from 'node:net';

export interface RunningApp {
  baseUrl: string;
  /** Highest resident memory of the app process so far (VmHWM), in MiB. */
  peakRssMiB(): number;
  stop(): Promise<void>;
}

async function freePort(): Promise<number> {
  return new Promise((resolve, reject) => {
    const server = createServer();
    server.listen(0, '127.0.0.1', () => {
      const { port } = server.address() as { port: number };
      server.close(() => resolve(port));
    });
    server.on('error', reject);
  });
}

async function waitUntilUp(baseUrl: string, child: ChildProcess, log: () => string): Promise<void> {
  for (let tries = 0; tries < 1200; tries++) {
    if (child.exitCode !== null) throw new Error(`the app exited (${child.exitCode}):\n${log()}`);
    const ok = await fetch(`${baseUrl}/api/health`).then((r) => r.ok, () => false);
    if (ok) return;
    await new Promise((r) => setTimeout(r, 250));
  }
  throw new Error(`the app did not answer within 5 minutes:\n${log()}`);
}

/** Starts the real app (apps/api/src/main.ts) as its own process on a free port, on the database in `dataDir`. */
export async function startApp(dataDir: string): Promise<RunningApp> {
  const port = await freePort();
  const child = spawn(process.execPath, ['--import', 'tsx', 'apps/api/src/main.ts'], {
    env: { ...process.env, PORT: String(port), BUSBAR_DATA_DIR: dataDir, SMTP_CAPTURE_PORT: '0', NODE_ENV: 'production' },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (d: Buffer) => (output += d));
  child.stderr!.on('data', (d: Buffer) => (output += d));
  const baseUrl = `http://127.0.0.1:${port}`;
  await waitUntilUp(baseUrl, child, () => output);
  return {
    baseUrl,
    peakRssMiB() {
      const status = readFileSync(`/proc/${child.pid}/status`, 'utf8');
      return Number(/VmHWM:\s+(\d+) kB/.exec(status)?.[1] ?? 0) / 1024;
    },
    stop: () =>
      new Promise((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}
