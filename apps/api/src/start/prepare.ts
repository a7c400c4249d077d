import { migrateToLatest, openDatabase } from '@busbar/db';
import { pruneSessions } from '../auth/session-store.ts';
import type { Config } from '../config.ts';
import { ensureDemoData } from '../demo.ts';
import { sendWeeklyDigests } from '../digest/weekly-digest.ts';
import { startMailCapture } from '../mail/capture.ts';
import { createMailer } from '../mail/mailer.ts';
import { failUnfinishedExports } from '../queries/exports.ts';
import { keepSearchIndexesMerged } from '../queries/search-upkeep.ts';
import { keepPlannerStatistics } from '../queries/statistics.ts';

/** Where the app's mail goes: the configured server, or the local capture this start-up runs. */
export interface MailRoute {
  smtpUrl: string;
  captured: boolean;
}

/**
 * What runs once for the whole app, before any process answers requests: migrations, the demo
 * network for an empty database, exports a stopped app left unfinished marked failed, the
 * planner's statistics, session pruning and the search indexes' merging (all kept up on a
 * schedule), the local mail capture when no SMTP server is set, and the weekly e-mail (looked for
 * every hour). `tell` hears each long step before it runs (start/ready.ts shows it to whoever
 * opens Busbar meanwhile).
 */
export async function prepare(config: Config, now: () => Date, tell: (words: string) => void = () => {}): Promise<MailRoute> {
  const db = openDatabase(config.databaseFile);
  // The page says how far along; the log, which migration (not for whoever opens the address).
  await migrateToLatest(db, ({ name, done, of }) => {
    console.log(`Bringing the database up to date, ${done + 1} of ${of}: ${name}`);
    tell(`Bringing the database up to date: step ${done + 1} of ${of}`);
  });
  if (config.demoData && (await ensureDemoData(db, config.scryptLogN, now(), config.dataDir, () => tell('Filling the empty database with the demo network')))) {
    console.log('Filled the empty database with the demo network.');
  }
  tell('Gathering statistics for the database');
  await keepPlannerStatistics(db);
  await pruneSessions(db, now());
  await failUnfinishedExports(db, now());
  setInterval(() => void pruneSessions(db, now()), 3_600_000).unref();
  keepSearchIndexesMerged(db, now);
  const mail = await mailRoute(config);
  const mailer = createMailer(db, mail.smtpUrl, config.mailFrom, now, mail.captured);
  const sendDigests = () => void sendWeeklyDigests(db, mailer, config.publicUrl, now()).catch((error: unknown) => console.error('The weekly e-mail failed:', error));
  sendDigests();
  setInterval(sendDigests, 3_600_000).unref();
  return mail;
}

async function mailRoute(config: Config): Promise<MailRoute> {
  if (config.smtpUrl) return { smtpUrl: config.smtpUrl, captured: false };
  const capture = await startMailCapture(config.smtpCapturePort).catch(() => startMailCapture(0));
  console.log(`No SMTP_URL set: mail is captured locally (port ${capture.port}) and listed in the Outbox.`);
  return { smtpUrl: `smtp://127.0.0.1:${capture.port}`, captured: true };
}
