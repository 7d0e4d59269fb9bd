import { z } from 'zod';
import { REFERENCE_SET_ID_PATTERN } from './reference-set-answers.js';

export * from './profile-answers.js';

/** `GET /api/accessions/:id/profile[?setId=]`: the reference set to name chips from (the current one by default). */
export const profileQuery = z
  .object({
    setId: z.string({ message: 'must be a reference set id such as v1' }).regex(REFERENCE_SET_ID_PATTERN, { message: 'must be a reference set id such as v1' }).optional(),
  })
  .strict();
export type ProfileQuery = z.infer<typeof profileQuery>;

/** The fewest characters two accessions must share before they can be called possible duplicates (our own choice). */
export const MIN_SHARED_DEFAULT = 3;

const count = (what: string, max: number) =>
  z.coerce
    .number({ message: `must be a number of ${what}` })
    .int({ message: `must be a whole number of ${what}` })
    .min(1, { message: `must be from 1 to ${max} ${what}` })
    .max(max, { message: `must be from 1 to ${max} ${what}` });

/** `GET /api/accessions/:id/similar[?limit=&minShared=]`. */
export const similarQuery = z
  .object({
    limit: count('accessions', 200).default(20),
    minShared: count('characters', 50).default(MIN_SHARED_DEFAULT),
  })
  .strict();
export type SimilarQuery = z.infer<typeof similarQuery>;

/** `GET /api/accessions/duplicates[?minShared=]`. */
export const duplicatesQuery = z.object({ minShared: count('characters', 50).default(MIN_SHARED_DEFAULT) }).strict();
export type DuplicatesQuery = z.infer<typeof duplicatesQuery>;

/** Routes that take no query parameters: anything given is refused. */
export const noQuery = z.object({}).strict();
