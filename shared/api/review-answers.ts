// The reviewers' workflow (issue 6): decisions on submitted readings, the queue, and the in-app
// notices a recorder gets. Without zod so the client may import it; schemas are in reviews.ts.
import type { ReviewBody } from './reviews.js';
import type { ReadingDto, ReadingListQuery } from './reading-answers.js';

/** What a reviewer decides: approve, flag with a reason, or ask the recorder to read again. */
export const REVIEW_DECISIONS = ['approve', 'flag', 'reread'] as const;
export type ReviewDecision = (typeof REVIEW_DECISIONS)[number];

/** Plain labels of the decisions, our own words. */
export const REVIEW_DECISION_LABELS: Readonly<Record<ReviewDecision, string>> = {
  approve: 'Approve',
  flag: 'Flag',
  reread: 'Ask for a re-read',
};

export const REVIEW_COMMENT_MAX = 1000;

/** `POST /api/readings/:id/review` (reviewer, admin): a comment is required to flag or ask for a re-read. */
export type ReviewRequest = ReviewBody;

/** One review of a reading, newest last in a reading's history. */
export interface ReviewDto {
  id: number;
  readingId: number;
  decision: ReviewDecision;
  comment: string | null;
  reviewerId: number;
  reviewerName: string;
  /** ISO 8601. */
  createdAt: string;
}

/** `POST /api/readings/:id/review` answer: the review and the reading in its new status. */
export interface ReviewAnswer {
  review: ReviewDto;
  reading: ReadingDto;
  /** Whether the recorder was sent an e-mail (flag and re-read only). */
  mailed: boolean;
}

/** `GET /api/reviews/queue`: the readings filter (status defaults to submitted), paginated → `{items,total}`. */
export type ReviewQueueQuery = ReadingListQuery;

export const NOTIFICATION_KINDS = ['reading-flagged', 'reread-requested', 'calibration-invited', 'calibration-results'] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** An in-app notice: to a recorder about one of their readings, or to an observer about a calibration session. */
export interface NotificationDto {
  id: number;
  kind: NotificationKind;
  /** The reading it is about (reading kinds); null for calibration notices. */
  readingId: number | null;
  /** The calibration session it is about (calibration kinds); null for reading notices. */
  sessionId: number | null;
  /** Plain words: what the reviewer decided and their comment. */
  message: string;
  createdAt: string;
  readAt: string | null;
}

/** `GET /api/notifications` (own). */
export interface NotificationList {
  items: NotificationDto[];
  unread: number;
}
