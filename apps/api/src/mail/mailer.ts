import type { Db } from '@busbar/db';
import nodemailer from 'nodemailer';
import { HttpError } from '../errors.ts';
import { logMail } from '../queries/mail.ts';

export interface OutgoingMail {
  to: string;
  subject: string;
  text: string;
  /** A secret in the text (an invite token) that the mail log must not keep in production. */
  secret?: string;
  /** Files sent with the message; the mail log names them. */
  attachments?: { filename: string; content: Buffer; contentType: string }[];
}

export interface Mailer {
  /** Sends one message and records it in the mail log; throws a 502 HttpError when SMTP refuses. */
  send(mail: OutgoingMail): Promise<void>;
  close(): void;
}

/**
 * nodemailer over SMTP; every attempt, sent or failed, lands in the mail log the Outbox shows.
 * With real SMTP (`keepSecrets` false) the log replaces secrets, so reading the log or the
 * database never hands out a live invite link; with local capture it keeps the whole message.
 */
export function createMailer(db: Db, smtpUrl: string, from: string, now: () => Date, keepSecrets: boolean): Mailer {
  const transport = nodemailer.createTransport(smtpUrl);
  const logged = ({ to, subject, text, secret, attachments = [] }: OutgoingMail) => {
    const kept = secret && !keepSecrets ? text.replaceAll(secret, '[removed from the log]') : text;
    const named = attachments.length > 0 ? `\n\nAttached: ${attachments.map((a) => a.filename).join(', ')}` : '';
    return { to, subject, text: kept + named };
  };
  return {
    async send(mail) {
      try {
        await transport.sendMail({ from, to: mail.to, subject: mail.subject, text: mail.text, attachments: mail.attachments });
      } catch (error) {
        await logMail(db, { ...logged(mail), sentAt: now().toISOString(), status: 'failed', error: String(error) });
        throw new HttpError(502, 'mail_failed', 'The e-mail could not be sent, so nothing was changed. Try again later.');
      }
      await logMail(db, { ...logged(mail), sentAt: now().toISOString(), status: 'sent', error: null });
    },
    close: () => transport.close(),
  };
}
