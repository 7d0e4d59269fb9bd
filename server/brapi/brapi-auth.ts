import type { RequestHandler } from 'express';
import type { DataSource } from 'typeorm';
import { userOfApiToken } from './api-tokens.js';
import { BrapiError } from './brapi-envelope.js';

/**
 * Lets BrAPI web tools on other origins read with a token (CORS, Fetch Standard §3.2). The origin
 * is "*", which browsers never combine with credentials: a page elsewhere cannot ride on a signed-in
 * person's session cookie, only send a token it was given.
 */
export const crossOrigin: RequestHandler = (req, res, next) => {
  res.setHeader('Access-Control-Allow-Origin', '*');
  if (req.method !== 'OPTIONS') return next();
  res.setHeader('Access-Control-Allow-Methods', 'GET, HEAD');
  res.setHeader('Access-Control-Allow-Headers', 'Authorization, Accept');
  res.setHeader('Access-Control-Max-Age', '600');
  res.status(204).end();
};

/** The interface is read-only: anything but GET (and HEAD, which Express answers from GET) is refused before it is read. */
export const readOnly: RequestHandler = (req, res, next) => {
  if (req.method === 'GET' || req.method === 'HEAD') return next();
  res.setHeader('Allow', 'GET, HEAD, OPTIONS');
  next(new BrapiError(405, `Method ${req.method} is not allowed: this BrAPI interface is read-only`));
};

/**
 * Signs a request in by `Authorization: Bearer <token>` (RFC 6750 §2.1), the way BrAPI clients
 * send their token. A request with the header is judged by the token alone, even if it also
 * carries a session cookie: an unknown, revoked or malformed token is a 401, never a fallback.
 * Without the header, the session (if any) signs the request in as on /api.
 */
export function bearerAuth(ds: DataSource): RequestHandler {
  return async (req, _res, next) => {
    const header = req.get('authorization');
    if (header === undefined) return next();
    const match = /^Bearer ([A-Za-z0-9._~+/=-]{1,200})$/.exec(header.trim());
    if (!match) return next(new BrapiError(401, 'Malformed Authorization header: send "Authorization: Bearer <token>"'));
    const user = await userOfApiToken(ds, match[1]!);
    if (!user) return next(new BrapiError(401, 'Missing or expired authorization token: the token is unknown or has been revoked'));
    req.user = user;
    next();
  };
}
