import { Router } from 'express';
import { createReadingBody, createReadingsBody, listReadingsQuery, supersedeReadingBody } from '../../shared/api/readings.js';
import { actorOf, allow, currentUser, signedIn } from '../core/access.js';
import { AppError } from '../core/app-error.js';
import type { AppContext } from '../core/context.js';
import { receiveOneFile } from '../core/file-upload.js';
import { idParam, parse } from '../core/validate.js';
import { idempotent } from '../idempotency/idempotent.js';
import { readingsXlsx, writeReadingsCsv } from './reading-export.js';
import { importReadings } from './reading-import.js';
import { getReadingDetail } from './reading-detail.js';
import { listReadings } from './reading-list.js';
import { createReading, createReadings, supersedeReading, type ReadingsDeps } from './readings.js';

/** The multipart field of the import file. */
export const IMPORT_FIELD = 'file';
/** An import file of IMPORT_ROWS_MAX rows is well under this (our own bound). */
const IMPORT_MAX_BYTES = 5 * 1024 * 1024;

/** Those who take readings; reviewers only read. */
const OBSERVERS = allow('recorder', 'trainer', 'admin');

/** The export's file name: the day it was made, so downloads of different days do not collide. */
function exportName(ext: string): string {
  return `readings-${new Date().toISOString().slice(0, 10)}.${ext}`;
}

/**
 * /api/readings. Recorders, trainers and admins take and correct readings (reviewers only read);
 * everyone signed in lists, opens and exports them. The fixed paths come before `/:id`. Photo
 * readings sample the photo under `<dataDir>/photos/` (503 for them without a data folder).
 */
export function readingsRoutes(ctx: AppContext): Router {
  const router = Router();
  const deps: ReadingsDeps = { ds: ctx.ds, referenceSets: ctx.referenceSets, photos: ctx.photos };

  router.get('/', signedIn, async (req, res) => {
    res.json(await listReadings(ctx.ds, parse(listReadingsQuery, req.query, 'query')));
  });

  router.post('/', OBSERVERS, idempotent(ctx), async (req, res) => {
    const reading = await createReading(deps, actorOf(req), currentUser(req), parse(createReadingBody, req.body));
    res.status(201).location(`/api/readings/${reading.id}`).json(reading);
  });

  // Several readings of one plant at once (the colours of a striped region), all or nothing.
  router.post('/batch', OBSERVERS, idempotent(ctx), async (req, res) => {
    res.status(201).json(await createReadings(deps, actorOf(req), currentUser(req), parse(createReadingsBody, req.body)));
  });

  router.get('/export.csv', signedIn, async (req, res) => {
    const q = parse(listReadingsQuery, req.query, 'query');
    res.type('text/csv; charset=utf-8').attachment(exportName('csv'));
    await writeReadingsCsv(ctx.ds, q, ctx.publicUrl, res);
  });

  router.get('/export.xlsx', signedIn, async (req, res) => {
    const q = parse(listReadingsQuery, req.query, 'query');
    const book = await readingsXlsx(ctx.ds, q, ctx.publicUrl);
    res.type('application/vnd.openxmlformats-officedocument.spreadsheetml.sheet').attachment(exportName('xlsx')).send(book);
  });

  router.post('/import', OBSERVERS, receiveFile, async (req, res) => {
    if (!req.file) throw AppError.badRequest(`Send the CSV as multipart/form-data in the field "${IMPORT_FIELD}".`, [{ field: IMPORT_FIELD, message: 'no file' }]);
    res.status(201).json(await importReadings(deps, actorOf(req), currentUser(req), req.file.buffer));
  });

  router.get('/:id', signedIn, async (req, res) => {
    res.json(await getReadingDetail(deps, idParam(req.params['id'])));
  });

  router.post('/:id/supersede', OBSERVERS, idempotent(ctx), async (req, res) => {
    const id = idParam(req.params['id']);
    const reading = await supersedeReading(deps, actorOf(req), currentUser(req), id, parse(supersedeReadingBody, req.body));
    res.status(201).location(`/api/readings/${reading.id}`).json(reading);
  });

  return router;
}

/** One CSV of at most 5 MB; its refusals become problem+json. */
const receiveFile = receiveOneFile({
  field: IMPORT_FIELD,
  maxBytes: IMPORT_MAX_BYTES,
  fields: 2,
  parts: 3,
  what: 'the CSV',
  tooLarge: `The file is larger than ${IMPORT_MAX_BYTES / 1024 / 1024} MB; split it.`,
});
