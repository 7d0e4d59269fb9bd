import { z } from 'zod';

import { isHex } from '../colour/parse.js';
import { LAB_INPUT_LIMITS } from './reference-set-answers.js';
import { regionSchema } from './photos.js';
import {
  CUT_SECONDS_MAX,
  INSTRUMENT_ILLUMINANTS,
  LEAF_POSITION_MAX,
  LIGHTS,
  READING_METHODS,
  READING_NOTES_MAX,
  READING_SORTS,
  READING_STATUSES,
  READINGS_BATCH_MAX,
  READINGS_PAGE_SIZE_DEFAULT,
  READINGS_PAGE_SIZE_MAX,
  SUPERSEDE_REASON_MAX,
} from './reading-answers.js';

export * from './reading-answers.js';

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;
const id = z.number({ message: 'must be a whole number' }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive id' });
const labTuple = z.tuple(
  [
    z.number({ message: 'L* must be a number' }).min(lMin, { message: `L* must be from ${lMin} to ${lMax}` }).max(lMax, { message: `L* must be from ${lMin} to ${lMax}` }),
    z.number({ message: 'a* must be a number' }).min(-abMax, { message: `a* must be from ${-abMax} to ${abMax}` }).max(abMax, { message: `a* must be from ${-abMax} to ${abMax}` }),
    z.number({ message: 'b* must be a number' }).min(-abMax, { message: `b* must be from ${-abMax} to ${abMax}` }).max(abMax, { message: `b* must be from ${-abMax} to ${abMax}` }),
  ],
  { message: 'must be [L*, a*, b*], three numbers' },
);
const chipCode = z.string({ message: 'must be a chip code' }).trim().regex(/^F-\d{3}(\.\d{3})?$/, { message: 'must be a chip code like F-087 or F-087.014' });
const optionalText = (max: number) => z.string().trim().max(max, { message: `must be at most ${max} characters` }).nullish();

const readingFields = z.object({
  accessionId: id,
  plantId: id.nullish(),
  characterId: id,
  siteId: id.nullish(),
  observedAt: z.iso.datetime({ offset: true, message: 'must be an ISO 8601 date and time with an offset' }).optional(),
  method: z.enum(READING_METHODS, { message: `must be one of ${READING_METHODS.join(', ')}` }),
  lab: labTuple.optional(),
  hex: z.string().refine(isHex, { message: 'must be a colour like #7b3f6e' }).optional(),
  chipCode: chipCode.optional(),
  eyeChipCode: chipCode.nullish(),
  photo: z
    .object({
      photoId: id,
      region: regionSchema,
      neutral: z.object({ region: regionSchema, lab: labTuple.optional() }).optional(),
      cluster: z.number({ message: 'must be a whole number (0 = the colour with the largest share)' }).int({ message: 'must be a whole number (0 = the colour with the largest share)' }).min(0, { message: 'must be 0 or more' }).max(READINGS_BATCH_MAX - 1, { message: `must be at most ${READINGS_BATCH_MAX - 1}` }).optional(),
    })
    .optional(),
  instrument: optionalText(80),
  light: z.enum(LIGHTS, { message: `must be one of ${LIGHTS.join(', ')}` }).nullish(),
  illuminant: z.enum(INSTRUMENT_ILLUMINANTS, { message: `must be one of ${INSTRUMENT_ILLUMINANTS.join(', ')} (illuminant/observer in degrees)` }).nullish(),
  secondsSinceCut: z.number({ message: 'must be a number of seconds' }).int({ message: 'must be whole seconds' }).min(0).max(CUT_SECONDS_MAX).nullish(),
  leafPosition: optionalText(LEAF_POSITION_MAX),
  notes: optionalText(READING_NOTES_MAX),
});

/** Each method's own colour field, required; the others refused, so a body says one thing. */
const METHOD_FIELD = { photo: 'photo', instrument: 'lab', chip: 'chipCode', swatch: 'hex' } as const;

function methodRules<T extends z.infer<typeof readingFields>>(body: T, ctx: z.RefinementCtx): void {
  const own = METHOD_FIELD[body.method];
  for (const [method, field] of Object.entries(METHOD_FIELD)) {
    const present = body[field] !== undefined;
    if (field === own && !present) ctx.addIssue({ code: 'custom', path: [field], message: `is required for a ${method} reading` });
    if (field !== own && present) ctx.addIssue({ code: 'custom', path: [field], message: `is not used by a ${body.method} reading` });
  }
  // The instrument lights the sample itself: the ambient light is asked of the other methods only.
  if (body.method !== 'instrument' && !body.light) ctx.addIssue({ code: 'custom', path: ['light'], message: `is required for a ${body.method} reading: the light the tissue was read under` });
  if (body.illuminant && body.method !== 'instrument') ctx.addIssue({ code: 'custom', path: ['illuminant'], message: 'is only for instrument readings (the illuminant/observer the instrument reports)' });
  if (body.eyeChipCode && body.method !== 'photo' && body.method !== 'instrument') {
    ctx.addIssue({ code: 'custom', path: ['eyeChipCode'], message: 'is only for photo and instrument readings (a chip reading is the eye pick)' });
  }
}

/** `POST /api/readings`. */
export const createReadingBody = readingFields.strict().superRefine(methodRules);
export type CreateReadingBody = z.infer<typeof createReadingBody>;

/**
 * `POST /api/readings/batch`: up to three readings saved together, all or nothing, such as the
 * ground and the stripe colour of one photo region; each names its own character, never the same
 * one twice.
 */
export const createReadingsBody = z
  .object({
    readings: z
      .array(createReadingBody, { message: 'must be a list of readings' })
      .min(1, { message: 'must hold at least one reading' })
      .max(READINGS_BATCH_MAX, { message: `must hold at most ${READINGS_BATCH_MAX} readings` }),
  })
  .strict()
  .superRefine((body, ctx) => {
    body.readings.forEach((r, i) => {
      const first = body.readings.findIndex((o) => o.characterId === r.characterId);
      if (first < i) ctx.addIssue({ code: 'custom', path: ['readings', i, 'characterId'], message: `is the character of reading ${first + 1} too: each colour is a reading of its own character` });
    });
  });
export type CreateReadingsBody = z.infer<typeof createReadingsBody>;

/** `POST /api/readings/:id/supersede`. */
export const supersedeReadingBody = readingFields
  .extend({ reason: z.string({ message: 'is required' }).trim().min(1, { message: 'is required: say what was wrong' }).max(SUPERSEDE_REASON_MAX) })
  .strict()
  .superRefine(methodRules);
export type SupersedeReadingBody = z.infer<typeof supersedeReadingBody>;

const queryId = z.coerce.number({ message: 'must be a whole number' }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive id' });
const queryDate = z.iso.date({ message: 'must be a date YYYY-MM-DD' });

/** `GET /api/readings` and the exports: every filter validated; unknown parameters refused. */
export const listReadingsQuery = z
  .object({
    accessionId: queryId.optional(),
    characterId: queryId.optional(),
    siteId: queryId.optional(),
    season: z.string().trim().min(1).max(40).optional(),
    seasonYear: z.coerce.number({ message: 'must be a year' }).int({ message: 'must be a year' }).min(1900).max(2200).optional(),
    observerId: queryId.optional(),
    method: z.enum(READING_METHODS, { message: `must be one of ${READING_METHODS.join(', ')}` }).optional(),
    status: z.enum(READING_STATUSES, { message: `must be one of ${READING_STATUSES.join(', ')}` }).optional(),
    from: queryDate.optional(),
    to: queryDate.optional(),
    includeSuperseded: z.enum(['true', 'false', '1', '0'], { message: 'must be true or false' }).transform((v) => v === 'true' || v === '1').optional(),
    sort: z.enum(READING_SORTS, { message: `must be one of ${READING_SORTS.join(', ')}` }).default('observedAt'),
    dir: z.enum(['asc', 'desc'], { message: 'must be asc or desc' }).default('desc'),
    page: z.coerce.number({ message: 'must be a whole number' }).int({ message: 'must be a whole number' }).min(1, { message: 'must be at least 1' }).max(1_000_000).default(1),
    pageSize: z.coerce
      .number({ message: 'must be a whole number' })
      .int({ message: 'must be a whole number' })
      .min(1, { message: 'must be at least 1' })
      .max(READINGS_PAGE_SIZE_MAX, { message: `must be at most ${READINGS_PAGE_SIZE_MAX}` })
      .default(READINGS_PAGE_SIZE_DEFAULT),
  })
  .strict()
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'must not be before from' });
export type ListReadingsQuery = z.infer<typeof listReadingsQuery>;
