import { Router } from 'express';
import { addPrintPatchesBody, createPrintBatchBody } from '../../shared/api/print-batches.js';
import { actorOf, allow, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { addPrintPatches, createPrintBatch, getPrintBatch, listPrintBatches } from './print-batches.js';

/**
 * /api/print-batches: everyone signed in sees how far each printed card or booklet is from the
 * chips (they compare plants against it); admins record batches and their measured patches.
 */
export function printBatchRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', signedIn, async (_req, res) => {
    res.json(await listPrintBatches(ctx.ds, ctx.referenceSets));
  });

  router.post('/', allow('admin'), async (req, res) => {
    const batch = await createPrintBatch(ctx.ds, ctx.referenceSets, actorOf(req), parse(createPrintBatchBody, req.body));
    res.status(201).location(`/api/print-batches/${batch.id}`).json(batch);
  });

  router.get('/:id', signedIn, async (req, res) => {
    res.json(await getPrintBatch(ctx.ds, ctx.referenceSets, idParam(req.params['id'])));
  });

  router.post('/:id/patches', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.status(201).json(await addPrintPatches(ctx.ds, ctx.referenceSets, actorOf(req), id, parse(addPrintPatchesBody, req.body)));
  });

  return router;
}
