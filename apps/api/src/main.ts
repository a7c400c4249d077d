import cluster from 'node:cluster';
import { loadConfig } from './config.ts';
import { prepare } from './start/prepare.ts';
import { serve } from './start/serve.ts';
import { fromPrimary, startWorkers } from './start/workers.ts';

const config = loadConfig();
const now = () => new Date();
const announce = () => console.log(`Busbar is running at ${config.publicUrl}${config.webDist ? '' : ' (API only: run `pnpm build` for the web app)'}`);
if (cluster.isPrimary) {
  const mail = await prepare(config, now);
  if (config.processes === 1) await serve(config, mail, now).then(announce);
  else {
    cluster.once('listening', announce);
    startWorkers(config, mail);
  }
} else {
  const { mail, signInLimit } = fromPrimary();
  await serve({ ...config, signInLimit }, mail, now);
}
