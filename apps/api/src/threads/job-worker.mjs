// A job thread (job-thread.ts). Plain JavaScript, because a worker starts without the TypeScript
// loader the API may run under: under tsx (tests, `pnpm dev:api`) the module of jobs is loaded
// through tsx here, once; built (`pnpm start`, scripts/build-api.ts) it is plain JavaScript. Each
// job is answered with { id, result } or { id, error }, the error with the fields the error
// middleware reads; the bytes of an answer's `body` (a read's JSON) are handed over, not copied.
import { parentPort, workerData } from 'node:worker_threads';

const load = async (module) => (module.endsWith('.ts') ? (await import('tsx/esm/api')).tsImport(module, import.meta.url) : import(module));
const jobs = await load(workerData.module);

parentPort.on('message', async ({ id, name, args }) => {
  try {
    const result = await jobs[name](...args);
    parentPort.postMessage({ id, result }, result?.body instanceof Uint8Array ? [result.body.buffer] : []);
  } catch (failure) {
    const { message, status, code, fields, stack } = failure;
    parentPort.postMessage({ id, error: { message, status, code, fields, stack } });
  }
});
