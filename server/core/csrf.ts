import { createHmac, randomBytes, timingSafeEqual } from 'node:crypto';
import type { Request, RequestHandler, Response } from 'express';
import { AppError } from './app-error.js';

/** Angular HttpClient's own names (angular.dev, "HttpClient security: XSRF/CSRF protection"). */
export const CSRF_COOKIE = 'XSRF-TOKEN';
export const CSRF_HEADER = 'x-xsrf-token';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/** The binding of a token handed out to a visitor who is not signed in. */
const ANONYMOUS = 'anon';

/** Where the middleware leaves the function that hands out a fresh token, for routes that change the session. */
const RENEW = 'hueledgerRenewCsrf';

/**
 * Double-submit cookie CSRF protection, bound to the session. A token is
 * `nonce.binding.hmac(nonce.binding)` signed with the session secret, so a cookie planted by
 * another origin does not verify; `binding` names the signed-in session it was issued to (an HMAC
 * of the session id) or `anon`. A signed-in request needs a token of its own session, so a token
 * fetched before signing in, or in another session, is refused; a request that is not signed in
 * takes any token the server signed (its session may just have expired, and the route then says
 * 401). Every response without a token fitting its session gets one; every state-changing request
 * must echo the cookie in `X-XSRF-TOKEN`.
 */
export function csrfProtection(secret: string, secureCookie: boolean): RequestHandler {
  const mac = (payload: string) => createHmac('sha256', secret).update(payload).digest('base64url');
  const bindingOf = (req: Request) => (req.user && req.sessionID ? mac(`session:${req.sessionID}`).slice(0, 22) : ANONYMOUS);
  const verifiedBinding = (token: unknown): string | null => {
    if (typeof token !== 'string') return null;
    const [nonce, binding, given, ...rest] = token.split('.');
    if (!nonce || !binding || !given || rest.length) return null;
    const expected = Buffer.from(mac(`${nonce}.${binding}`));
    const actual = Buffer.from(given);
    return expected.length === actual.length && timingSafeEqual(expected, actual) ? binding : null;
  };
  const fits = (req: Request, token: unknown): boolean => {
    const binding = verifiedBinding(token);
    return binding !== null && (!req.user || binding === bindingOf(req));
  };
  const issue = (req: Request, res: Response) => {
    const nonce = randomBytes(18).toString('base64url');
    const binding = bindingOf(req);
    res.cookie(CSRF_COOKIE, `${nonce}.${binding}.${mac(`${nonce}.${binding}`)}`, { httpOnly: false, sameSite: 'lax', secure: secureCookie, path: '/' });
  };

  return (req, res, next) => {
    const cookie = readCookie(req.headers.cookie, CSRF_COOKIE);
    const fitting = fits(req, cookie);
    if (!fitting) issue(req, res);
    res.locals[RENEW] = () => issue(req, res);
    if (SAFE_METHODS.has(req.method)) return next();
    const header = req.get(CSRF_HEADER);
    if (!fitting || header !== cookie) {
      return next(new AppError(403, 'CSRF check failed', `State-changing requests must echo the ${CSRF_COOKIE} cookie in the X-XSRF-TOKEN header.`, undefined, 'csrf'));
    }
    next();
  };
}

/** Hands out a fresh token bound to the request's session as it is now: call after signing in or out. */
export function renewCsrfToken(res: Response): void {
  (res.locals[RENEW] as (() => void) | undefined)?.();
}

function readCookie(header: string | undefined, name: string): string | undefined {
  if (!header) return undefined;
  for (const part of header.split(';')) {
    const eq = part.indexOf('=');
    if (eq > 0 && part.slice(0, eq).trim() === name) return decodeURIComponent(part.slice(eq + 1).trim());
  }
  return undefined;
}
