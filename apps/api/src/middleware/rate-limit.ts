import { setTimeout as sleep } from 'node:timers/promises';
import type { Db } from '@busbar/db';
import type { Request, Response } from 'express';
import { ipKeyGenerator } from 'express-rate-limit';
import type { Config } from '../config.ts';
import { HttpError } from '../errors.ts';
import { clearAttempts, countAttempts, limitReachedAt, recordAttempt } from '../queries/sign-in-attempts.ts';

type Limits = Config['signInLimit'];
/** What a failure just locked: this address for this account, or this address for every account. */
export type Lockout = 'account_address' | 'address';

/** The address attempts are counted by: an IPv6 address as its /56 network, which one client usually holds whole. */
export const addressKey = (req: Request) => ipKeyGenerator(req.ip ?? '');

/** The wait before answering on an account with `failures` recent failures: none up to `slowAfter`, then doubling to the cap. */
export function signInDelayMs(failures: number, limits: Limits): number {
  if (failures <= limits.slowAfter) return 0;
  return Math.min(limits.maxDelayMs, limits.delayMs * 2 ** (failures - limits.slowAfter - 1));
}

/** 429 with Retry-After, in words. */
export function tooMany(res: Response, retryAfterS: number, what: string): HttpError {
  res.setHeader('Retry-After', String(retryAfterS));
  const minutes = Math.ceil(retryAfterS / 60);
  return new HttpError(429, 'too_many_attempts', `Too many ${what} from here. Try again in ${minutes} minute${minutes === 1 ? '' : 's'}.`);
}

/**
 * Failed sign-ins counted in the database (so every app process counts the same ones) per account
 * and address and per address. A stranger's failures lock out only the stranger's address; on the
 * account itself they only slow the answers, so its owner still signs in from anywhere else.
 */
export function signInLimiter(db: Db, limits: Limits, now: () => Date) {
  const since = () => new Date(now().getTime() - limits.windowMs).toISOString();

  return {
    /** Refuses an address locked out for this account or for all; otherwise waits the account's delay. */
    async admit(email: string, req: Request, res: Response): Promise<void> {
      const address = addressKey(req);
      const from = since();
      const reached = [
        await limitReachedAt(db, 'sign_in', from, { email, address }, limits.perAccountAddress),
        await limitReachedAt(db, 'sign_in', from, { address }, limits.perAddress),
      ].filter((at) => at !== null);
      if (reached.length > 0) {
        const until = Math.max(...reached.map((at) => Date.parse(at) + limits.windowMs));
        throw tooMany(res, Math.ceil((until - now().getTime()) / 1000), 'failed sign-ins');
      }
      const delayMs = signInDelayMs(await countAttempts(db, 'sign_in', from, { email }), limits);
      if (delayMs > 0) await sleep(delayMs);
    },

    /** Counts a failure; answers what it has just locked, if anything (each lock-out is answered once). */
    async fail(email: string, req: Request): Promise<Lockout | null> {
      const address = addressKey(req);
      const from = since();
      await recordAttempt(db, { kind: 'sign_in', email, address, at: now().toISOString() }, from);
      if ((await countAttempts(db, 'sign_in', from, { email, address })) === limits.perAccountAddress) return 'account_address';
      if ((await countAttempts(db, 'sign_in', from, { address })) === limits.perAddress) return 'address';
      return null;
    },

    /** A sign-in from this address succeeded: its earlier failures on this account are forgiven. */
    succeed: (email: string, req: Request) => clearAttempts(db, 'sign_in', { email, address: addressKey(req) }),
  };
}

export type SignInLimiter = ReturnType<typeof signInLimiter>;
