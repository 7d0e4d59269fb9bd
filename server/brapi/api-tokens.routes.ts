import { Router } from 'express';
import { createApiTokenBody } from '../../shared/api/api-tokens.js';
import { actorOf, allow } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { issueApiToken, listApiTokens, revokeApiToken } from './api-tokens.js';

/** /api/api-tokens (admin only): issue, list and revoke the tokens BrAPI clients sign in with. */
export function apiTokenRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', allow('admin'), async (_req, res) => {
    res.json(await listApiTokens(ctx.ds));
  });

  router.post('/', allow('admin'), async (req, res) => {
    const body = parse(createApiTokenBody, req.body);
    // The token is in this answer only: never cache it.
    res.setHeader('Cache-Control', 'no-store');
    res.status(201).json(await issueApiToken(ctx.ds, actorOf(req), body));
  });

  router.post('/:id/revoke', allow('admin'), async (req, res) => {
    res.json(await revokeApiToken(ctx.ds, actorOf(req), idParam(req.params.id)));
  });

  return router;
}
