import { Router, type Response } from 'express';
import { chooseCurrentSetBody, MATCH_K_DEFAULT, matchBody, REFERENCE_SET_ID_PATTERN } from '../../shared/api/reference-sets.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { parseHex } from '../../shared/colour/parse.js';
import { actorOf, allow, signedIn } from '../core/access.js';
import { AppError } from '../core/app-error.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { chipsBody } from './chips-body.js';
import { fineChipBooklet } from './booklet.js';
import { fieldCard } from './field-card.js';

/** A day: a set's chips never change, but a day bounds how long a browser trusts its copy unasked. */
const CHIPS_CACHE_CONTROL = 'private, max-age=86400';

/** A reference-set id from the path; 404 when it cannot be one. */
function setIdParam(value: unknown): string {
  if (typeof value !== 'string' || !REFERENCE_SET_ID_PATTERN.test(value)) throw AppError.notFound('There is no such reference set.');
  return value;
}

/**
 * /api/reference-sets (list, chips, printable card) and /api/match. Every signed-in role may
 * browse, match and download the card: recorders print it for the field as much as admins do.
 */
export function referenceSetRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/reference-sets', signedIn, async (_req, res) => {
    res.json(await ctx.referenceSets.list());
  });

  // Which set is current is an admin's decision, taken once for the whole collection: switching
  // mid-season splits readings across two sets, so it is never automatic.
  router.put('/reference-sets/current', allow('admin'), async (req, res) => {
    const body = parse(chooseCurrentSetBody, req.body);
    await ctx.referenceSets.choose(body.setId, actorOf(req));
    res.json(await ctx.referenceSets.list());
  });

  router.get('/reference-sets/:id/chips', signedIn, async (req, res) => {
    const body = chipsBody(await ctx.referenceSets.get(setIdParam(req.params['id'])));
    const gzip = req.acceptsEncodings('gzip', 'identity') === 'gzip';
    res.vary('Accept-Encoding');
    res.setHeader('Cache-Control', CHIPS_CACHE_CONTROL);
    res.setHeader('ETag', gzip ? body.gzipEtag : body.etag);
    if (req.fresh) {
      res.status(304).end();
      return;
    }
    sendBytes(res, gzip ? body.gzip : body.json, 'application/json; charset=utf-8', gzip ? 'gzip' : null);
  });

  router.get('/reference-sets/:id/card.pdf', signedIn, async (req, res) => {
    const set = await ctx.referenceSets.get(setIdParam(req.params['id']));
    const pdf = await fieldCard(set);
    res.setHeader('Content-Disposition', `attachment; filename="hueledger-field-card-${set.summary.id}.pdf"`);
    res.setHeader('Cache-Control', CHIPS_CACHE_CONTROL);
    sendBytes(res, pdf, 'application/pdf', null);
  });

  router.get('/reference-sets/:id/booklet.pdf', signedIn, async (req, res) => {
    const set = await ctx.referenceSets.get(setIdParam(req.params['id']));
    const pdf = await fineChipBooklet(set);
    res.setHeader('Content-Disposition', `attachment; filename="hueledger-fine-chip-booklet-${set.summary.id}.pdf"`);
    res.setHeader('Cache-Control', CHIPS_CACHE_CONTROL);
    sendBytes(res, pdf, 'application/pdf', null);
  });

  router.post('/match', signedIn, async (req, res) => {
    const body = parse(matchBody, req.body);
    // The schema has checked the hex, so parseHex cannot fail here.
    const lab = body.hex !== undefined ? parseHex(body.hex)! : labFromTuple(body.lab!);
    res.json(await ctx.referenceSets.match(lab, body.k ?? MATCH_K_DEFAULT, body.setId));
  });

  return router;
}

/** Sends prepared bytes as they are (no ETag of Express's own, which would be weak). */
function sendBytes(res: Response, bytes: Buffer, type: string, encoding: 'gzip' | null): void {
  res.setHeader('Content-Type', type);
  if (encoding) res.setHeader('Content-Encoding', encoding);
  res.setHeader('Content-Length', String(bytes.length));
  res.end(bytes);
}
