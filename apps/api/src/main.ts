import cluster from 'node:cluster';
import { configWarnings, loadConfig } from './config.ts';
import { prepare } from './start/prepare.ts';
import { answerWhilePreparing } from './start/ready.ts';
import { serve } from './start/serve.ts';
import { fromPrimary, startWorkers } from './start/workers.ts';

const config = loadConfig();
const now = () => new Date();
const announce = () => console.log(`Busbar is running at ${config.publicUrl}${config.webDist ? '' : ' (API only: run `pnpm build` for the web app)'}`);
if (cluster.isPrimary) {
  for (const warning of configWarnings(config)) console.warn(warning);
  const preparing = await answerWhilePreparing(config.port);
  const mail = await prepare(config, now, preparing.tell);
  await preparing.done();
  cluster.once('listening', announce);
  startWorkers(config, mail);
} else {
  await serve(config, fromPrimary().mail, now);
}
