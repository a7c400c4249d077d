// The imports' worker thread. Plain JavaScript, because a worker starts without the TypeScript
// loader the API runs under: tsx loads the import's code here, once. Each job is answered with
// { id, result } or { id, error }, the error with the fields the error middleware reads (a thrown
// error loses its `code` crossing threads).
import { parentPort } from 'node:worker_threads';
import { tsImport } from 'tsx/esm/api';

const { importBuilds } = await tsImport('./import-job.ts', import.meta.url);

parentPort.on('message', async ({ id, job }) => {
  try {
    parentPort.postMessage({ id, result: await importBuilds(job) });
  } catch (failure) {
    parentPort.postMessage({ id, error: { message: failure.message, code: failure.code, stack: failure.stack } });
  }
});
