import { Router } from 'express';
import { acceptInvitationBody, inviteBody } from '../../shared/api/auth.js';
import { actorOf, allow, currentUser, publicRoute } from '../core/access.js';
import { AppError } from '../core/app-error.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { acceptInvitation, invite, listInvitations, viewInvitation } from './invitations.js';
import { toSummary } from './user.entity.js';

/** /api/invitations: admins invite; the invitee's link opens the public token routes. */
export function invitationRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', allow('admin'), async (_req, res) => {
    res.json(await listInvitations(ctx.ds));
  });

  router.post('/', allow('admin'), async (req, res) => {
    const body = parse(inviteBody, req.body);
    const row = await invite(ctx.ds, ctx.mailer, ctx.publicUrl, { ...actorOf(req), id: currentUser(req).id }, body);
    res.status(201).json(row);
  });

  router.post('/accept', publicRoute, async (req, res) => {
    const body = parse(acceptInvitationBody, req.body);
    const user = await acceptInvitation(ctx.ds, req.ip ?? null, body);
    res.status(201).json({ user: toSummary(user) });
  });

  router.get('/:token', publicRoute, async (req, res) => {
    const token = String(req.params.token);
    if (!/^[A-Za-z0-9_-]{20,100}$/.test(token)) throw AppError.notFound('This invitation link is not known.');
    res.json(await viewInvitation(ctx.ds, token));
  });

  return router;
}
