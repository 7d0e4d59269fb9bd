import { Router } from 'express';
import { createAccessionBody } from '../../shared/api/collection.js';
import { actorOf, allow, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { createAccession, listAccessions, listCharacters, listSites } from './collection.js';

/** /api/sites, /api/characters, /api/accessions: everyone signed in reads, admins write. */
export function collectionRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/sites', signedIn, async (_req, res) => {
    res.json(await listSites(ctx.ds));
  });

  router.get('/characters', signedIn, async (_req, res) => {
    res.json(await listCharacters(ctx.ds));
  });

  router.get('/accessions', signedIn, async (_req, res) => {
    res.json(await listAccessions(ctx.ds));
  });

  router.post('/accessions', allow('admin'), async (req, res) => {
    const body = parse(createAccessionBody, req.body);
    res.status(201).json(await createAccession(ctx.ds, actorOf(req), body));
  });

  return router;
}
