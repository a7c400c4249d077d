import type { Generated } from 'kysely';

export interface MailLogTable {
  id: Generated<number>;
  sentAt: string;
  toAddress: string;
  subject: string;
  text: string;
  status: 'sent' | 'failed';
  error: string | null;
}
