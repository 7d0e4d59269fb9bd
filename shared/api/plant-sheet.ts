import { z } from 'zod';

import { SKIP_REASON_MAX } from './plant-sheet-answers.js';

export * from './plant-sheet-answers.js';

const id = (what: string) =>
  z.number({ message: `must be the number of a ${what}` }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive whole number' });

/**
 * `POST /api/plants/:id/skips` (recorder, trainer, admin) → 201 `SheetSkip`: sets one colour
 * character or one descriptor aside for the plant this season, with the reason.
 */
export const createSkipBody = z
  .object({
    characterId: id('character').optional(),
    descriptorId: id('descriptor').optional(),
    reason: z.string({ message: 'must be text' }).trim().min(1, { message: 'is required: say why it is skipped' }).max(SKIP_REASON_MAX, { message: `must be at most ${SKIP_REASON_MAX} characters` }),
  })
  .superRefine((b, ctx) => {
    if ((b.characterId === undefined) === (b.descriptorId === undefined)) {
      ctx.addIssue({ code: 'custom', path: ['characterId'], message: 'name exactly one of characterId and descriptorId' });
    }
  });
export type CreateSkipBody = z.infer<typeof createSkipBody>;

/**
 * `PUT /api/catalogue/order` (admin) → 200 `WalkEntry[]`: every active and inactive character and
 * descriptor, in the new walk order; the server numbers them in steps of ten.
 */
export const walkOrderBody = z.object({
  items: z
    .array(z.object({ kind: z.enum(['character', 'descriptor'], { message: 'must be character or descriptor' }), id: id('catalogue entry') }), { message: 'must be a list of {kind, id}' })
    .min(1, { message: 'must list the catalogue' })
    .max(2000, { message: 'must list at most 2000 entries' }),
});
export type WalkOrderBody = z.infer<typeof walkOrderBody>;

const queryId = (what: string) => z.coerce.number({ message: `must be the number of a ${what}` }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive whole number' });

/** `GET /api/progress?siteId=&at=`: plants of one site (or all), for the season holding `at` (default now). */
export const progressQuery = z.object({
  siteId: queryId('site').optional(),
  at: z.iso.datetime({ offset: true, message: 'must be an ISO 8601 date-time with a time zone' }).optional(),
});
export type ProgressQuery = z.infer<typeof progressQuery>;

/** `GET /api/plants/labels.pdf?accessionId=` or `?siteId=`: the label sheet of one accession's plants or of every plant at a site. */
export const labelsQuery = z
  .object({ accessionId: queryId('accession').optional(), siteId: queryId('site').optional() })
  .superRefine((q, ctx) => {
    if ((q.accessionId === undefined) === (q.siteId === undefined)) ctx.addIssue({ code: 'custom', path: ['accessionId'], message: 'name exactly one of accessionId and siteId' });
  });
export type LabelsQuery = z.infer<typeof labelsQuery>;
