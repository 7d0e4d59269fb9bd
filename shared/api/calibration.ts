import { z } from 'zod';

import { FIELD_CODE_PATTERN, FINE_CODE_PATTERN } from '../colour/reference-set.js';
import {
  CALIBRATION_TITLE_MAX,
  INVITE_MAX,
  SCREENING_METHODS,
  SCREENING_NOTES_MAX,
  SCREENING_RESULTS,
  SPECIMEN_LABEL_MAX,
} from './calibration-answers.js';
import { regionSchema } from './photos.js';
import { LAB_INPUT_LIMITS, REFERENCE_SET_ID_PATTERN } from './reference-set-answers.js';

export * from './calibration-answers.js';

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;

const id = (what: string) =>
  z.number({ message: `must be the number of a ${what}` }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive whole number' });

const isoDate = z.iso.date({ message: 'must be a date YYYY-MM-DD' });

const chipCode = z
  .string({ message: 'must be a chip code like F-087 or F-087.014' })
  .max(20, { message: 'must be a chip code like F-087 or F-087.014' })
  .refine((c) => FIELD_CODE_PATTERN.test(c) || FINE_CODE_PATTERN.test(c), { message: 'must be a chip code like F-087 or F-087.014' });

const labTuple = z.tuple(
  [
    z.number({ message: 'L* must be a number' }).min(lMin, { message: `L* must be from ${lMin} to ${lMax}` }).max(lMax, { message: `L* must be from ${lMin} to ${lMax}` }),
    z.number({ message: 'a* must be a number' }).min(-abMax, { message: `a* must be from −${abMax} to ${abMax}` }).max(abMax, { message: `a* must be from −${abMax} to ${abMax}` }),
    z.number({ message: 'b* must be a number' }).min(-abMax, { message: `b* must be from −${abMax} to ${abMax}` }).max(abMax, { message: `b* must be from −${abMax} to ${abMax}` }),
  ],
  { message: 'must be [L*, a*, b*], three numbers' },
);

/** `POST /api/calibration/sessions`. */
export const createSessionBody = z.object({
  title: z.string({ message: 'is required' }).trim().min(1, { message: 'is required' }).max(CALIBRATION_TITLE_MAX, { message: `must be at most ${CALIBRATION_TITLE_MAX} characters` }),
  heldOn: isoDate.optional(),
  referenceSetId: z.string({ message: 'must be a reference-set id' }).regex(REFERENCE_SET_ID_PATTERN, { message: 'must be a reference-set id like v1' }).optional(),
  restricted: z.boolean({ message: 'must be true or false' }).optional(),
  thresholds: z
    .object(
      {
        kappa: z.number({ message: 'must be a number' }).min(-1, { message: 'must be from −1 to 1' }).max(1, { message: 'must be from −1 to 1' }).optional(),
        deltaE00: z.number({ message: 'must be a number' }).gt(0, { message: 'must be greater than 0' }).max(100, { message: 'must be at most 100' }).optional(),
      },
      { message: 'must be {kappa, deltaE00}' },
    )
    .optional(),
});
export type CreateSessionBody = z.infer<typeof createSessionBody>;

/** `POST /api/calibration/sessions/:id/specimens`: a label and exactly one of lab, photoId + region, chipCode. */
export const createSpecimenBody = z
  .object({
    label: z.string({ message: 'is required' }).trim().min(1, { message: 'is required' }).max(SPECIMEN_LABEL_MAX, { message: `must be at most ${SPECIMEN_LABEL_MAX} characters` }),
    lab: labTuple.optional(),
    photoId: id('photo').optional(),
    region: regionSchema.optional(),
    chipCode: chipCode.optional(),
  })
  .superRefine((body, ctx) => {
    const sources = [body.lab !== undefined, body.photoId !== undefined || body.region !== undefined, body.chipCode !== undefined].filter(Boolean).length;
    if (sources === 0) {
      ctx.addIssue({ code: 'custom', path: ['lab'], message: 'give a reference colour: lab, photoId with region, or chipCode' });
      return;
    }
    if (sources > 1) {
      ctx.addIssue({ code: 'custom', path: ['lab'], message: 'give one reference colour: lab, photoId with region, or chipCode, not several' });
      return;
    }
    if (body.photoId !== undefined && body.region === undefined) ctx.addIssue({ code: 'custom', path: ['region'], message: 'is required with photoId' });
    if (body.region !== undefined && body.photoId === undefined) ctx.addIssue({ code: 'custom', path: ['photoId'], message: 'is required with region' });
  });
export type CreateSpecimenBody = z.infer<typeof createSpecimenBody>;

/** `POST /api/calibration/sessions/:id/responses`. */
export const createResponseBody = z.object({
  specimenId: id('specimen'),
  chipCode,
});
export type CreateResponseBody = z.infer<typeof createResponseBody>;

/** `POST /api/calibration/sessions/:id/participants`. */
export const inviteParticipantsBody = z.object({
  userIds: z
    .array(id('user'), { message: 'must be a list of user ids' })
    .min(1, { message: 'must name at least one user' })
    .max(INVITE_MAX, { message: `may name at most ${INVITE_MAX} users` }),
});
export type InviteParticipantsBody = z.infer<typeof inviteParticipantsBody>;

/** `POST /api/calibration/screenings`. */
export const createScreeningBody = z.object({
  userId: id('user').optional(),
  screenedOn: isoDate,
  method: z.enum(SCREENING_METHODS, { message: `must be one of ${SCREENING_METHODS.join(', ')}` }),
  result: z.enum(SCREENING_RESULTS, { message: `must be one of ${SCREENING_RESULTS.join(', ')}` }),
  notes: z.string({ message: 'must be text' }).trim().max(SCREENING_NOTES_MAX, { message: `must be at most ${SCREENING_NOTES_MAX} characters` }).optional(),
});
export type CreateScreeningBody = z.infer<typeof createScreeningBody>;

/** `GET /api/calibration/screenings?userId=` and `GET /api/calibration/certifications?userId=` (trainers and admins may filter). */
export const userFilterQuery = z.object({
  userId: z.coerce.number({ message: 'must be a user id' }).int({ message: 'must be a user id' }).positive({ message: 'must be a user id' }).optional(),
});
