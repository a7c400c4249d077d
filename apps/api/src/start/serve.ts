import { openDatabase } from '@busbar/db';
import { createApp } from '../app.ts';
import type { Config } from '../config.ts';
import { createMailer } from '../mail/mailer.ts';
import type { MailRoute } from './prepare.ts';

/** One process answering requests on its own connection (several share the port: see workers.ts). */
export function serve(config: Config, mail: MailRoute, now: () => Date): Promise<void> {
  const db = openDatabase(config.databaseFile);
  const mailer = createMailer(db, mail.smtpUrl, config.mailFrom, now, mail.captured);
  const app = createApp({ db, config, mailer, now });
  return new Promise((resolve) => app.listen(config.port, () => resolve()));
}
