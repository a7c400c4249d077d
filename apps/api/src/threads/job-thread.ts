import { Worker, type ResourceLimits } from 'node:worker_threads';
import { HttpError } from '../errors.ts';

/** `.ts` where the module at `url` runs as TypeScript (tsx), `.mjs` where it was built (scripts/build-api.ts puts each thread's module beside it). */
export const ownExtension = (url: string) => /\.[a-z]+$/.exec(new URL(url).pathname)![0];

type Jobs = Record<string, (...args: never[]) => Promise<unknown>>;
/** An error as it crosses threads: a thrown error loses its own fields (`status`, `code`) on the way. */
export interface JobFailure {
  message: string;
  status?: number;
  code?: string;
  fields?: Record<string, string>;
  stack?: string;
}
type Answer = { id: number } & ({ result: unknown } | { error: JobFailure });
type Waiting = { resolve: (result: unknown) => void; reject: (error: Error) => void };

/**
 * A worker thread with its own database connection that runs the functions one module exports,
 * so long work (an import, a network's reliability figures) does not hold the one thread every
 * other request is answered on. The thread starts at its first job and is kept; it does not keep
 * the process alive. If it stops, the waiting jobs fail and the next job starts a new one.
 */
export class JobThread<J extends Jobs> {
  private worker: Worker | null = null;
  private readonly waiting = new Map<number, Waiting>();
  private lastId = 0;

  constructor(
    private readonly module: URL,
    private readonly limits: ResourceLimits,
  ) {}

  run<K extends keyof J & string>(name: K, ...args: Parameters<J[K]>): Promise<Awaited<ReturnType<J[K]>>> {
    return new Promise((resolve, reject) => {
      const id = ++this.lastId;
      this.waiting.set(id, { resolve: resolve as (result: unknown) => void, reject });
      this.thread().postMessage({ id, name, args });
    });
  }

  /** Ends the thread (a job after this starts a new one). */
  async stop(): Promise<void> {
    const stopping = this.worker;
    this.worker = null;
    await stopping?.terminate();
  }

  private thread(): Worker {
    if (this.worker) return this.worker;
    const started = new Worker(new URL('./job-worker.mjs', import.meta.url), { workerData: { module: this.module.href }, resourceLimits: this.limits });
    started.unref();
    started.on('message', (answer: Answer) => {
      const job = this.waiting.get(answer.id);
      this.waiting.delete(answer.id);
      if ('result' in answer) job?.resolve(answer.result);
      else job?.reject(rebuilt(answer.error));
    });
    const fail = (error: Error) => {
      if (this.worker === started) this.worker = null;
      for (const job of this.waiting.values()) job.reject(error);
      this.waiting.clear();
    };
    started.on('error', fail);
    started.on('exit', (code) => fail(new Error(`A worker thread stopped (exit code ${code})`)));
    this.worker = started;
    return started;
  }
}

/** The error the job threw, as the error middleware expects it (an HttpError keeps its status and fields). */
function rebuilt(failure: JobFailure): Error {
  const error = failure.status !== undefined && failure.code !== undefined ? new HttpError(failure.status, failure.code, failure.message, failure.fields) : Object.assign(new Error(failure.message), { code: failure.code });
  if (failure.stack) error.stack = failure.stack;
  return error;
}
