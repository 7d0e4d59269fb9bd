import { z } from 'zod';

import { LAB_INPUT_LIMITS, REFERENCE_SET_ID_PATTERN } from './reference-set-answers.js';
import { PRINT_KINDS, PRINT_NOTE_MAX, PRINT_PATCHES_MAX } from './print-batch-answers.js';

export * from './print-batch-answers.js';

const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;

/** `POST /api/print-batches`: which set, what was printed, when, on what. */
export const createPrintBatchBody = z
  .object({
    setId: z.string({ message: 'must be a reference-set id like v2' }).regex(REFERENCE_SET_ID_PATTERN, { message: 'must be a reference-set id like v2' }),
    kind: z.enum(PRINT_KINDS, { message: `must be one of ${PRINT_KINDS.join(', ')}` }),
    printedOn: z.iso.date({ message: 'must be a date YYYY-MM-DD' }),
    note: z.string({ message: 'is required: name the printer and paper' }).trim().min(1, { message: 'is required: name the printer and paper' }).max(PRINT_NOTE_MAX, { message: `must be at most ${PRINT_NOTE_MAX} characters` }),
  })
  .strict();
export type CreatePrintBatchBody = z.infer<typeof createPrintBatchBody>;

const measured = z.tuple(
  [
    z.number({ message: 'L* must be a number' }).min(lMin, { message: `L* must be from ${lMin} to ${lMax}` }).max(lMax, { message: `L* must be from ${lMin} to ${lMax}` }),
    z.number({ message: 'a* must be a number' }).min(-abMax, { message: `a* must be from ${-abMax} to ${abMax}` }).max(abMax, { message: `a* must be from ${-abMax} to ${abMax}` }),
    z.number({ message: 'b* must be a number' }).min(-abMax, { message: `b* must be from ${-abMax} to ${abMax}` }).max(abMax, { message: `b* must be from ${-abMax} to ${abMax}` }),
  ],
  { message: 'must be [L*, a*, b*], three numbers (CIELAB D65/2°)' },
);

/** `POST /api/print-batches/:id/patches`: printed patches measured with an instrument, all or nothing; a chip once per request. */
export const addPrintPatchesBody = z
  .object({
    patches: z
      .array(
        z.object({ chipCode: z.string({ message: 'must be a chip code' }).trim().regex(/^F-\d{3}(\.\d{3})?$/, { message: 'must be a chip code like F-087 or F-087.014' }), lab: measured }).strict(),
        { message: 'must be a list of measured patches' },
      )
      .min(1, { message: 'must hold at least one patch' })
      .max(PRINT_PATCHES_MAX, { message: `must hold at most ${PRINT_PATCHES_MAX} patches` }),
  })
  .strict()
  .superRefine((body, ctx) => {
    body.patches.forEach((p, i) => {
      const first = body.patches.findIndex((o) => o.chipCode === p.chipCode);
      if (first < i) ctx.addIssue({ code: 'custom', path: ['patches', i, 'chipCode'], message: `${p.chipCode} is given twice (patch ${first + 1} too)` });
    });
  });
export type AddPrintPatchesBody = z.infer<typeof addPrintPatchesBody>;
