// A job thread (job-thread.ts). Plain JavaScript, because a worker starts without the TypeScript
// loader the API runs under: tsx loads the module of jobs here, once. Each job is answered with
// { id, result } or { id, error }, the error with the fields the error middleware reads.
import { parentPort, workerData } from 'node:worker_threads';
import { tsImport } from 'tsx/esm/api';

const jobs = await tsImport(workerData.module, import.meta.url);

parentPort.on('message', async ({ id, name, args }) => {
  try {
    parentPort.postMessage({ id, result: await jobs[name](...args) });
  } catch (failure) {
    const { message, status, code, fields, stack } = failure;
    parentPort.postMessage({ id, error: { message, status, code, fields, stack } });
  }
});
