import type { Db } from '@busbar/db';
import nodemailer from 'nodemailer';
import { HttpError } from '../errors.ts';
import { logMail } from '../queries/mail.ts';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
}

export interface Mailer {
  /** Sends one message and records it in the mail log; throws a 502 HttpError when SMTP refuses. */
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/** nodemailer over SMTP; every attempt, sent or failed, lands in the mail log the Outbox shows. */
export function createMailer(db: Db, smtpUrl: string, from: string, now: () => Date): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  return {
    async send(mail) {
      try {
        await transport.sendMail({ from, ...mail });
      } catch (error) {
        await logMail(db, { ...mail, sentAt: now().toISOString(), status: 'failed', error: String(error) });
        throw new HttpError(502, 'mail_failed', 'The e-mail could not be sent. Nothing was saved; try again later.');
      }
      await logMail(db, { ...mail, sentAt: now().toISOString(), status: 'sent', error: null });
    },
    close: () => transport.close(),
  };
}
