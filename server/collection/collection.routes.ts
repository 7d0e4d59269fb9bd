import { Router } from 'express';
import {
  createAccessionBody,
  createCharacterBody,
  createPlantBody,
  createSiteBody,
  replaceSeasonsBody,
  updateAccessionBody,
  updateCharacterBody,
  updatePlantBody,
  updateSiteBody,
} from '../../shared/api/collection.js';
import { actorOf, allow, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { createPlant, getAccession, updateAccession, updatePlant } from './accessions.js';
import { createCharacter, updateCharacter } from './characters.js';
import { createAccession, listAccessions, listCharacters, listSites } from './collection.js';
import { noQuery } from '../../shared/api/profile.js';
import { mcpdCsv } from './mcpd-export.js';
import { createSite, replaceSeasons, updateSite } from './sites.js';

/** /api/sites, /api/characters, /api/accessions, /api/plants: everyone signed in reads, admins write. */
export function collectionRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/sites', signedIn, async (_req, res) => {
    res.json(await listSites(ctx.ds));
  });

  router.post('/sites', allow('admin'), async (req, res) => {
    res.status(201).json(await createSite(ctx.ds, actorOf(req), parse(createSiteBody, req.body)));
  });

  router.patch('/sites/:id', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await updateSite(ctx.ds, actorOf(req), id, parse(updateSiteBody, req.body)));
  });

  router.put('/sites/:id/seasons', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await replaceSeasons(ctx.ds, actorOf(req), id, parse(replaceSeasonsBody, req.body)));
  });

  router.get('/characters', signedIn, async (_req, res) => {
    res.json(await listCharacters(ctx.ds));
  });

  router.post('/characters', allow('admin'), async (req, res) => {
    res.status(201).json(await createCharacter(ctx.ds, actorOf(req), parse(createCharacterBody, req.body)));
  });

  router.patch('/characters/:id', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await updateCharacter(ctx.ds, actorOf(req), id, parse(updateCharacterBody, req.body)));
  });

  router.get('/accessions', signedIn, async (_req, res) => {
    res.json(await listAccessions(ctx.ds));
  });

  router.post('/accessions', allow('admin'), async (req, res) => {
    const body = parse(createAccessionBody, req.body);
    res.status(201).json(await createAccession(ctx.ds, actorOf(req), body));
  });

  // Fixed paths before `/accessions/:id`, or ":id" would swallow them.
  router.get('/accessions/mcpd.csv', signedIn, async (req, res) => {
    parse(noQuery, req.query, 'query');
    const csv = await mcpdCsv(ctx.ds);
    res.setHeader('Content-Disposition', `attachment; filename="accessions-mcpd-${new Date().toISOString().slice(0, 10)}.csv"`);
    res.type('text/csv; charset=utf-8').send(csv);
  });

  router.get('/accessions/:id', signedIn, async (req, res) => {
    res.json(await getAccession(ctx.ds, idParam(req.params['id'])));
  });

  router.patch('/accessions/:id', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await updateAccession(ctx.ds, actorOf(req), id, parse(updateAccessionBody, req.body)));
  });

  router.post('/accessions/:id/plants', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.status(201).json(await createPlant(ctx.ds, actorOf(req), id, parse(createPlantBody, req.body)));
  });

  router.patch('/plants/:id', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await updatePlant(ctx.ds, actorOf(req), id, parse(updatePlantBody, req.body)));
  });

  return router;
}
