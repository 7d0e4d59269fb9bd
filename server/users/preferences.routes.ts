import { Router } from 'express';
import { preferencesBody, type Preferences } from '../../shared/api/preferences.js';
import { recordAudit } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { actorOf, currentUser, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';

/** /api/account/preferences: each signed-in person reads and sets their own. */
export function preferenceRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/preferences', signedIn, async (req, res) => {
    const user = await ctx.ds.getRepository(User).findOneByOrFail({ id: currentUser(req).id });
    res.json({ unitSystem: user.unitSystem } satisfies Preferences);
  });

  router.put('/preferences', signedIn, async (req, res) => {
    const body = parse(preferencesBody, req.body);
    const id = currentUser(req).id;
    await ctx.ds.transaction(async (m) => {
      const user = await m.findOneByOrFail(User, { id });
      if (user.unitSystem === body.unitSystem) return;
      await m.update(User, { id }, { unitSystem: body.unitSystem });
      await recordAudit(m, actorOf(req), 'user.preferences', `user:${id}`, { unitSystem: { from: user.unitSystem, to: body.unitSystem } });
    });
    res.json({ unitSystem: body.unitSystem } satisfies Preferences);
  });

  return router;
}
