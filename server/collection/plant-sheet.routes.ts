import { Router } from 'express';
import { createSkipBody, labelsQuery, progressQuery, walkOrderBody } from '../../shared/api/plant-sheet.js';
import { labelPlants, renderPlantLabels } from './plant-labels.js';
import { actorOf, allow, currentUser, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { accessionProgress, collectionProgress, createSkip, plantSheet } from './plant-sheet.js';
import { setWalkOrder, walkOrder } from './walk-order-admin.js';

/** Who may set a character aside for a plant: the roles that take readings. */
const OBSERVERS = allow('recorder', 'trainer', 'admin');

/**
 * /api/plants/:id/sheet and skips, /api/accessions/:id/progress, /api/progress (everyone signed in
 * reads), and /api/catalogue/order (everyone reads, admins change).
 */
export function plantSheetRoutes(ctx: AppContext): Router {
  const router = Router();

  // A fixed path before `/plants/:id/…`.
  router.get('/plants/labels.pdf', signedIn, async (req, res) => {
    const q = parse(labelsQuery, req.query, 'query');
    const plants = await labelPlants(ctx.ds, q.accessionId !== undefined ? { accessionId: q.accessionId } : { siteId: q.siteId! });
    const pdf = await renderPlantLabels(plants, ctx.publicUrl);
    const name = q.accessionId !== undefined ? plants[0]!.accessionNumber : plants[0]!.siteCode;
    res.setHeader('Content-Disposition', `attachment; filename="hueledger-plant-labels-${name.replace(/[^A-Za-z0-9-]/g, '_')}.pdf"`);
    res.type('application/pdf').send(pdf);
  });

  router.get('/plants/:id/sheet', signedIn, async (req, res) => {
    res.json(await plantSheet(ctx.ds, idParam(req.params['id'])));
  });

  router.post('/plants/:id/skips', OBSERVERS, async (req, res) => {
    const id = idParam(req.params['id']);
    res.status(201).json(await createSkip(ctx.ds, actorOf(req), currentUser(req), id, parse(createSkipBody, req.body)));
  });

  router.get('/accessions/:id/progress', signedIn, async (req, res) => {
    res.json(await accessionProgress(ctx.ds, idParam(req.params['id'])));
  });

  router.get('/progress', signedIn, async (req, res) => {
    res.json(await collectionProgress(ctx.ds, parse(progressQuery, req.query, 'query')));
  });

  router.get('/catalogue/order', signedIn, async (_req, res) => {
    res.json(await walkOrder(ctx.ds));
  });

  router.put('/catalogue/order', allow('admin'), async (req, res) => {
    res.json(await setWalkOrder(ctx.ds, actorOf(req), parse(walkOrderBody, req.body)));
  });

  return router;
}
