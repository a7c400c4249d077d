import { spawn, type ChildProcess } from 'node:child_process';
import { readdirSync, readFileSync } from 'node:fs';
import { createServer } from 'node:net';
import { API_DIST, buildApi } from '../scripts/build-api.ts';

/** Highest resident memory so far (VmHWM) of the largest of the app's processes and of all of them, in MiB. */
export interface PeakMemory {
  largestMiB: number;
  totalMiB: number;
  processes: number;
}

export interface RunningApp {
  baseUrl: string;
  peakMemory(): PeakMemory;
  /** The ids of the processes that answer requests (the first one's children, when it starts several). */
  processes(): number[];
  stop(): Promise<void>;
}

export async function freePort(): Promise<number> {
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

const APP = `${API_DIST}/main.mjs`;
const peakMiB = (pid: number) => Number(/VmHWM:\s+(\d+) kB/.exec(readFileSync(`/proc/${pid}/status`, 'utf8'))?.[1] ?? 0) / 1024;

/** The app's child processes: the processes it answers on (one per CPU: see apps/api/src/start/workers.ts) and any helper. */
function childrenOf(pid: number): number[] {
  return readdirSync(`/proc/${pid}/task`).flatMap((task) =>
    readFileSync(`/proc/${pid}/task/${task}/children`, 'utf8').split(' ').filter(Boolean).map(Number),
  );
}

/**
 * Starts the real app as `pnpm start` does (built to dist/api by scripts/build-api.ts), as its
 * own process on `port` (a free one unless given), on the database in `dataDir`, with `env` added
 * to its environment.
 */
export async function startApp(dataDir: string, env: Record<string, string> = {}, port?: number): Promise<RunningApp> {
  port ??= await freePort();
  await buildApi();
  const child = spawn(process.execPath, [APP], {
    env: { ...process.env, PORT: String(port), BUSBAR_DATA_DIR: dataDir, SMTP_CAPTURE_PORT: '0', NODE_ENV: 'production', ...env },
    stdio: ['ignore', 'pipe', 'pipe'],
  });
  let output = '';
  child.stdout!.on('data', (d: Buffer) => (output += d));
  child.stderr!.on('data', (d: Buffer) => (output += d));
  const baseUrl = `http://127.0.0.1:${port}`;
  await waitUntilUp(baseUrl, child, () => output);
  return {
    baseUrl,
    processes() {
      const servers = childrenOf(child.pid!).filter((pid) => readFileSync(`/proc/${pid}/cmdline`, 'utf8').includes(APP));
      return servers.length > 0 ? servers : [child.pid!];
    },
    peakMemory() {
      const peaks = [child.pid!, ...childrenOf(child.pid!)].map(peakMiB);
      return { largestMiB: Math.max(...peaks), totalMiB: peaks.reduce((a, b) => a + b, 0), processes: peaks.length };
    },
    stop: () =>
      new Promise((resolve) => {
        child.once('exit', () => resolve());
        child.kill('SIGTERM');
      }),
  };
}
