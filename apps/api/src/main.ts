import { migrateToLatest, openDatabase } from '@busbar/db';
import { createApp } from './app.ts';
import { pruneSessions } from './auth/session-store.ts';
import { loadConfig } from './config.ts';
import { ensureDemoData } from './demo.ts';
import { startMailCapture } from './mail/capture.ts';
import { createMailer } from './mail/mailer.ts';
import { keepPlannerStatistics } from './queries/statistics.ts';

const config = loadConfig();
const now = () => new Date();
const db = openDatabase(config.databaseFile);
await migrateToLatest(db);
if (config.demoData && (await ensureDemoData(db, config.scryptLogN, now(), config.dataDir))) {
  console.log('Filled the empty database with the demo network.');
}
await keepPlannerStatistics(db);
await pruneSessions(db, now());
setInterval(() => void pruneSessions(db, now()), 3_600_000).unref();

let smtpUrl = config.smtpUrl;
if (!smtpUrl) {
  const capture = await startMailCapture(config.smtpCapturePort).catch(() => startMailCapture(0));
  smtpUrl = `smtp://127.0.0.1:${capture.port}`;
  console.log(`No SMTP_URL set: mail is captured locally (port ${capture.port}) and listed in the Outbox.`);
}
const mailer = createMailer(db, smtpUrl, config.mailFrom, now, !config.smtpUrl);
const app = createApp({ db, config, mailer, now });
app.listen(config.port, () => {
  console.log(`Busbar is running at ${config.publicUrl}${config.webDist ? '' : ' (API only: run `pnpm build` for the web app)'}`);
});
