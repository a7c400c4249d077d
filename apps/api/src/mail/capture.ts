import { SMTPServer } from 'smtp-server';

export interface CapturedMail {
  from: string;
  to: string[];
  raw: string;
}

export interface MailCapture {
  port: number;
  messages: CapturedMail[];
  close(): Promise<void>;
}

/**
 * A local SMTP server that accepts every message and keeps it in memory: used in development
 * (when no SMTP_URL is set) and by tests, which read what Busbar really sent over SMTP.
 */
export function startMailCapture(port = 0, host = '127.0.0.1'): Promise<MailCapture> {
  const messages: CapturedMail[] = [];
  const server = new SMTPServer({
    authOptional: true,
    disabledCommands: ['STARTTLS', 'AUTH'],
    logger: false,
    size: 10 * 1024 * 1024,
    onData(stream, session, callback) {
      const chunks: Buffer[] = [];
      stream.on('data', (chunk: Buffer) => chunks.push(chunk));
      stream.on('end', () => {
        const envelope = session.envelope;
        messages.push({
          from: envelope.mailFrom ? envelope.mailFrom.address : '',
          to: envelope.rcptTo.map((r) => r.address),
          raw: Buffer.concat(chunks).toString('utf8'),
        });
        callback();
      });
    },
  });
  return new Promise((resolve, reject) => {
    server.once('error', reject);
    server.listen(port, host, () => {
      const address = server.server.address();
      resolve({
        port: typeof address === 'object' && address ? address.port : port,
        messages,
        close: () => new Promise((done) => server.close(() => done())),
      });
    });
  });
}
