import type { Request, RequestHandler, Response } from 'express';
import type { DataSource } from 'typeorm';
import { IDEMPOTENCY_HEADER, IDEMPOTENCY_KEY_PATTERN, IDEMPOTENCY_PROBLEMS, REPLAYED_HEADER } from '../../shared/api/idempotency.js';
import type { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import { complete, hashBody, purgeExpiredKeys, release, reserve } from './idempotency.js';

/** How often a process purges expired keys, at most (our own: an indexed delete, once an hour is plenty). */
const PURGE_EVERY_MS = 60 * 60 * 1000;
const lastPurge = new WeakMap<DataSource, number>();

/**
 * Makes a state-changing route safe to resend: with an `Idempotency-Key` header the first request
 * runs and its 2xx JSON answer is stored before it is sent; a resend with the same key and body
 * gets that answer again (header `Idempotent-Replayed: true`) and does nothing; the same key with
 * another body is a 422; a resend while the first still runs is a 409. Keys are per user, so place
 * it after the route's `allow(...)` and after any body parser (multer) so uploaded files count in
 * the body. Without the header the route behaves as it always did.
 *
 * The answer is stored in its own statement right after the work commits, not in the same
 * transaction (the domain functions own their transactions); the reservation row taken first is
 * what keeps concurrent duplicates out. Refusals and failures release the key.
 */
export function idempotent(ctx: { ds: DataSource }): RequestHandler {
  const { ds } = ctx;
  return async (req, res, next) => {
    const key = req.get(IDEMPOTENCY_HEADER);
    const user = req.user as User | undefined;
    if (key === undefined || !user) return next();
    if (!IDEMPOTENCY_KEY_PATTERN.test(key)) {
      throw new AppError(
        400,
        'Bad request',
        `The ${IDEMPOTENCY_HEADER} header must be 1–100 characters of letters, digits, "_" or "-" (a UUID will do).`,
        [{ field: IDEMPOTENCY_HEADER, message: 'not a valid key' }],
        IDEMPOTENCY_PROBLEMS.invalid,
      );
    }
    await purgeNowAndThen(ds);
    const reservation = await reserve(ds, { userId: user.id, key, method: req.method, path: req.originalUrl.split('?')[0]!, bodyHash: hashBody(req.body, uploadedFiles(req)) });
    if (reservation.kind === 'replay') {
      res.set(REPLAYED_HEADER, 'true');
      if (reservation.location) res.location(reservation.location);
      res.status(reservation.status).json(reservation.answer);
      return;
    }
    holdAnswer(ds, res, reservation.id);
    next();
  };
}

/** The bytes of any files multer put on the request, in field order. */
function uploadedFiles(req: Request): Buffer[] {
  const files: Buffer[] = [];
  if (req.file) files.push(req.file.buffer);
  const many = req.files;
  if (Array.isArray(many)) files.push(...many.map((f) => f.buffer));
  else if (many) for (const name of Object.keys(many).sort()) files.push(...many[name]!.map((f) => f.buffer));
  return files;
}

/** Stores a 2xx JSON answer before it leaves (so no client ever holds an answer a resend would not replay); releases the key otherwise. */
function holdAnswer(ds: DataSource, res: Response, id: number): void {
  let settled = false;
  const send = res.json.bind(res);
  res.json = (body?: unknown) => {
    if (settled) return send(body);
    settled = true;
    const status = res.statusCode;
    const location = res.get('Location') ?? null;
    const work = status >= 200 && status < 300 ? complete(ds, id, { status, answer: body ?? null, location }) : release(ds, id);
    work
      .catch((err: unknown) => console.error('idempotency: could not store the answer', err))
      .finally(() => send(body));
    return res;
  };
  // An answer sent without res.json keeps nothing. ('finish', not 'close': when the phone loses
  // the connection mid-request the work still completes and its answer must still be stored.)
  res.on('finish', () => {
    if (settled) return;
    settled = true;
    release(ds, id).catch((err: unknown) => console.error('idempotency: could not release a key', err));
  });
}

async function purgeNowAndThen(ds: DataSource): Promise<void> {
  const now = Date.now();
  if (now - (lastPurge.get(ds) ?? 0) < PURGE_EVERY_MS) return;
  lastPurge.set(ds, now);
  await purgeExpiredKeys(ds, new Date(now));
}
