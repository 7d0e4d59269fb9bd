// Readings as a business component: create and correct. Nothing is ever
// deleted or edited in place: a correction is a new reading that supersedes the old one, which
// keeps its row; every change is an audit event. No req/res here.
import type { EntityManager } from 'typeorm';
import type { ReadingDetail } from '../../shared/api/reading-answers.js';
import type { CreateReadingBody, CreateReadingsBody, SupersedeReadingBody } from '../../shared/api/readings.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import type { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import type { CreatedReadings } from '../../shared/api/reading-answers.js';
import { getReadingDetail } from './reading-detail.js';
import { prepareReading, type ColourSources, type ReadingValues } from './reading-input.js';
import { Reading } from './reading.entity.js';

// The list lives beside its query; re-exported so callers of the domain find it here.
export { listReadings, readingsQuery } from './reading-list.js';

/** What the readings domain works with: the database, the reference sets and the photo store. */
export interface ReadingsDeps extends ColourSources {
  ds: EntityManager['connection'];
}

/** The audit detail of a new reading: enough to see what was stored without the row. */
function createdDetail(v: ReadingValues, extra: Record<string, unknown> = {}): Record<string, unknown> {
  return {
    accessionId: v.accessionId,
    characterId: v.characterId,
    siteId: v.siteId,
    plantId: v.plantId,
    method: v.method,
    lab: [v.l, v.a, v.b],
    bestChip: v.bestChipCode,
    deltaE00: v.deltaE00,
    setId: v.setId,
    ...extra,
  };
}

/** Inserts prepared values and audits `reading.created`; call inside a transaction. Returns the new id. */
export async function insertReading(m: EntityManager, actor: Actor, values: ReadingValues, extra: Record<string, unknown> = {}): Promise<number> {
  const result = await m.insert(Reading, values);
  const id = Number(result.identifiers[0]!['id']);
  await recordAudit(m, actor, 'reading.created', `reading:${id}`, createdDetail(values, extra));
  return id;
}

/** Records a new reading taken by `observer`; 400 naming the field when it names nothing usable. */
export async function createReading(deps: ReadingsDeps, actor: Actor, observer: User, body: CreateReadingBody): Promise<ReadingDetail> {
  // Colour, matching and photo sampling are done before the transaction, which then only writes:
  // readings' ids are never deleted, so what was checked still holds when it commits.
  const values = await prepareReading(deps.ds.manager, deps, body, observer.id);
  const id = await deps.ds.transaction((m) => insertReading(m, actor, values));
  return getReadingDetail(deps, id);
}

/**
 * Records several readings together, all or nothing: every one is prepared (checked, sampled,
 * matched) before any is written, and a refusal of any names its field under `readings.<i>.`, so
 * the ground colour of a striped region is never saved without its stripe.
 */
export async function createReadings(deps: ReadingsDeps, actor: Actor, observer: User, body: CreateReadingsBody): Promise<CreatedReadings> {
  const prepared: ReadingValues[] = [];
  for (const [i, reading] of body.readings.entries()) {
    prepared.push(await prepareReading(deps.ds.manager, deps, reading, observer.id).catch((err: unknown) => { throw underReading(err, i); }));
  }
  const batch = prepared.length > 1 ? { batchOf: prepared.length } : {};
  const ids = await deps.ds.transaction(async (m) => {
    const created: number[] = [];
    for (const values of prepared) created.push(await insertReading(m, actor, values, batch));
    return created;
  });
  const readings: ReadingDetail[] = [];
  for (const id of ids) readings.push(await getReadingDetail(deps, id));
  return { readings };
}

/** A refusal of one reading of a batch, its fields named under `readings.<i>.`. */
function underReading(err: unknown, i: number): unknown {
  if (!(err instanceof AppError) || !err.errors) return err;
  const errors = err.errors.map((e) => ({ ...e, field: `readings.${i}.${e.field}` }));
  return new AppError(err.status, err.title, `Reading ${i + 1} of the batch: ${err.detail ?? err.title} Nothing was saved.`, errors, err.slug, err.extensions);
}

/** Whether a user may correct a reading: admins any; recorders and trainers only their own; reviewers none. */
export function mayCorrect(user: Pick<User, 'id' | 'role'>, reading: Pick<Reading, 'observerId'>): boolean {
  if (user.role === 'admin') return true;
  if (user.role === 'recorder' || user.role === 'trainer') return reading.observerId === user.id;
  return false;
}

async function currentVersion(m: EntityManager, id: number, user: User): Promise<Reading> {
  const old = await m.findOneBy(Reading, { id });
  if (!old) throw AppError.notFound(`There is no reading ${id}.`);
  if (!mayCorrect(user, old)) throw AppError.forbidden(user.role === 'reviewer' ? 'Reviewers review readings; they do not correct them.' : 'Only an admin may correct someone else’s reading.');
  if (old.supersededById !== null) throw AppError.conflict(`Reading ${id} has already been corrected by reading ${old.supersededById}; correct that one instead.`);
  return old;
}

/**
 * Corrects reading `id`: a new reading, complete in itself, supersedes it. The old row stays and
 * is linked to the new one both ways. The observer stays the one who took the reading (a
 * correction fixes the record of their observation); who corrected it is the audit's actor.
 * 404 unknown, 403 not theirs, 409 already superseded.
 */
export async function supersedeReading(deps: ReadingsDeps, actor: Actor, user: User, id: number, body: SupersedeReadingBody): Promise<ReadingDetail> {
  const first = await currentVersion(deps.ds.manager, id, user);
  const { reason, ...fields } = body;
  const values = await prepareReading(deps.ds.manager, deps, fields, first.observerId);
  const newId = await deps.ds.transaction(async (m) => {
    // Checked again inside the transaction: a parallel correction may have landed meanwhile.
    const old = await currentVersion(m, id, user);
    const created = await insertReading(m, actor, { ...values, supersedesId: old.id, supersedeReason: reason }, { supersedes: old.id, reason });
    // The where names the id only: TypeORM 1.x refuses a null in a where; `currentVersion` has just checked it above, inside this transaction.
    await m.update(Reading, { id: old.id }, { supersededById: created });
    await recordAudit(m, actor, 'reading.superseded', `reading:${old.id}`, { by: created, reason, from: { lab: [old.l, old.a, old.b], bestChip: old.bestChipCode }, to: { lab: [values.l, values.a, values.b], bestChip: values.bestChipCode } });
    return created;
  });
  return getReadingDetail(deps, newId);
}
