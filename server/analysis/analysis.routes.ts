import { Router } from 'express';
import { driftOverviewQuery, driftQuery, siteComparisonQuery } from '../../shared/api/analysis.js';
import { signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { DriftOverview } from './drift-overview.js';
import { DriftPool } from './drift-pool.js';
import { driftAnswer, siteComparisonAnswer } from './drift-query.js';

/** /api/analysis: drift by season and differences by site (issue 6), and the overview of every flagged pair (issue 14); read by every signed-in role. */
export function analysisRoutes(ctx: AppContext): Router {
  const router = Router();
  const overview = new DriftOverview(ctx.ds, new DriftPool());

  router.get('/overview', signedIn, async (req, res) => {
    parse(driftOverviewQuery, req.query, 'query');
    res.json(await overview.answer());
  });

  router.get('/drift', signedIn, async (req, res) => {
    res.json(await driftAnswer(ctx.ds, parse(driftQuery, req.query, 'query')));
  });

  router.get('/sites', signedIn, async (req, res) => {
    res.json(await siteComparisonAnswer(ctx.ds, parse(siteComparisonQuery, req.query, 'query')));
  });

  return router;
}
