import cluster from 'node:cluster';
import type { Config } from '../config.ts';
import type { MailRoute } from './prepare.ts';

const RESTART_DELAY_MS = 1000;

/**
 * The most each half of an app process's young generation (V8's semi-space) may grow to, in MB.
 * V8 lets it reach 16 MB; then the short-lived objects of many requests at once held an app
 * process about 45 MB higher at its peak on the 200-shop network (299–350 MB against 262–298, four
 * runs each of the bench's 50 connections and import), for about 6 % fewer requests a second,
 * inside the noise of those runs.
 */
export const SEMI_SPACE_MB = 4;

/**
 * Starts `config.processes` app processes that share the port, each with its own database
 * connection and threads, so requests are answered on every CPU; also one alone, so that every
 * process answering requests has the same heap settings and is started again when it stops.
 * Failed sign-ins are counted in the database, so every process sees the same counts.
 */
export function startWorkers(config: Config, mail: MailRoute): void {
  let stopping = false;
  cluster.setupPrimary({ execArgv: [...process.execArgv, `--max-semi-space-size=${SEMI_SPACE_MB}`] });
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
