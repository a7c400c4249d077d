import cluster from 'node:cluster';
import type { Config } from '../config.ts';
import type { MailRoute } from './prepare.ts';

const RESTART_DELAY_MS = 1000;

/**
 * Starts `config.processes` app processes that share the port, each with its own database
 * connection and threads, so requests are answered on every CPU. One that stops is started again.
 * Failed sign-ins are counted in the database, so every process sees the same counts.
 */
export function startWorkers(config: Config, mail: MailRoute): void {
  let stopping = false;
  const start = () => cluster.fork({ BUSBAR_WORKER: JSON.stringify({ mail }) });
  for (let i = 0; i < config.processes; i++) start();
  cluster.on('exit', (_worker, code, signal) => {
    if (stopping) return;
    console.error(`An app process stopped (${signal ?? `exit code ${code}`}); starting another.`);
    setTimeout(start, RESTART_DELAY_MS);
  });
  const stop = () => {
    stopping = true;
    for (const worker of Object.values(cluster.workers ?? {})) worker?.kill();
    process.exit(0);
  };
  process.on('SIGTERM', stop);
  process.on('SIGINT', stop);
}

/** What the first process handed this one (see startWorkers). */
export function fromPrimary(): { mail: MailRoute } {
  return JSON.parse(process.env.BUSBAR_WORKER!);
}
