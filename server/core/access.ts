import type { Request, RequestHandler } from 'express';
import { ROLES, type Role } from '../../shared/api/auth.js';
import type { Actor } from '../audit/audit.js';
import type { User } from '../auth/user.entity.js';
import { AppError } from './app-error.js';

/** Whom a route admits; read back by the route audit, which walks the router stack. */
export type AccessRule = { public: true } | { public: false; roles: readonly Role[] };

/** Symbol under which each access middleware carries its rule. */
export const ACCESS = Symbol('hueledger.access');

type Tagged = RequestHandler & { [ACCESS]?: AccessRule };

/** Admits only signed-in, active users whose role is listed: 401 when signed out, 403 otherwise. */
export function allow(...roles: Role[]): RequestHandler {
  const handler: Tagged = (req, _res, next) => {
    const user = req.user as User | undefined;
    if (!user) return next(AppError.unauthorized());
    if (!roles.includes(user.role)) return next(AppError.forbidden(`This needs the role ${roles.join(' or ')}.`));
    next();
  };
  handler[ACCESS] = { public: false, roles };
  return handler;
}

/** Every role. */
export const signedIn: RequestHandler = allow(...ROLES);

/** Marks a route as open to anyone (health, sign-in, token links). */
export const publicRoute: RequestHandler = Object.assign<RequestHandler, { [ACCESS]: AccessRule }>(
  (_req, _res, next) => next(),
  { [ACCESS]: { public: true } },
);

/** The access rule of a middleware, if it is one of ours. */
export function accessRuleOf(fn: unknown): AccessRule | undefined {
  return (fn as Tagged | undefined)?.[ACCESS];
}

/** The signed-in user; only call behind `allow()`. */
export function currentUser(req: Request): User {
  const user = req.user as User | undefined;
  if (!user) throw AppError.unauthorized();
  return user;
}

/** The request's actor for audit events. */
export function actorOf(req: Request): Actor {
  const user = req.user as User | undefined;
  return { id: user?.id ?? null, email: user?.email ?? null, ip: req.ip ?? null };
}
