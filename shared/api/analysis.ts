import { z } from 'zod';

export * from './analysis-answers.js';

const queryId = (what: string) =>
  z.coerce
    .number({ message: `must be the number of ${what}` })
    .int({ message: 'must be a whole number' })
    .positive({ message: 'must be a positive whole number' });

/** `GET /api/analysis/drift?accessionId=&characterId=[&siteId=]`: unknown parameters refused. */
export const driftQuery = z
  .object({
    accessionId: queryId('an accession'),
    characterId: queryId('a character'),
    siteId: queryId('a site').optional(),
  })
  .strict();
export type DriftQuery = z.infer<typeof driftQuery>;

/** `GET /api/analysis/sites?accessionId=&characterId=[&season=&seasonYear=]`: one season group's sites only when both are given. */
export const siteComparisonQuery = z
  .object({
    accessionId: queryId('an accession'),
    characterId: queryId('a character'),
    season: z.string({ message: 'must be a season name' }).trim().min(1, { message: 'must be a season name' }).max(40, { message: 'must be at most 40 characters' }).optional(),
    seasonYear: z.coerce.number({ message: 'must be a year' }).int({ message: 'must be a whole year' }).min(1900, { message: 'must be a year from 1900 to 2200' }).max(2200, { message: 'must be a year from 1900 to 2200' }).optional(),
  })
  .strict()
  .superRefine((q, ctx) => {
    if ((q.season === undefined) !== (q.seasonYear === undefined)) {
      ctx.addIssue({ code: 'custom', path: [q.season === undefined ? 'season' : 'seasonYear'], message: 'season and seasonYear go together: give both or neither' });
    }
  });
export type SiteComparisonQuery = z.infer<typeof siteComparisonQuery>;

/** `GET /api/analysis/overview`: no parameters (the whole collection); anything else is refused. */
export const driftOverviewQuery = z.object({}).strict();
