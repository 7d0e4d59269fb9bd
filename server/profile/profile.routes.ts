import { Router } from 'express';
import { duplicatesQuery, noQuery, profileQuery, similarQuery } from '../../shared/api/profile.js';
import { signedIn } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { idParam, parse } from '../core/validate.js';
import { characterisationXlsx } from './characterisation-xlsx.js';
import { accessionProfile } from './profile.js';
import { profilePdf } from './profile-pdf.js';
import { possibleDuplicates, similarAccessions } from './similar.js';

/**
 * The characterisation of accessions (issue 14): every signed-in role reads a record, since
 * recorders, reviewers, trainers and admins all need to know what colour a variety is. Mounted
 * before the collection routes, so fixed paths under /accessions are not read as an id.
 */
export function profileRoutes(ctx: AppContext): Router {
  const router = Router();

  router.get('/accessions/:id/profile', signedIn, async (req, res) => {
    const id = idParam(req.params['id']);
    const q = parse(profileQuery, req.query, 'query');
    res.json(await accessionProfile(ctx, id, q.setId));
  });

  router.get('/accessions/characterisation.xlsx', signedIn, async (req, res) => {
    parse(noQuery, req.query, 'query');
    const book = await characterisationXlsx(ctx);
    res.type('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet').attachment(`characterisation-${new Date().toISOString().slice(0, 10)}.xlsx`).send(book);
  });

  router.get('/accessions/:id/profile.pdf', signedIn, async (req, res) => {
    const id = idParam(req.params['id']);
    const q = parse(profileQuery, req.query, 'query');
    const profile = await accessionProfile(ctx, id, q.setId);
    const pdf = await profilePdf(profile);
    // The accession number may hold any character an admin typed; the file name keeps letters, digits and hyphens.
    res.type('application/pdf').attachment(`characterisation-${profile.accessionNumber.replace(/[^A-Za-z0-9-]+/g, '_')}.pdf`).send(pdf);
  });

  router.get('/accessions/duplicates', signedIn, async (req, res) => {
    const q = parse(duplicatesQuery, req.query, 'query');
    res.json(await possibleDuplicates(ctx.ds, q.minShared));
  });

  router.get('/accessions/:id/similar', signedIn, async (req, res) => {
    const id = idParam(req.params['id']);
    const q = parse(similarQuery, req.query, 'query');
    res.json(await similarAccessions(ctx.ds, id, q.limit, q.minShared));
  });

  return router;
}
