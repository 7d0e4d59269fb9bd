import { z } from 'zod';

import { PATCHES_MAX, PATCHES_MIN, POLYGON_POINTS_MAX } from '../photo/sampling-rules.js';
import { LAB_INPUT_LIMITS, MATCH_K_MAX } from './reference-set-answers.js';

export * from './photo-answers.js';

/** Coordinates beyond this are refused outright (our own; the largest photo is 100 MP). */
const COORD_MAX = 1_000_000;

const coord = z
  .number({ message: 'must be a number' })
  .refine(Number.isFinite, { message: 'must be a finite number' })
  .min(-COORD_MAX, { message: 'is far outside any photo' })
  .max(COORD_MAX, { message: 'is far outside any photo' });
const size = coord.refine((v) => v > 0, { message: 'must be greater than 0' });

/** A region in upright pixel coordinates; which fields it needs depends on `shape`. */
export const regionSchema = z.discriminatedUnion(
  'shape',
  [
    z.object({ shape: z.literal('rect'), x: coord, y: coord, width: size, height: size }),
    z.object({ shape: z.literal('ellipse'), cx: coord, cy: coord, rx: size, ry: size }),
    z.object({
      shape: z.literal('polygon'),
      points: z
        .array(z.tuple([coord, coord], { message: 'each point must be [x, y]' }), { message: 'must be a list of [x, y] points' })
        .min(3, { message: 'a polygon needs at least 3 points' })
        .max(POLYGON_POINTS_MAX, { message: `a polygon may have at most ${POLYGON_POINTS_MAX} points` }),
    }),
    z.object({ shape: z.literal('point'), x: coord, y: coord, radius: size }),
  ],
  { message: 'shape must be rect, ellipse, polygon or point' },
);

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;
const labTuple = z.tuple(
  [
    z.number({ message: 'L* must be a number' }).min(lMin, { message: `L* must be from ${lMin} to ${lMax}` }).max(lMax, { message: `L* must be from ${lMin} to ${lMax}` }),
    z.number({ message: 'a* must be a number' }).min(-abMax).max(abMax),
    z.number({ message: 'b* must be a number' }).min(-abMax).max(abMax),
  ],
  { message: 'must be [L*, a*, b*], three numbers' },
);

/** `POST /api/photos/:id/sample`: a region, and at most one of a neutral card or known patches. */
export const sampleBody = z
  .object({
    region: regionSchema,
    neutral: z.object({ region: regionSchema, lab: labTuple.optional() }).optional(),
    patches: z
      .array(z.object({ region: regionSchema, lab: labTuple }))
      .min(PATCHES_MIN, { message: `a multi-patch fit needs at least ${PATCHES_MIN} patches` })
      .max(PATCHES_MAX, { message: `at most ${PATCHES_MAX} patches` })
      .optional(),
    k: z.number({ message: 'must be a whole number' }).int({ message: 'must be a whole number' }).min(1).max(MATCH_K_MAX).optional(),
  })
  .refine((b) => !(b.neutral && b.patches), { path: ['patches'], message: 'give a neutral card or patches, not both' });
export type SampleBody = z.infer<typeof sampleBody>;
