import type { Db } from '@busbar/db';
import type { Config } from './config.ts';
import type { Mailer } from './mail/mailer.ts';

/** What every router needs; time is injected so tests can set the clock. */
export interface AppContext {
  db: Db;
  config: Config;
  mailer: Mailer;
  now: () => Date;
}
