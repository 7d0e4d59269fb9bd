import { createHash } from 'node:crypto';
import { IsNull, LessThan, type DataSource } from 'typeorm';
import { IDEMPOTENCY_HEADER, IDEMPOTENCY_KEY_DAYS, IDEMPOTENCY_PROBLEMS } from '../../shared/api/idempotency.js';
import { AppError } from '../core/app-error.js';
import { IdempotencyKey } from './idempotency-key.entity.js';

/** What identifies one keyed request. */
export interface KeyedRequest {
  userId: number;
  key: string;
  method: string;
  path: string;
  bodyHash: string;
}

/** A stored answer to replay. */
export interface StoredAnswer {
  status: number;
  answer: unknown;
  location: string | null;
}

/** What to do with a keyed request: run it (holding reservation `id`), or replay the stored answer. */
export type Reservation = { kind: 'run'; id: number } | ({ kind: 'replay' } & StoredAnswer);

/**
 * A reservation older than this whose request never finished was cut short (the process stopped
 * between the work and storing its answer, or the answer was lost); a resend may then run again.
 * Our own choice: far longer than any request here takes (a 25 MB photo upload on a slow link).
 */
export const ABANDONED_AFTER_MS = 10 * 60 * 1000;

const DAY_MS = 24 * 60 * 60 * 1000;

/** SHA-256 of a JSON body in canonical form (keys sorted at every level) and of each file's bytes, in order. */
export function hashBody(body: unknown, files: readonly Buffer[] = []): string {
  const hash = createHash('sha256').update(canonicalJson(body ?? null));
  for (const file of files) hash.update('\0file:').update(createHash('sha256').update(file).digest('hex'));
  return hash.digest('hex');
}

function canonicalJson(value: unknown): string {
  if (Array.isArray(value)) return `[${value.map(canonicalJson).join(',')}]`;
  if (value && typeof value === 'object') {
    const entries = Object.entries(value as Record<string, unknown>)
      .filter(([, v]) => v !== undefined)
      .sort(([a], [b]) => (a < b ? -1 : a > b ? 1 : 0));
    return `{${entries.map(([k, v]) => `${JSON.stringify(k)}:${canonicalJson(v)}`).join(',')}}`;
  }
  return JSON.stringify(value) ?? 'null';
}

/**
 * Claims the key for this request. The unique (user, key) index makes the claim atomic: of many
 * identical requests at once exactly one runs; the others see it running (409) or, once it has
 * finished, get its stored answer. The same key with another body or route is refused (422).
 */
export async function reserve(ds: DataSource, req: KeyedRequest, now = new Date()): Promise<Reservation> {
  const repo = ds.getRepository(IdempotencyKey);
  for (let attempt = 0; attempt < 3; attempt++) {
    // INSERT OR IGNORE … RETURNING: one statement decides who runs, and a lost race is an empty
    // answer rather than a constraint error (which TypeORM would log as a failed query).
    const [sql, params] = repo.createQueryBuilder().insert().values({ ...req, status: null, location: null, createdAt: now }).orIgnore().getQueryAndParameters();
    const inserted = (await ds.query(`${sql} RETURNING "id"`, params)) as { id: number }[];
    if (inserted[0]) return { kind: 'run', id: inserted[0].id };
    const existing = await repo.findOneBy({ userId: req.userId, key: req.key });
    if (!existing) continue; // released (the first request failed) between our insert and this read: claim again
    if (existing.bodyHash !== req.bodyHash || existing.method !== req.method || existing.path !== req.path) {
      throw new AppError(
        422,
        'Idempotency key reused',
        `The ${IDEMPOTENCY_HEADER} "${req.key}" was already used for a different request (${existing.method} ${existing.path} with another body). Use a new key for a new request.`,
        [{ field: IDEMPOTENCY_HEADER, message: 'already used for a different request' }],
        IDEMPOTENCY_PROBLEMS.reused,
      );
    }
    if (existing.status !== null) return { kind: 'replay', status: existing.status, answer: existing.answer, location: existing.location };
    if (now.getTime() - existing.createdAt.getTime() > ABANDONED_AFTER_MS) {
      await repo.delete({ id: existing.id, status: IsNull() });
      continue;
    }
    throw new AppError(409, 'Request still running', `A request with this ${IDEMPOTENCY_HEADER} is still being handled. Try again in a moment.`, undefined, IDEMPOTENCY_PROBLEMS.inUse);
  }
  throw new AppError(409, 'Request still running', 'The request could not claim its Idempotency-Key. Try again in a moment.', undefined, IDEMPOTENCY_PROBLEMS.inUse);
}

/** Stores the answer of the request holding reservation `id`, so a resend replays it. */
export async function complete(ds: DataSource, id: number, stored: StoredAnswer): Promise<void> {
  await ds.getRepository(IdempotencyKey).update({ id }, { status: stored.status, answer: stored.answer as object, location: stored.location });
}

/** Gives the key back after a refusal or failure: nothing was done, so a resend may run. */
export async function release(ds: DataSource, id: number): Promise<void> {
  await ds.getRepository(IdempotencyKey).delete({ id });
}

/** Deletes keys older than the keeping period; returns how many. */
export async function purgeExpiredKeys(ds: DataSource, now = new Date()): Promise<number> {
  const result = await ds.getRepository(IdempotencyKey).delete({ createdAt: LessThan(new Date(now.getTime() - IDEMPOTENCY_KEY_DAYS * DAY_MS)) });
  return result.affected ?? 0;
}
