// What other components (reviews) use to show a reading: the relations a list row needs, the
// audit subject, and the row's API shape (kept in reading-list.ts beside the query).
export { readingSubject } from './reading-detail.js';
export { toReadingDto } from './reading-list.js';

/** The relations a reading's list row needs (`toReadingDto` reads them). */
export const READING_ROW_RELATIONS = { accession: true, plant: true, character: true, site: true, observer: true } as const;
