// A stored reading as the API shows it: the list row, and the detail with matches, provenance,
// the supersede chain and the audit history. Reads only.
import { In, type DataSource, type EntityManager } from 'typeorm';
import { EARLIER_READINGS_MAX, type EarlierReading, type ReadingDetail, type ReadingHistoryEvent, type ReadingProvenance, type ReadingVersion } from '../../shared/api/reading-answers.js';
import { AuditEvent } from '../audit/audit-event.entity.js';
import { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import type { ReferenceSets } from '../reference-sets/reference-sets.js';
import { auditSentence } from '../audit/audit-sentence.js';
import { toReadingDto, wrappingSeasons } from './reading-list.js';
import { Reading } from './reading.entity.js';
import { Review } from '../reviews/review.entity.js';
import { nameBestChips } from '../reference-sets/chip-names.js';

/** How many chips the detail lists (the same strip of five a photo sample shows). */
const DETAIL_MATCHES = 5;

/** The audit subject of a reading. */
export function readingSubject(id: number): string {
  return `reading:${id}`;
}

function provenanceOf(r: Reading): ReadingProvenance {
  return {
    photoId: r.photoId,
    photoWidth: r.photo?.width ?? null,
    photoHeight: r.photo?.height ?? null,
    region: r.region,
    neutralRegion: r.neutralRegion,
    pixelCount: r.pixelCount,
    pixelsDropped: r.pixelsDropped,
    spreadDeltaE00: r.spreadDeltaE00,
    uniform: r.uniform,
    correction: r.correction,
    pipeline: r.pipeline,
    cluster: r.cluster,
    instrument: r.instrument,
    illuminant: r.illuminant,
    reportedLab: r.reportedLab,
    source: r.source,
  };
}

/** The whole supersede chain of a reading, oldest first. Chains are short (a few corrections), so link by link. */
async function chainOf(m: EntityManager, r: Reading): Promise<ReadingVersion[]> {
  const select = { id: true, observedAt: true, createdAt: true, supersedeReason: true, supersedesId: true, supersededById: true } as const;
  const older: Reading[] = [];
  let back = r.supersedesId;
  while (back !== null) {
    const row = await m.findOneOrFail(Reading, { where: { id: back }, select });
    older.unshift(row);
    back = row.supersedesId;
  }
  const newer: Reading[] = [];
  let ahead = r.supersededById;
  while (ahead !== null) {
    const row = await m.findOneOrFail(Reading, { where: { id: ahead }, select });
    newer.push(row);
    ahead = row.supersededById;
  }
  return [...older, r, ...newer].map((v) => ({ id: v.id, observedAt: v.observedAt.toISOString(), createdAt: v.createdAt.toISOString(), reason: v.supersedeReason, current: v.supersededById === null }));
}

/** The same plant's (else the same accession and site's) earlier readings of the character, versions in force, newest first. */
async function earlierOf(m: EntityManager, r: Reading): Promise<EarlierReading[]> {
  const qb = m
    .getRepository(Reading)
    .createQueryBuilder('x')
    .leftJoinAndSelect('x.observer', 'o')
    .where('x.accessionId = :a AND x.characterId = :c AND x.observedAt < :at AND x.supersededById IS NULL AND x.id != :id', { a: r.accessionId, c: r.characterId, at: r.observedAt, id: r.id });
  if (r.plantId !== null) qb.andWhere('x.plantId = :p', { p: r.plantId });
  else qb.andWhere('x.plantId IS NULL AND x.siteId = :s', { s: r.siteId });
  const rows = await qb.orderBy('x.observedAt', 'DESC').addOrderBy('x.id', 'DESC').limit(EARLIER_READINGS_MAX).getMany();
  return rows.map((x) => ({ id: x.id, observedAt: x.observedAt.toISOString(), observerName: x.observer!.name, hex: x.hex, bestChip: x.bestChipCode, status: x.status }));
}

async function latestReviewOf(m: EntityManager, readingId: number): Promise<ReadingDetail['latestReview']> {
  const review = await m.findOne(Review, { where: { readingId }, relations: { reviewer: true }, order: { createdAt: 'DESC', id: 'DESC' } });
  return review ? { decision: review.decision, comment: review.comment, reviewerName: review.reviewer!.name, createdAt: review.createdAt.toISOString() } : null;
}

async function historyOf(m: EntityManager, id: number): Promise<ReadingHistoryEvent[]> {
  const events = await m.find(AuditEvent, { where: { subject: readingSubject(id) }, order: { at: 'ASC', id: 'ASC' } });
  const actorIds = [...new Set(events.map((e) => e.actorId).filter((x): x is number => x !== null))];
  const names = new Map((actorIds.length ? await m.find(User, { where: { id: In(actorIds) }, select: { id: true, name: true } }) : []).map((u) => [u.id, u.name]));
  return events.map((e) => {
    const actorName = e.actorId === null ? null : (names.get(e.actorId) ?? e.actorEmail);
    return { id: e.id, at: e.at.toISOString(), actorName, action: e.action, detail: e.detail, sentence: auditSentence(actorName, e.action, e.subject, e.detail) };
  });
}

/** One reading with its provenance, its chips (matched again against the set it was stored with), versions and history; 404 when there is none. */
export async function getReadingDetail(deps: { ds: DataSource; referenceSets: ReferenceSets }, id: number): Promise<ReadingDetail> {
  const m = deps.ds.manager;
  const referenceSets = deps.referenceSets;
  const r = await m.findOne(Reading, { where: { id }, relations: { accession: true, plant: true, character: true, site: true, observer: true, photo: true } });
  if (!r) throw AppError.notFound(`There is no reading ${id}.`);
  await nameBestChips(deps.ds, [r]);
  const lab = { l: r.l, a: r.a, b: r.b };
  const match = await referenceSets.match(lab, DETAIL_MATCHES, r.setId);
  const otherSets = [];
  for (const set of (await referenceSets.list()).filter((s) => s.id !== r.setId)) {
    const other = await referenceSets.match(lab, DETAIL_MATCHES, set.id);
    otherSets.push({ setId: set.id, current: set.current, matches: other.matches, between: other.between });
  }
  return { ...toReadingDto(r, await wrappingSeasons(m)), matches: match.matches, between: match.between, otherSets, provenance: provenanceOf(r), versions: await chainOf(m, r), history: await historyOf(m, id), latestReview: await latestReviewOf(m, id), earlier: await earlierOf(m, r) };
}
