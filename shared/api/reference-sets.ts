import { z } from 'zod';

import { isHex } from '../colour/parse.js';
import { LAB_INPUT_LIMITS, MATCH_K_MAX, REFERENCE_SET_ID_PATTERN } from './reference-set-answers.js';

export * from './reference-set-answers.js';

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;

const lightness = z
  .number({ message: 'L* must be a number' })
  .min(lMin, { message: `L* must be from ${lMin} to ${lMax}` })
  .max(lMax, { message: `L* must be from ${lMin} to ${lMax}` });
const opponent = (name: string) =>
  z
    .number({ message: `${name} must be a number` })
    .min(-abMax, { message: `${name} must be from −${abMax} to ${abMax}` })
    .max(abMax, { message: `${name} must be from −${abMax} to ${abMax}` });

/** `POST /api/match`: exactly one of `hex` and `lab`, optional `k` and `setId`. */
export const matchBody = z
  .object({
    hex: z
      .string({ message: 'must be a text like #7b3f6e' })
      .max(20, { message: 'must be a hex colour like #7b3f6e' })
      .refine(isHex, { message: 'must be a hex colour like #7b3f6e (#rgb or #rrggbb)' })
      .optional(),
    lab: z.tuple([lightness, opponent('a*'), opponent('b*')], { message: 'must be [L*, a*, b*], three numbers' }).optional(),
    k: z
      .number({ message: 'must be a whole number' })
      .int({ message: 'must be a whole number' })
      .min(1, { message: `must be from 1 to ${MATCH_K_MAX}` })
      .max(MATCH_K_MAX, { message: `must be from 1 to ${MATCH_K_MAX}` })
      .optional(),
    setId: z.string({ message: 'must be a reference-set id' }).regex(REFERENCE_SET_ID_PATTERN, { message: 'must be a reference-set id like v1' }).optional(),
  })
  .superRefine((body, ctx) => {
    const given = (body.hex !== undefined ? 1 : 0) + (body.lab !== undefined ? 1 : 0);
    if (given === 1) return;
    const message = given === 0 ? 'give a colour: hex or lab' : 'give hex or lab, not both';
    ctx.addIssue({ code: 'custom', path: ['hex'], message });
    ctx.addIssue({ code: 'custom', path: ['lab'], message });
  });
export type MatchBody = z.infer<typeof matchBody>;

/** `PUT /api/reference-sets/current`: which stored set new readings are matched against. */
export const chooseCurrentSetBody = z.object({
  setId: z.string({ message: 'must be a reference-set id like v2' }).regex(REFERENCE_SET_ID_PATTERN, { message: 'must be a reference-set id like v2' }),
});
export type ChooseCurrentSetBody = z.infer<typeof chooseCurrentSetBody>;
