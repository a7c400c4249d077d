import { randomBytes, scrypt, timingSafeEqual } from 'node:crypto';

const KEY_BYTES = 32;

/**
 * scrypt's block size and parallelism. OWASP's Password Storage Cheat Sheet gives N=2^17, r=8,
 * p=1 and, as equally strong, N=2^15, r=8, p=3 (from memory); the second holds 32 MiB a hash
 * instead of 128 MiB, with the default N of config.ts.
 */
const R = 8;
const P = 3;

/** Hashes computed at once: a burst of sign-ins waits its turn instead of filling memory. */
const AT_ONCE = 2;
let running = 0;
const waiting: (() => void)[] = [];

async function oneAtATime<T>(work: () => Promise<T>): Promise<T> {
  if (running < AT_ONCE) running++;
  else await new Promise<void>((resolve) => waiting.push(resolve)); // a finishing hash hands its turn over
  try {
    return await work();
  } finally {
    const next = waiting.shift();
    if (next) next();
    else running--;
  }
}

function derive(password: string, salt: Buffer, logN: number, r: number, p: number): Promise<Buffer> {
  const N = 2 ** logN;
  return oneAtATime(
    () =>
      new Promise((resolve, reject) =>
        scrypt(password.normalize('NFKC'), salt, KEY_BYTES, { N, r, p, maxmem: 256 * N * r }, (err, key) => (err ? reject(err) : resolve(key))),
      ),
  );
}

/** scrypt (RFC 7914), a memory-hard KDF; the cost travels with the hash so it can be raised later. */
export async function hashPassword(password: string, logN: number): Promise<string> {
  const salt = randomBytes(16);
  const key = await derive(password, salt, logN, R, P);
  return ['scrypt', logN, R, P, salt.toString('base64url'), key.toString('base64url')].join('$');
}

/** Whether a stored hash was made at another cost than today's, and should be made again at the next sign-in. */
export function needsRehash(stored: string, logN: number): boolean {
  return stored.split('$').slice(0, 4).join('$') !== ['scrypt', logN, R, P].join('$');
}

/** A hash no password matches, at today's cost, so refusing an unknown e-mail takes as long as a wrong password. */
export const unmatchableHash = (logN: number) => ['scrypt', logN, R, P, 'A'.repeat(22), 'A'.repeat(43)].join('$');

/** Checks a password in constant time; a malformed hash never matches. */
export async function verifyPassword(password: string, stored: string): Promise<boolean> {
  const [kind, logN, r, p, salt, key] = stored.split('$');
  if (kind !== 'scrypt' || !salt || !key) return false;
  const expected = Buffer.from(key, 'base64url');
  const actual = await derive(password, Buffer.from(salt, 'base64url'), Number(logN), Number(r), Number(p));
  return actual.length === expected.length && timingSafeEqual(actual, expected);
}
