import { Router } from 'express';
import { createUserBody, updateUserBody } from '../../shared/api/auth.js';
import { actorOf, allow } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { createUser, listUsers, updateUser } from './users.js';

/** /api/users (admin only). */
export function userRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', allow('admin'), async (_req, res) => {
    res.json(await listUsers(ctx.ds));
  });

  router.post('/', allow('admin'), async (req, res) => {
    const body = parse(createUserBody, req.body);
    res.status(201).json(await createUser(ctx.ds, actorOf(req), body));
  });

  router.patch('/:id', allow('admin'), async (req, res) => {
    const id = idParam(req.params.id);
    const body = parse(updateUserBody, req.body);
    const { row, endSessions } = await updateUser(ctx.ds, actorOf(req), id, body);
    if (endSessions) await ctx.sessions.destroyForUser(id);
    res.json(row);
  });

  return router;
}
