import { z } from 'zod';

import { listReadingsQuery } from './readings.js';
import { REVIEW_COMMENT_MAX, REVIEW_DECISIONS } from './review-answers.js';

export * from './review-answers.js';

/** `POST /api/readings/:id/review`: a comment is required to flag or to ask for a re-read (it is what the recorder is told). */
export const reviewBody = z
  .object({
    decision: z.enum(REVIEW_DECISIONS, { message: `must be one of ${REVIEW_DECISIONS.join(', ')}` }),
    comment: z
      .string({ message: 'must be text' })
      .trim()
      .max(REVIEW_COMMENT_MAX, { message: `must be at most ${REVIEW_COMMENT_MAX} characters` })
      .nullish()
      .transform((c) => (c ? c : null)),
  })
  .strict()
  .superRefine((body, ctx) => {
    if (body.decision !== 'approve' && !body.comment) {
      ctx.addIssue({ code: 'custom', path: ['comment'], message: `is required to ${body.decision === 'flag' ? 'flag a reading' : 'ask for a re-read'}: say what is wrong` });
    }
  });
export type ReviewBody = z.infer<typeof reviewBody>;

/** Most readings approved in one bulk request (our own: one queue page at its largest). */
export const BULK_APPROVE_MAX = 200;

/** `POST /api/reviews/approve`: approve every reading named, all or nothing (one confirmation in the client). */
export const bulkApproveBody = z
  .object({
    ids: z
      .array(z.number({ message: 'must be reading ids' }).int({ message: 'must be whole numbers' }).positive({ message: 'must be positive ids' }), { message: 'must be a list of reading ids' })
      .min(1, { message: 'must name at least one reading' })
      .max(BULK_APPROVE_MAX, { message: `may name at most ${BULK_APPROVE_MAX} readings` }),
  })
  .strict();
export type BulkApproveBody = z.infer<typeof bulkApproveBody>;

/** `GET /api/reviews/queue`: the readings filter, status `submitted` unless another is asked for. */
export const reviewQueueQuery = listReadingsQuery.transform((q) => ({ ...q, status: q.status ?? ('submitted' as const) }));
export type ReviewQueueQueryParsed = z.infer<typeof reviewQueueQuery>;
