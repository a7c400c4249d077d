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

/** How much the capture keeps: the newest messages, at most this many and this many bytes in all. */
export interface CaptureBounds {
  maxMessages: number;
  maxBytes: number;
}

/** The Outbox shows what was sent from the mail log, so the capture needs only the recent messages. */
const DEFAULT_BOUNDS: CaptureBounds = { maxMessages: 500, maxBytes: 50 * 1024 * 1024 };

/** Drops the oldest messages until the kept ones fit the bounds. */
function keepWithin(messages: CapturedMail[], bounds: CaptureBounds): void {
  let bytes = messages.reduce((sum, m) => sum + Buffer.byteLength(m.raw), 0);
  let drop = 0;
  while (drop < messages.length && (messages.length - drop > bounds.maxMessages || bytes > bounds.maxBytes)) bytes -= Buffer.byteLength(messages[drop++]!.raw);
  messages.splice(0, drop);
}

/**
 * A local SMTP server that accepts every message and keeps the newest in memory, within bounds:
 * used in development and the demo (when no SMTP_URL is set), which may run for weeks, and by
 * tests, which read what Busbar really sent over SMTP.
 */
export function startMailCapture(port = 0, host = '127.0.0.1', bounds: CaptureBounds = DEFAULT_BOUNDS): Promise<MailCapture> {
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
        keepWithin(messages, bounds);
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
