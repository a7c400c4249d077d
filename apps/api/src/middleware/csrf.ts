import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler } from 'express';
import { HttpError } from '../errors.ts';

export const CSRF_COOKIE = 'busbar.csrf';
export const CSRF_HEADER = 'x-csrf-token';
const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

function readCookie(req: Request, name: string): string | undefined {
  for (const part of (req.headers.cookie ?? '').split(';')) {
    const [key, ...value] = part.trim().split('=');
    if (key === name) return decodeURIComponent(value.join('='));
  }
  return undefined;
}

function sameBytes(a: string, b: string): boolean {
  const x = Buffer.from(a);
  const y = Buffer.from(b);
  return x.length === y.length && timingSafeEqual(x, y);
}

/** A signed token: a page on another site can neither read it nor mint one this server accepts. */
function sign(secret: string, nonce: string): string {
  return `${nonce}.${createHmac('sha256', secret).update(nonce).digest('base64url')}`;
}

function isValid(secret: string, token: string | undefined): token is string {
  const nonce = token?.split('.')[0];
  return !!token && !!nonce && sameBytes(token, sign(secret, nonce));
}

/** Origin (or, lacking it, Referer) of a request, when the browser says it came from another site. */
function isCrossSite(req: Request): boolean {
  if (req.get('sec-fetch-site') === 'cross-site') return true;
  const source = req.get('origin') ?? req.get('referer');
  if (!source || source === 'null') return source === 'null';
  try {
    return new URL(source).host !== req.get('host');
  } catch {
    return true;
  }
}

/**
 * Cross-site request forgery defence, signed double-submit (OWASP): every response carries a
 * readable cookie with a signed token, and every state-changing request must echo it in a header
 * and come from this site.
 */
export function csrfProtection(secret: string, secureCookie: boolean): RequestHandler {
  return (req, res, next) => {
    const cookie = readCookie(req, CSRF_COOKIE);
    if (!isValid(secret, cookie)) {
      const token = sign(secret, randomBytes(18).toString('base64url'));
      res.cookie(CSRF_COOKIE, token, { sameSite: 'lax', secure: secureCookie, httpOnly: false, path: '/' });
    }
    if (SAFE_METHODS.has(req.method)) return next();
    const header = req.get(CSRF_HEADER);
    if (isCrossSite(req) || !isValid(secret, cookie) || !header || !sameBytes(header, cookie)) {
      throw new HttpError(403, 'csrf', 'This request did not come from a Busbar page. Reload the page and try again.');
    }
    next();
  };
}
