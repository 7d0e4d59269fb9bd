import { Router } from 'express';
import { driftQuery, siteComparisonQuery } from '../../shared/api/analysis.js';
import { signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { driftAnswer, siteComparisonAnswer } from './drift-query.js';

/** /api/analysis: drift by season and differences by site, read by every signed-in role (issue 6). */
export function analysisRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/drift', signedIn, async (req, res) => {
    res.json(await driftAnswer(ctx.ds, parse(driftQuery, req.query, 'query')));
  });

  router.get('/sites', signedIn, async (req, res) => {
    res.json(await siteComparisonAnswer(ctx.ds, parse(siteComparisonQuery, req.query, 'query')));
  });

  return router;
}
