import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import { availableParallelism } from 'node:os';
import { join, resolve } from 'node:path';
import { z } from 'zod';

const envSchema = z.object({
  PORT: z.coerce.number().int().min(0).max(65535).default(3000),
  BUSBAR_DATA_DIR: z.string().min(1).default('db/data'),
  PUBLIC_URL: z.url().optional(),
  SESSION_SECRET: z.string().min(32).optional(),
  SMTP_URL: z.url().optional(),
  SMTP_CAPTURE_PORT: z.coerce.number().int().min(0).max(65535).default(2525),
  MAIL_FROM: z.string().min(3).default('Busbar <no-reply@busbar.test>'),
  TRUST_PROXY: z.enum(['true', 'false']).default('false'),
  DEMO_DATA: z.enum(['true', 'false']).default('true'),
  BUSBAR_PROCESSES: z.coerce.number().int().min(1).max(64).optional(),
});

export interface Config {
  port: number;
  dataDir: string;
  databaseFile: string;
  publicUrl: string;
  /** The origin (scheme, host, port) of PUBLIC_URL when it is set: state-changing requests must come from it. */
  publicOrigin: string | null;
  sessionSecret: string;
  /** SMTP server to send through; when absent, start-up runs a local capture server. */
  smtpUrl: string | null;
  smtpCapturePort: number;
  mailFrom: string;
  trustProxy: boolean;
  demoData: boolean;
  /** log2 of scrypt's cost N; with r=8 and p=3 (password.ts), 15 is as strong as OWASP's N=2^17, p=1. */
  scryptLogN: number;
  inviteTtlHours: number;
  /**
   * Failed sign-ins, counted in the database over `windowMs` (middleware/rate-limit.ts): one address
   * is refused for an account after `perAccountAddress` of them, and for every account after
   * `perAddress`. Past `slowAfter` failures on an account from anywhere, each answer on it waits
   * `delayMs`, doubling with every further failure up to `maxDelayMs`, even for the right password.
   */
  signInLimit: { windowMs: number; perAccountAddress: number; perAddress: number; slowAfter: number; delayMs: number; maxDelayMs: number };
  /** Reset links last `ttlMs`; requests are limited per account and per address over `windowMs`. */
  passwordReset: { ttlMs: number; windowMs: number; perAccount: number; perAddress: number };
  /** Built web app to serve, or null to serve only the API. */
  webDist: string | null;
  /** App processes answering requests (one per CPU, at most four, unless set). */
  processes: number;
}

/** A secret kept in the data folder, so sessions outlive a restart without any set-up. */
function storedSecret(dataDir: string): string {
  const file = join(dataDir, 'session-secret');
  if (existsSync(file)) return readFileSync(file, 'utf8').trim();
  mkdirSync(dataDir, { recursive: true });
  const secret = randomBytes(32).toString('base64url');
  writeFileSync(file, secret, { mode: 0o600 });
  return secret;
}

/** Reads and checks the environment once at start-up; every setting has a default that runs locally. */
export function loadConfig(env: NodeJS.ProcessEnv = process.env): Config {
  const parsed = envSchema.safeParse(env);
  if (!parsed.success) throw new Error(`Bad environment: ${z.prettifyError(parsed.error)}`);
  const e = parsed.data;
  const dataDir = resolve(e.BUSBAR_DATA_DIR);
  const webDist = resolve('dist/web');
  return {
    port: e.PORT,
    dataDir,
    databaseFile: join(dataDir, 'busbar.sqlite'),
    publicUrl: e.PUBLIC_URL ?? `http://localhost:${e.PORT}`,
    publicOrigin: e.PUBLIC_URL ? new URL(e.PUBLIC_URL).origin : null,
    sessionSecret: e.SESSION_SECRET ?? storedSecret(dataDir),
    smtpUrl: e.SMTP_URL ?? null,
    smtpCapturePort: e.SMTP_CAPTURE_PORT,
    mailFrom: e.MAIL_FROM,
    trustProxy: e.TRUST_PROXY === 'true',
    demoData: e.DEMO_DATA === 'true',
    scryptLogN: 15,
    inviteTtlHours: 72,
    signInLimit: { windowMs: 15 * 60_000, perAccountAddress: 10, perAddress: 100, slowAfter: 5, delayMs: 250, maxDelayMs: 4000 },
    passwordReset: { ttlMs: 3_600_000, windowMs: 3_600_000, perAccount: 3, perAddress: 20 },
    webDist: existsSync(join(webDist, 'index.html')) ? webDist : null,
    processes: e.BUSBAR_PROCESSES ?? Math.min(availableParallelism(), 4),
  };
}

/** Settings that start but will not work as meant, said once at start-up. */
export function configWarnings(config: Config): string[] {
  if (!config.publicUrl.startsWith('https://') || config.trustProxy) return [];
  return [
    'PUBLIC_URL is https but TRUST_PROXY is false: unless Busbar itself serves https, no one can sign in. Behind an https proxy, set TRUST_PROXY=true.',
  ];
}
