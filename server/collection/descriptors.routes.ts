import { Router } from 'express';
import { createDescriptorBody, createObservationBody, createObservationsBody, observationQuery, supersedeObservationBody, updateDescriptorBody } from '../../shared/api/descriptors.js';
import { actorOf, allow, currentUser, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { accessionDescriptors } from './descriptor-values.js';
import { createDescriptor, listDescriptors, updateDescriptor } from './descriptors.js';
import { createObservation, createObservations, listObservations, supersedeObservation } from './observations.js';

/** Who may enter and correct observations (the roles that take readings; docs/architecture.md, roles). */
const OBSERVERS = allow('recorder', 'trainer', 'admin');

/**
 * /api/descriptors (all read, admins write), /api/observations (all read; recorders, trainers
 * and admins write), /api/accessions/:id/descriptors (latest values and derived ratios).
 */
export function descriptorRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/descriptors', signedIn, async (_req, res) => {
    res.json(await listDescriptors(ctx.ds));
  });

  router.post('/descriptors', allow('admin'), async (req, res) => {
    res.status(201).json(await createDescriptor(ctx.ds, actorOf(req), parse(createDescriptorBody, req.body)));
  });

  router.patch('/descriptors/:id', allow('admin'), async (req, res) => {
    const id = idParam(req.params['id']);
    res.json(await updateDescriptor(ctx.ds, actorOf(req), id, parse(updateDescriptorBody, req.body)));
  });

  router.get('/observations', signedIn, async (req, res) => {
    res.json(await listObservations(ctx.ds, parse(observationQuery, req.query, 'query')));
  });

  router.post('/observations', OBSERVERS, async (req, res) => {
    res.status(201).json(await createObservation(ctx.ds, actorOf(req), currentUser(req), parse(createObservationBody, req.body)));
  });

  router.post('/observations/batch', OBSERVERS, async (req, res) => {
    res.status(201).json(await createObservations(ctx.ds, actorOf(req), currentUser(req), parse(createObservationsBody, req.body)));
  });

  router.post('/observations/:id/supersede', OBSERVERS, async (req, res) => {
    const id = idParam(req.params['id']);
    res.status(201).json(await supersedeObservation(ctx.ds, actorOf(req), currentUser(req), id, parse(supersedeObservationBody, req.body)));
  });

  router.get('/accessions/:id/descriptors', signedIn, async (req, res) => {
    res.json(await accessionDescriptors(ctx.ds, idParam(req.params['id'])));
  });

  return router;
}
