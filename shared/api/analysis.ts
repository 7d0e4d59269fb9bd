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

/** `GET /api/analysis/sites?accessionId=&characterId=`. */
export const siteComparisonQuery = z
  .object({
    accessionId: queryId('an accession'),
    characterId: queryId('a character'),
  })
  .strict();
export type SiteComparisonQuery = z.infer<typeof siteComparisonQuery>;

/** `GET /api/analysis/overview`: no parameters (the whole collection); anything else is refused. */
export const driftOverviewQuery = z.object({}).strict();
