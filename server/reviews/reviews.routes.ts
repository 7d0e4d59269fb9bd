import { Router } from 'express';
import { bulkApproveBody, reviewBody, reviewQueueQuery } from '../../shared/api/reviews.js';
import { actorOf, allow, currentUser, signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { markNotificationRead, listNotifications } from './notifications.js';
import { bulkApprove, reviewQueue, reviewReading, reviewsOf } from './reviews.js';

const reviewers = allow('reviewer', 'admin');

/** Under /api/readings, beside the readings router: a decision on a reading (reviewers, admins) and its reviews (everyone signed in). */
export function reviewRoutes(ctx: AppContext): Router {
  const router = Router();

  router.post('/:id/review', reviewers, async (req, res) => {
    const id = idParam(req.params['id']);
    const body = parse(reviewBody, req.body);
    res.status(201).json(await reviewReading({ ds: ctx.ds, mailer: ctx.mailer, publicUrl: ctx.publicUrl, logError: ctx.logError }, actorOf(req), currentUser(req), id, body));
  });

  router.get('/:id/reviews', signedIn, async (req, res) => {
    res.json(await reviewsOf(ctx.ds, idParam(req.params['id'])));
  });

  return router;
}

/** /api/reviews: the queue of readings to review (reviewers, admins). */
export function reviewQueueRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/queue', reviewers, async (req, res) => {
    res.json(await reviewQueue(ctx.ds, parse(reviewQueueQuery, req.query, 'query')));
  });

  router.post('/approve', reviewers, async (req, res) => {
    const body = parse(bulkApproveBody, req.body);
    res.json(await bulkApprove(ctx.ds, actorOf(req), currentUser(req), body.ids));
  });

  return router;
}

/** /api/notifications: each signed-in user's own notices. */
export function notificationRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/', signedIn, async (req, res) => {
    res.json(await listNotifications(ctx.ds, currentUser(req).id));
  });

  router.post('/:id/read', signedIn, async (req, res) => {
    const id = idParam(req.params['id']);
    await markNotificationRead(ctx.ds, actorOf(req), currentUser(req).id, id);
    res.status(204).end();
  });

  return router;
}
