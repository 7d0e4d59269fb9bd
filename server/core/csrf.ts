import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { RequestHandler } from 'express';
import { AppError } from './app-error.js';

/** Angular HttpClient's own names (angular.dev, "HttpClient security: XSRF/CSRF protection"). */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * Double-submit cookie CSRF protection. The cookie value is `nonce.hmac(nonce)` signed with the
 * session secret, so a cookie planted by another origin does not verify. Every response without
 * a valid cookie gets one; every state-changing request must echo it in `X-XSRF-TOKEN`.
 */
export function csrfProtection(secret: string, secureCookie: boolean): RequestHandler {
  const sign = (nonce: string) => createHmac('sha256', secret).update(nonce).digest('base64url');
  const valid = (token: unknown): token is string => {
    if (typeof token !== 'string') return false;
    const [nonce, mac] = token.split('.');
    if (!nonce || !mac) return false;
    const expected = Buffer.from(sign(nonce));
    const given = Buffer.from(mac);
    return expected.length === given.length && timingSafeEqual(expected, given);
  };

  return (req, res, next) => {
    const cookie = readCookie(req.headers.cookie, CSRF_COOKIE);
    if (!valid(cookie)) {
      const nonce = randomBytes(18).toString('base64url');
      res.cookie(CSRF_COOKIE, `${nonce}.${sign(nonce)}`, { httpOnly: false, sameSite: 'lax', secure: secureCookie, path: '/' });
    }
    if (SAFE_METHODS.has(req.method)) return next();
    const header = req.get(CSRF_HEADER);
    if (!valid(cookie) || header !== cookie) {
      return next(new AppError(403, 'CSRF check failed', `State-changing requests must echo the ${CSRF_COOKIE} cookie in the X-XSRF-TOKEN header.`, undefined, 'csrf'));
    }
    next();
  };
}

function readCookie(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}
