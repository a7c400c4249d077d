import { Worker } from 'node:worker_threads';
import type { ImportResult } from '@busbar/shared';
import type { ImportJob } from './import-job.ts';

type Answer = { id: number } & ({ result: ImportResult } | { error: { message: string; code?: string; stack?: string } });
type Waiting = { resolve: (result: ImportResult) => void; reject: (error: Error) => void };

/**
 * The worker's heap: a young generation of 8 MB (V8 gives a thread 16-32 MB by default) keeps an
 * import's many short-lived row objects from pushing the app past its memory target; the largest
 * file (5,000 rows, 5 MB) fits the old generation with room to spare.
 */
const WORKER_LIMITS = { maxYoungGenerationSizeMb: 8, maxOldGenerationSizeMb: 256 };

let worker: Worker | null = null;
const waiting = new Map<number, Waiting>();
let lastId = 0;

/** The one worker thread imports run on, started at the first import and kept (it does not keep the process alive). */
function importWorker(): Worker {
  if (worker) return worker;
  const started = new Worker(new URL('./import-worker.mjs', import.meta.url), { resourceLimits: WORKER_LIMITS });
  started.unref();
  started.on('message', (answer: Answer) => {
    const job = waiting.get(answer.id);
    waiting.delete(answer.id);
    if ('result' in answer) job?.resolve(answer.result);
    else job?.reject(Object.assign(new Error(answer.error.message), { code: answer.error.code, stack: answer.error.stack }));
  });
  const fail = (error: Error) => {
    worker = null;
    for (const job of waiting.values()) job.reject(error);
    waiting.clear();
  };
  started.on('error', fail);
  started.on('exit', (code) => fail(new Error(`The import worker stopped (exit code ${code})`)));
  worker = started;
  return started;
}

/**
 * Runs an import in a worker thread with its own database connection: parsing and checking
 * thousands of rows and writing them in one transaction would otherwise hold the one thread
 * every other request is answered on.
 */
export function runImport(job: ImportJob): Promise<ImportResult> {
  return new Promise((resolve, reject) => {
    const id = ++lastId;
    waiting.set(id, { resolve, reject });
    importWorker().postMessage({ id, job });
  });
}
