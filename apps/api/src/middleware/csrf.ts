import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
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

/**
 * What a token is bound to: the signed-in session's id, or, before sign-in, nothing but the
 * browser's own random nonce. A token of one session is refused in any other, and a signed-in
 * request refuses a token made before sign-in.
 */
function bindingOf(req: Request): string {
  return req.session?.userId === undefined ? 'before-sign-in' : `session:${req.sessionID}`;
}

/** A signed token: a page on another site can neither read it nor mint one this server accepts. */
function sign(secret: string, binding: string, nonce: string): string {
  return `${nonce}.${createHmac('sha256', secret).update(`${binding}\n${nonce}`).digest('base64url')}`;
}

function isValid(secret: string, binding: string, token: string | undefined): token is string {
  const nonce = token?.split('.')[0];
  return !!token && !!nonce && sameBytes(token, sign(secret, binding, nonce));
}

/**
 * Whether the browser says the request came from elsewhere: Origin (or, lacking it, Referer) must
 * be the configured public address when there is one (behind a proxy the Host header may be an
 * internal name), else name the same host the request was sent to.
 */
function isCrossSite(req: Request, publicOrigin: string | null): boolean {
  if (req.get('sec-fetch-site') === 'cross-site') return true;
  const source = req.get('origin') || req.get('referer');
  if (!source || source === 'null') return source === 'null';
  try {
    const url = new URL(source);
    return publicOrigin ? url.origin !== publicOrigin : url.host !== req.get('host');
  } catch {
    return true;
  }
}

/** Runs `step` just before the status line and headers go out, when sign-in or sign-out has settled the session. */
function beforeHeaders(res: Response, step: () => void): void {
  const writeHead = res.writeHead.bind(res) as (...args: unknown[]) => Response;
  res.writeHead = ((...args: unknown[]) => {
    step();
    return writeHead(...args);
  }) as Response['writeHead'];
}

/**
 * Cross-site request forgery defence, signed double-submit (OWASP) bound to the session: every
 * response whose browser lacks a token valid for the session as it now stands (after a sign-in
 * regenerated it, a sign-out ended it, or it expired) carries a fresh one in a readable cookie, and
 * every state-changing request must echo it in a header and come from this site.
 */
export function csrfProtection(secret: string, secureCookie: boolean, publicOrigin: string | null): RequestHandler {
  return (req, res, next) => {
    const cookie = readCookie(req, CSRF_COOKIE);
    beforeHeaders(res, () => {
      const binding = bindingOf(req);
      if (isValid(secret, binding, cookie)) return;
      const token = sign(secret, binding, randomBytes(18).toString('base64url'));
      res.cookie(CSRF_COOKIE, token, { sameSite: 'lax', secure: secureCookie, httpOnly: false, path: '/' });
    });
    if (SAFE_METHODS.has(req.method)) return next();
    const header = req.get(CSRF_HEADER);
    if (isCrossSite(req, publicOrigin) || !isValid(secret, bindingOf(req), cookie) || !header || !sameBytes(header, cookie)) {
      throw new HttpError(403, 'csrf', 'This request did not come from a Busbar page. Reload the page and try again.');
    }
    next();
  };
}
