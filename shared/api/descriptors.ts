import { z } from 'zod';

import { UNITS } from '../units/units.js';
import { CATEGORY_ID, DESCRIPTOR_CODE, DESCRIPTOR_KINDS, OBSERVATIONS_PAGE_MAX } from './descriptor-answers.js';

export * from './descriptor-answers.js';

const id = (what: string) =>
  z.number({ message: `must be the number of a ${what}` }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive whole number' });

const text = (max: number) =>
  z.string({ message: 'must be text' }).trim().min(1, { message: 'is required' }).max(max, { message: `must be at most ${max} characters` });

const descriptorCode = z
  .string({ message: 'is required' })
  .max(60, { message: 'must be at most 60 characters' })
  .regex(DESCRIPTOR_CODE, { message: 'must be lowercase words joined by dots, like petiole.length' });

const categories = z
  .array(
    z.object({
      id: z.string({ message: 'is required' }).max(40, { message: 'must be at most 40 characters' }).regex(CATEGORY_ID, { message: 'must be lowercase words joined by hyphens, like long-oval' }),
      label: text(80),
    }),
    { message: 'must be a list of {id, label}' },
  )
  .max(40, { message: 'may have at most 40 categories' })
  .superRefine((list, ctx) => {
    const seen = new Set<string>();
    list.forEach((c, i) => {
      if (seen.has(c.id)) ctx.addIssue({ code: 'custom', path: [i, 'id'], message: `repeats the category ${c.id}` });
      seen.add(c.id);
    });
  });

/**
 * `POST /api/descriptors` (admin) → 201 `Descriptor`; 409 for a taken code. A category descriptor
 * needs at least two categories; a ratio names two existing descriptors of one measured kind.
 */
export const createDescriptorBody = z
  .object({
    code: descriptorCode,
    label: text(120),
    object: text(200),
    kind: z.enum(DESCRIPTOR_KINDS, { message: `must be one of ${DESCRIPTOR_KINDS.join(', ')}` }),
    categories: categories.optional(),
    numeratorCode: descriptorCode.optional(),
    denominatorCode: descriptorCode.optional(),
    howToMeasure: text(2000),
    caution: z.string({ message: 'must be text' }).trim().max(1000).nullish(),
  })
  .superRefine((d, ctx) => {
    if (d.kind === 'category' && (d.categories?.length ?? 0) < 2) ctx.addIssue({ code: 'custom', path: ['categories'], message: 'a category descriptor needs at least two categories' });
    if (d.kind !== 'category' && d.categories?.length) ctx.addIssue({ code: 'custom', path: ['categories'], message: 'only a category descriptor has categories' });
    for (const key of ['numeratorCode', 'denominatorCode'] as const) {
      if (d.kind === 'ratio' && !d[key]) ctx.addIssue({ code: 'custom', path: [key], message: 'a ratio needs both its parts' });
      if (d.kind !== 'ratio' && d[key]) ctx.addIssue({ code: 'custom', path: [key], message: 'only a ratio has parts' });
    }
    if (d.kind === 'ratio' && d.numeratorCode && d.numeratorCode === d.denominatorCode) ctx.addIssue({ code: 'custom', path: ['denominatorCode'], message: 'must differ from the numerator' });
  });
export type CreateDescriptorBody = z.infer<typeof createDescriptorBody>;

const never = (why: string) => z.never({ message: why }).optional();

/** `PATCH /api/descriptors/:id` (admin) → 200 `Descriptor`. Categories may be relabelled or added, never removed (observations keep their ids). */
export const updateDescriptorBody = z.object({
  label: text(120).optional(),
  object: text(200).optional(),
  howToMeasure: text(2000).optional(),
  caution: z.string({ message: 'must be text' }).trim().max(1000).nullish(),
  active: z.boolean({ message: 'must be true or false' }).optional(),
  categories: categories.optional(),
  code: never('never changes: observations refer to it'),
  kind: never('never changes: observations were entered for it'),
  numeratorCode: never('never changes; add a new ratio instead'),
  denominatorCode: never('never changes; add a new ratio instead'),
});
export type UpdateDescriptorBody = z.infer<typeof updateDescriptorBody>;

/** Largest value accepted in any unit (our own cap: no taro part is a kilometre long or weighs a tonne). */
const VALUE_MAX = 100_000;

const observedAt = z.iso.datetime({ offset: true, message: 'must be an ISO 8601 date-time with a time zone, e.g. 2026-03-14T09:30:00+12:00' });

/** What an observation holds: a value with its unit, or a category. Whether it fits the descriptor is checked against the catalogue. */
const observationValue = {
  value: z.number({ message: 'must be a number' }).refine(Number.isFinite, { message: 'must be a finite number' }).min(0, { message: 'must not be negative' }).max(VALUE_MAX, { message: `must be at most ${VALUE_MAX}` }).optional(),
  unit: z.enum(UNITS, { message: `must be one of ${UNITS.join(', ')}` }).optional(),
  category: z.string({ message: 'must be a category id' }).max(40).optional(),
  observedAt: observedAt.optional(),
  notes: z.string({ message: 'must be text' }).trim().max(2000, { message: 'must be at most 2000 characters' }).nullish(),
};

/**
 * `POST /api/observations` (recorder, trainer, admin) → 201 `Observation`.
 * `{accessionId, plantId?, descriptorId, observedAt?, value, unit}` or `{…, category}`.
 * 400 when the unit does not fit the descriptor's kind, or the descriptor is a ratio (computed, never typed).
 */
export const createObservationBody = z.object({
  accessionId: id('accession'),
  plantId: id('plant').nullish(),
  descriptorId: id('descriptor'),
  ...observationValue,
});
export type CreateObservationBody = z.infer<typeof createObservationBody>;

/** Most values saved at once (our own cap: a whole catalogue for one plant, with room to spare). */
export const OBSERVATIONS_BATCH_MAX = 100;

/**
 * `POST /api/observations/batch` (recorder, trainer, admin) → 201 `Observation[]`: several values
 * saved all or nothing; a refusal names the value (`observations.2.value`) and nothing is stored.
 */
export const createObservationsBody = z.object({
  observations: z.array(createObservationBody, { message: 'must be a list of observations' }).min(1, { message: 'must hold at least one value' }).max(OBSERVATIONS_BATCH_MAX, { message: `must hold at most ${OBSERVATIONS_BATCH_MAX} values` }),
});
export type CreateObservationsBody = z.infer<typeof createObservationsBody>;

/**
 * `POST /api/observations/:id/supersede` (recorder: own only; trainer: own only; admin: any) → 201 the new
 * `Observation`; the old one stays, linked both ways. Same accession and descriptor; plant optional (defaults to the old one's).
 */
export const supersedeObservationBody = z.object({
  plantId: id('plant').nullish(),
  ...observationValue,
});
export type SupersedeObservationBody = z.infer<typeof supersedeObservationBody>;

const queryId = (what: string) => z.coerce.number({ message: `must be the number of a ${what}` }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive whole number' });

/** `GET /api/observations?accessionId=&plantId=&descriptorId=&includeSuperseded=&page=&pageSize=` → `ObservationPage`. */
export const observationQuery = z.object({
  accessionId: queryId('accession').optional(),
  plantId: queryId('plant').optional(),
  descriptorId: queryId('descriptor').optional(),
  includeSuperseded: z.enum(['true', 'false'], { message: 'must be true or false' }).optional(),
  page: z.coerce.number({ message: 'must be a page number' }).int().min(1, { message: 'must be at least 1' }).max(100_000).default(1),
  pageSize: z.coerce.number({ message: 'must be a number' }).int().min(1, { message: 'must be at least 1' }).max(OBSERVATIONS_PAGE_MAX, { message: `must be at most ${OBSERVATIONS_PAGE_MAX}` }).default(50),
});
export type ObservationQuery = z.infer<typeof observationQuery>;
