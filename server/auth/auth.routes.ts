import { Router, type Request } from 'express';
import { ipKeyGenerator, rateLimit } from 'express-rate-limit';
import type { createPassport } from './passport.js';
import { changePasswordBody, confirmResetBody, loginBody, requestResetBody } from '../../shared/api/auth.js';
import { recordAudit } from '../audit/audit.js';
import { actorOf, currentUser, publicRoute, signedIn } from '../core/access.js';
import { AppError } from '../core/app-error.js';
import type { AppContext } from '../core/context.js';
import { renewCsrfToken } from '../core/csrf.js';
import { parse } from '../core/validate.js';
import { changePassword, noteFailedSignIn, noteSignIn } from './accounts.js';
import { confirmPasswordReset, requestPasswordReset } from './password-resets.js';
import { SESSION_COOKIE } from './session-store.js';
import { toSummary, type User } from './user.entity.js';

/** Sign-in failures allowed per address + account in the window (then 429). */
export const SIGN_IN_LIMIT = 10;
export const SIGN_IN_WINDOW_MS = 15 * 60 * 1000;

/** /api/auth: sign in and out, who am I, change password, reset by mail. */
export function authRoutes(ctx: AppContext, passport: ReturnType<typeof createPassport>): Router {
  const router = Router();
  const signInLimiter = rateLimit({
    windowMs: SIGN_IN_WINDOW_MS,
    limit: SIGN_IN_LIMIT,
    skipSuccessfulRequests: true,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    // Normalised as loginBody does, so spacing or case variants of one address share one count.
    keyGenerator: (req) => `${ipKeyGenerator(req.ip ?? '')}|${String((req.body as { email?: unknown })?.email ?? '').trim().toLowerCase()}`,
    handler: (_req, _res, next) =>
      next(new AppError(429, 'Too many sign-in attempts', 'Too many failed sign-ins for this account from here. Wait 15 minutes or reset the password.')),
  });
  const resetLimiter = rateLimit({
    windowMs: SIGN_IN_WINDOW_MS,
    limit: 5,
    standardHeaders: 'draft-8',
    legacyHeaders: false,
    keyGenerator: (req) => ipKeyGenerator(req.ip ?? ''),
    handler: (_req, _res, next) => next(new AppError(429, 'Too many requests', 'Too many reset requests from here; wait 15 minutes.')),
  });

  router.post('/login', publicRoute, signInLimiter, async (req, res) => {
    const body = parse(loginBody, req.body);
    req.body = body;
    const user = await new Promise<User | false>((resolve, reject) =>
      passport.authenticate('local', { session: false }, (err: unknown, u: User | false) => (err ? reject(err) : resolve(u)))(req, res, reject),
    );
    if (!user) {
      await noteFailedSignIn(ctx.ds, body.email, req.ip ?? null, 'bad credentials or inactive');
      throw AppError.unauthorized('The e-mail or password is not right.');
    }
    // req.login regenerates the session (passport 0.6+), so a pre-sign-in session id is never reused.
    await new Promise<void>((resolve, reject) => req.login(user, (err) => (err ? reject(err) : resolve())));
    await noteSignIn(ctx.ds, user, req.ip ?? null);
    renewCsrfToken(res);
    res.json({ user: toSummary(user) });
  });

  router.post('/logout', publicRoute, async (req, res) => {
    const user = req.user as User | undefined;
    await new Promise<void>((resolve, reject) => req.logout((err) => (err ? reject(err) : resolve())));
    await new Promise<void>((resolve) => req.session.destroy(() => resolve()));
    if (user) await recordAudit(ctx.ds.manager, { id: user.id, email: user.email, ip: req.ip ?? null }, 'auth.sign-out', `user:${user.id}`);
    renewCsrfToken(res);
    res.clearCookie(SESSION_COOKIE, { path: '/' }).status(204).end();
  });

  router.get('/me', signedIn, (req, res) => {
    res.json({ user: toSummary(currentUser(req)) });
  });

  router.post('/password', signedIn, async (req: Request, res) => {
    const body = parse(changePasswordBody, req.body);
    const user = currentUser(req);
    await changePassword(ctx.ds, { ...actorOf(req), id: user.id }, body.currentPassword, body.newPassword);
    await ctx.sessions.destroyForUser(user.id, req.sessionID);
    res.status(204).end();
  });

  router.post('/password-reset', publicRoute, resetLimiter, async (req, res) => {
    const body = parse(requestResetBody, req.body);
    await requestPasswordReset(ctx.ds, ctx.mailer, ctx.publicUrl, body.email, req.ip ?? null);
    res.status(202).json({ detail: 'If that address has an account, a reset link is on its way.' });
  });

  router.post('/password-reset/confirm', publicRoute, async (req, res) => {
    const body = parse(confirmResetBody, req.body);
    const user = await confirmPasswordReset(ctx.ds, body.token, body.password, req.ip ?? null);
    await ctx.sessions.destroyForUser(user.id);
    res.status(204).end();
  });

  return router;
}
