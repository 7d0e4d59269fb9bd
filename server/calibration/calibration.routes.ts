import { Router } from 'express';
import { createResponseBody, createScreeningBody, createSessionBody, createSpecimenBody, inviteParticipantsBody, userFilterQuery } from '../../shared/api/calibration.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { actorOf, allow, currentUser, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { samplePhoto } from '../photos/photos.js';
import { closeSession, respond } from './calibration-close.js';
import { findSession, loadResults } from './calibration-load.js';
import { certificatePdf } from './certificate-pdf.js';
import { findCertification, listCertifications, listScreenings, listStandings, myResult, recordScreening } from './calibration-records.js';
import { addSpecimen, createSession, inviteParticipants, listSessions, sessionDetail, type PhotoSampler } from './calibration-sessions.js';

/**
 * /api/calibration. Trainers and admins run sessions and read every result; any signed-in user
 * takes part (unless a session is restricted to invited observers), reads their own result once a
 * session closes, and records their own colour-vision screening.
 */
export function calibrationRoutes(ctx: AppContext): Router {
  const router = Router();
  const runs = allow('trainer', 'admin');
  const files = ctx.photos;
  const sample: PhotoSampler = files
    ? async (photoId, region, setId) => labFromTuple((await samplePhoto(ctx.ds, files, (lab, k) => ctx.referenceSets.match(lab, k, setId), photoId, { region })).lab)
    : null;

  router.get('/sessions', signedIn, async (req, res) => {
    res.json(await listSessions(ctx.ds, currentUser(req)));
  });

  router.post('/sessions', runs, async (req, res) => {
    const body = parse(createSessionBody, req.body);
    const created = await createSession(ctx.ds, ctx.referenceSets, { ...actorOf(req), id: currentUser(req).id }, body);
    res.status(201).location(`/api/calibration/sessions/${created.id}`).json(created);
  });

  router.get('/sessions/:id', signedIn, async (req, res) => {
    res.json(await sessionDetail(ctx.ds, currentUser(req), idParam(req.params['id'])));
  });

  router.post('/sessions/:id/specimens', runs, async (req, res) => {
    const id = idParam(req.params['id']);
    const body = parse(createSpecimenBody, req.body);
    res.status(201).json(await addSpecimen(ctx.ds, ctx.referenceSets, sample, actorOf(req), id, body));
  });

  router.post('/sessions/:id/participants', runs, async (req, res) => {
    const id = idParam(req.params['id']);
    const body = parse(inviteParticipantsBody, req.body);
    res.json(await inviteParticipants(ctx.ds, actorOf(req), id, body.userIds, { mailer: ctx.mailer, publicUrl: ctx.publicUrl, logError: ctx.logError }));
  });

  router.post('/sessions/:id/responses', signedIn, async (req, res) => {
    const id = idParam(req.params['id']);
    const body = parse(createResponseBody, req.body);
    const { created, ...answer } = await respond(ctx.ds, ctx.referenceSets, { ...actorOf(req), id: currentUser(req).id }, id, body);
    res.status(created ? 201 : 200).json(answer);
  });

  router.post('/sessions/:id/close', runs, async (req, res) => {
    res.json(await closeSession(ctx.ds, ctx.mailer, ctx.publicUrl, actorOf(req), idParam(req.params['id']), ctx.logError));
  });

  router.get('/sessions/:id/results', runs, async (req, res) => {
    res.json(await loadResults(ctx.ds.manager, await findSession(ctx.ds.manager, idParam(req.params['id']))));
  });

  router.get('/sessions/:id/results/me', signedIn, async (req, res) => {
    res.json(await myResult(ctx.ds, currentUser(req), idParam(req.params['id'])));
  });

  router.get('/certifications', signedIn, async (req, res) => {
    const { userId } = parse(userFilterQuery, req.query, 'query');
    res.json(await listCertifications(ctx.ds, currentUser(req), userId));
  });

  router.get('/certifications/:id/certificate.pdf', signedIn, async (req, res) => {
    const cert = await findCertification(ctx.ds, currentUser(req), idParam(req.params['id']));
    const pdf = await certificatePdf(cert);
    res.setHeader('Content-Disposition', `attachment; filename="hueledger-certificate-${cert.id}.pdf"`);
    res.type('application/pdf').send(pdf);
  });

  router.get('/standings', runs, async (_req, res) => {
    res.json(await listStandings(ctx.ds));
  });

  router.get('/screenings', signedIn, async (req, res) => {
    const { userId } = parse(userFilterQuery, req.query, 'query');
    res.json(await listScreenings(ctx.ds, currentUser(req), userId));
  });

  router.post('/screenings', signedIn, async (req, res) => {
    const body = parse(createScreeningBody, req.body);
    res.status(201).json(await recordScreening(ctx.ds, currentUser(req), actorOf(req), body));
  });

  return router;
}
