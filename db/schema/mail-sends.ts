import type { Generated } from 'kysely';

/** An e-mail counted against one sending limit (`limitKey`) over a recent window. */
export interface MailSendsTable {
  id: Generated<number>;
  limitKey: string;
  at: string;
}
