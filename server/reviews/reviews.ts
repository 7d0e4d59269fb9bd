// The reviewers' workflow (issue 6): a decision on a reading, the queue of readings to review, and
// a reading's reviews. A decision changes only the reading's status; the review, the status, the
// audit event and the recorder's notice commit together, and the mail goes after the commit.
// No req/res here.
import type { DataSource, EntityManager } from 'typeorm';
import type { ReadingList, ReadingStatus } from '../../shared/api/reading-answers.js';
import type { NotificationKind, ReviewAnswer, ReviewDecision, ReviewDto } from '../../shared/api/review-answers.js';
import type { ListReadingsQuery } from '../../shared/api/readings.js';
import type { ReviewBody } from '../../shared/api/reviews.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import { READING_ROW_RELATIONS, readingSubject, toReadingDto } from '../readings/reading-view.js';
import { wrappingSeasons } from '../readings/reading-list.js';
import { Reading } from '../readings/reading.entity.js';
import { listReadings } from '../readings/readings.js';
import { noticeKindOf, noticeMessage, reviewNoticeMail, type ReviewedReading } from './review-mail.js';
import { Notification, Review } from './review.entity.js';
import { nameBestChips } from '../reference-sets/chip-names.js';

/** The status each decision puts a reading in. */
export const STATUS_AFTER: Readonly<Record<ReviewDecision, ReadingStatus>> = {
  approve: 'approved',
  flag: 'flagged',
  reread: 'reread-requested',
};

/** What reviewing needs besides the database: the mailer, the base of links, and where a failed send is logged. */
export interface ReviewDeps {
  ds: DataSource;
  mailer: Mailer;
  publicUrl: string;
  logError: (err: unknown) => void;
}

async function loadReading(ds: DataSource | EntityManager, id: number): Promise<Reading> {
  const r = await ds.getRepository(Reading).findOne({ where: { id }, relations: READING_ROW_RELATIONS });
  if (!r) throw AppError.notFound(`There is no reading ${id}.`);
  return r;
}

/** 409 once superseded; 403 for one's own reading. */
export function assertReviewable(r: Reading, reviewer: User): void {
  if (r.supersededById !== null) throw AppError.conflict(`Reading ${r.id} has been corrected by reading ${r.supersededById}; review that one instead.`);
  // Four eyes: an admin who also records may not pass judgement on their own reading.
  if (r.observerId === reviewer.id) throw AppError.forbidden('You cannot review a reading you took yourself; another reviewer must.');
}

/**
 * Records a reviewer's decision on a reading in one transaction: the review, the reading's new
 * status (the only field of a reading that ever changes), the `reading.reviewed` audit event on the
 * reading (so its history shows it) and, for a flag or a re-read request, a notice to the
 * observer. Then mails the observer about a flag or re-read; a failed send is logged and reported
 * as `mailed: false`, because the notice in the app is already there. 404 for no such reading, 409
 * once it has been superseded (checked again inside the transaction).
 */
export async function reviewReading(deps: ReviewDeps, actor: Actor, reviewer: User, id: number, body: ReviewBody): Promise<ReviewAnswer> {
  assertReviewable(await loadReading(deps.ds, id), reviewer);
  const { review, reading, kind } = await deps.ds.transaction(async (m) => {
    const r = await loadReading(m, id);
    assertReviewable(r, reviewer);
    return { ...(await recordReview(m, actor, reviewer, r, body)), reading: r };
  });

  let mailed = false;
  if (kind) {
    try {
      await deps.mailer.send(reviewNoticeMail(reading.observer!.email, reading.observer!.name, kind, reviewer.name, reviewedOf(reading), body.comment!, deps.publicUrl));
      mailed = true;
    } catch (err) {
      deps.logError(err);
    }
  }
  // After the transaction: the derived chip name is set in memory only, never saved.
  await nameBestChips(deps.ds, [reading]);
  return { review: toReviewDto(review, reviewer.name), reading: toReadingDto(reading, await wrappingSeasons(deps.ds.manager)), mailed };
}

/**
 * Approves every reading named in one transaction, all or nothing: a reading that may not be
 * reviewed (missing, superseded, one's own) refuses the whole request naming it, and nothing is
 * written. Approvals send no notice or mail.
 */
export async function bulkApprove(ds: DataSource, actor: Actor, reviewer: User, ids: readonly number[]): Promise<{ approved: number }> {
  const unique = [...new Set(ids)];
  await ds.transaction(async (m) => {
    for (const id of unique) {
      const r = await loadReading(m, id);
      assertReviewable(r, reviewer);
      await recordReview(m, actor, reviewer, r, { decision: 'approve', comment: null });
    }
  });
  return { approved: unique.length };
}

/**
 * The writes of one decision inside the caller's transaction (the API's and the demo's): the
 * review, the status of `r` (updated in place too), the audit event, and the observer's notice for
 * a flag or a re-read. The caller has checked that `r` may be reviewed.
 */
export async function recordReview(m: EntityManager, actor: Actor, reviewer: User, r: Reading, body: ReviewBody): Promise<{ review: Review; kind: NotificationKind | null }> {
  const status = STATUS_AFTER[body.decision];
  const kind = noticeKindOf(body.decision);
  const review = await m.save(m.create(Review, { readingId: r.id, decision: body.decision, comment: body.comment, reviewerId: reviewer.id }));
  await m.update(Reading, { id: r.id }, { status });
  await recordAudit(m, actor, 'reading.reviewed', readingSubject(r.id), { reviewId: review.id, decision: body.decision, comment: body.comment, from: r.status, to: status });
  if (kind) await m.insert(Notification, { userId: r.observerId, kind, readingId: r.id, message: noticeMessage(kind, reviewer.name, reviewedOf(r), body.comment!), readAt: null });
  r.status = status;
  return { review, kind };
}

function reviewedOf(r: Reading): ReviewedReading {
  return { id: r.id, accessionNumber: r.accession!.accessionNumber, accessionName: r.accession!.name, characterLabel: r.character!.label, siteCode: r.site!.code, observedAt: r.observedAt };
}

/** The review queue: the readings list with its filters and pages, status `submitted` unless the query names another. */
export function reviewQueue(ds: DataSource, q: ListReadingsQuery): Promise<ReadingList> {
  return listReadings(ds, { ...q, status: q.status ?? 'submitted' });
}

/** A reading's reviews, oldest first; 404 for no such reading. */
export async function reviewsOf(ds: DataSource, readingId: number): Promise<ReviewDto[]> {
  if (!(await ds.getRepository(Reading).existsBy({ id: readingId }))) throw AppError.notFound(`There is no reading ${readingId}.`);
  const rows = await ds.getRepository(Review).find({ where: { readingId }, relations: { reviewer: true }, order: { createdAt: 'ASC', id: 'ASC' } });
  return rows.map((r) => toReviewDto(r, r.reviewer!.name));
}

function toReviewDto(r: Review, reviewerName: string): ReviewDto {
  return { id: r.id, readingId: r.readingId, decision: r.decision, comment: r.comment, reviewerId: r.reviewerId, reviewerName, createdAt: r.createdAt.toISOString() };
}
