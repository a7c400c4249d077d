import type { RequestHandler } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';

interface Limits {
  windowMs: number;
  perAccount: number;
  perAddress: number;
}

function limiter(windowMs: number, limit: number, key: (req: Parameters<RequestHandler>[0]) => string): RequestHandler {
  return rateLimit({
    windowMs,
    limit,
    // Only failed attempts count, so a busy shop sharing one address is not locked out by success.
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: key,
    handler: (_req, res) => {
      const minutes = Math.ceil(windowMs / 60_000);
      res.status(429).json({
        error: { code: 'too_many_attempts', message: `Too many failed sign-ins. Try again in ${minutes} minutes.` },
      });
    },
  });
}

/** Failed sign-ins limited per address and per account (each key counts separately). */
export function signInLimits(limits: Limits): RequestHandler[] {
  return [
    limiter(limits.windowMs, limits.perAddress, (req) => `address:${ipKeyGenerator(req.ip ?? '')}`),
    limiter(limits.windowMs, limits.perAccount, (req) => {
      const email: unknown = req.body?.email;
      return `account:${typeof email === 'string' ? email.trim().toLowerCase() : ''}`;
    }),
  ];
}
