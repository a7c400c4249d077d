import { randomUUID } from 'node:crypto';
import { copyFileSync, existsSync, mkdtempSync, renameSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { createApp } from '@busbar/api';
import { DEMO_PASSWORD, migrateToLatest, openDatabase, seedDemoNetwork, type Db } from '@busbar/db';
import { sql } from 'kysely';
import { simpleParser } from 'mailparser';
import request from 'supertest';
import { inject } from 'vitest';
import type { Config } from '../../apps/api/src/config.ts';
import { hashPassword } from '../../apps/api/src/auth/password.ts';
import { startMailCapture, type MailCapture } from '../../apps/api/src/mail/capture.ts';
import { createMailer } from '../../apps/api/src/mail/mailer.ts';

/** A low scrypt cost keeps tests quick; the cost is stored in each hash, so nothing else changes. */
const TEST_SCRYPT_LOG_N = 10;
/** The harness's clock starts here, and the demo is seeded up to it. */
const START = '2026-06-15T15:00:00Z';

/**
 * A database file migrated and seeded with the demo (with its history or without), made on first
 * use in this run's folder (database-templates.ts) and then only copied: each harness still gets a
 * file of its own, as fresh as one migrated and seeded for it, in milliseconds instead of seconds.
 * Two workers may both make one at once; each renames a finished file into place, so either serves.
 */
async function seededTemplate(history: boolean): Promise<string> {
  const file = join(inject('databaseTemplates'), history ? 'demo-history.sqlite' : 'demo.sqlite');
  if (existsSync(file)) return file;
  const draft = `${file}.${randomUUID()}`;
  const db = openDatabase(draft);
  await migrateToLatest(db);
  const passwordHash = await hashPassword(DEMO_PASSWORD, TEST_SCRYPT_LOG_N);
  await seedDemoNetwork(db, { passwordHash, now: new Date(START), history });
  // A rollback journal leaves the whole database in the one file once it is closed.
  await sql`pragma journal_mode = delete`.execute(db);
  await db.destroy();
  renameSync(draft, file);
  return file;
}

export interface Harness {
  app: ReturnType<typeof createApp>;
  db: Db;
  mail: MailCapture;
  clock: { now: Date };
  /** The data folder of this run (database, uploads). */
  dataDir: string;
  /** A supertest agent that has fetched the forgery-protection cookie and sends it back as a header. */
  agent(): Promise<Agent>;
  /** An agent signed in as a demo person (by e-mail). */
  signedIn(email: string): Promise<Agent>;
  /** Text and first link of the newest captured e-mail to `to`. */
  lastMailTo(to: string): Promise<{ subject: string; text: string; link: string | null }>;
  close(): Promise<void>;
}

export type Agent = ReturnType<typeof request.agent> & { csrf: string };

/**
 * `keepSecretsInMailLog` false acts as production does with real SMTP. `demo.history` adds the
 * demo's two years of catalog, customers and builds to the staff network (slower; ask only when needed).
 */
export async function startHarness(
  overrides: Partial<Config> = {},
  keepSecretsInMailLog = true,
  demo: { history?: boolean } = {},
): Promise<Harness> {
  const dataDir = mkdtempSync(join(tmpdir(), 'busbar-test-'));
  const clock = { now: new Date(START) };
  const now = () => clock.now;
  copyFileSync(await seededTemplate(demo.history === true), join(dataDir, 'busbar.sqlite'));
  const db = openDatabase(join(dataDir, 'busbar.sqlite'));
  const mail = await startMailCapture(0);
  const mailer = createMailer(db, `smtp://127.0.0.1:${mail.port}`, 'Busbar <no-reply@busbar.test>', now, keepSecretsInMailLog);
  const config: Config = {
    port: 0,
    dataDir,
    databaseFile: join(dataDir, 'busbar.sqlite'),
    publicUrl: 'http://localhost:3000',
    publicOrigin: null,
    sessionSecret: 'test-secret-test-secret-test-secret-0123',
    smtpUrl: null,
    smtpCapturePort: 0,
    mailFrom: 'Busbar <no-reply@busbar.test>',
    trustProxy: false,
    demoData: true,
    scryptLogN: TEST_SCRYPT_LOG_N,
    inviteTtlHours: 72,
    // No waiting after failed sign-ins unless a test asks for it (sign-in-lockout.test.ts).
    signInLimit: { windowMs: 15 * 60 * 1000, perAccountAddress: 10, perAddress: 1000, slowAfter: 5, delayMs: 0, maxDelayMs: 0 },
    passwordReset: { ttlMs: 3_600_000, windowMs: 3_600_000, perAccount: 3, perAddress: 20 },
    webDist: null,
    processes: 1,
    ...overrides,
  };
  const app = createApp({ db, config, mailer, now });

  async function agent(): Promise<Agent> {
    const a = request.agent(app) as Agent;
    // The token changes with the session (sign-in, sign-out), so the agent echoes the newest one it was sent.
    a.on('response', (res: request.Response) => {
      const cookie = ([] as string[]).concat(res.headers['set-cookie'] ?? []).find((c) => c.startsWith('busbar.csrf='));
      if (cookie) a.csrf = decodeURIComponent(cookie.split(';')[0]!.split('=')[1]!);
    });
    a.use((req: request.Test) => void (a.csrf && req.set('x-csrf-token', a.csrf)));
    await a.get('/api/health');
    return a;
  }

  async function signedIn(email: string): Promise<Agent> {
    const a = await agent();
    const res = await a.post('/api/session').send({ email, password: DEMO_PASSWORD });
    if (res.status !== 200) throw new Error(`sign-in of ${email} answered ${res.status}: ${JSON.stringify(res.body)}`);
    return a;
  }

  async function lastMailTo(to: string) {
    const message = [...mail.messages].reverse().find((m) => m.to.includes(to));
    if (!message) throw new Error(`no mail captured for ${to}`);
    const parsed = await simpleParser(message.raw);
    const text = parsed.text ?? '';
    return { subject: parsed.subject ?? '', text, link: text.match(/https?:\/\/\S+/)?.[0] ?? null };
  }

  return {
    app,
    db,
    mail,
    clock,
    dataDir,
    agent,
    signedIn,
    lastMailTo,
    async close() {
      mailer.close();
      await mail.close();
      await db.destroy();
      rmSync(dataDir, { recursive: true, force: true });
    },
  };
}

/** Ids of demo records by their code or e-mail, so tests do not depend on insertion order. */
export async function demoIds(db: Db) {
  const locations = await db.selectFrom('locations').select(['id', 'code', 'regionId']).execute();
  const regions = await db.selectFrom('regions').select(['id', 'code']).execute();
  const users = await db.selectFrom('users').select(['id', 'email']).execute();
  const location = (code: string) => locations.find((l) => l.code === code)!.id;
  const region = (code: string) => regions.find((r) => r.code === code)!.id;
  const user = (email: string) => users.find((u) => u.email === email)!.id;
  return { location, region, user, locations, regions };
}
