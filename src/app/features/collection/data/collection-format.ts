import type { Accession, Season, Site } from '../../../../../shared/api/collection-answers.js';

/** A season as "wet 11-01 → 04-30" (month-day, inclusive; it may wrap the year end). */
export function seasonLabel(season: Season): string {
  return `${season.name} ${season.start} → ${season.end}`;
}

/** A site's whole season scheme in one line, or a plain note when it has none. */
export function seasonsLabel(seasons: readonly Season[]): string {
  return seasons.length === 0 ? 'No seasons set' : seasons.map(seasonLabel).join('; ');
}

/** An accession as the collection table shows it. */
export interface AccessionRow {
  id: number;
  accessionNumber: string;
  name: string;
  site: string;
  otherNames: string;
  plantCount: number;
}

/** Flattens accessions for display, naming each one's site ("CODE · Name"). */
export function accessionRows(accessions: readonly Accession[], sites: readonly Site[]): AccessionRow[] {
  const siteNames = new Map(sites.map((site) => [site.id, `${site.code} · ${site.name}`]));
  return accessions.map((accession) => ({
    id: accession.id,
    accessionNumber: accession.accessionNumber,
    name: accession.name,
    site: siteNames.get(accession.siteId) ?? `site ${accession.siteId}`,
    otherNames: accession.otherNames.join('; '),
    plantCount: accession.plants.length,
  }));
}

/** Rows whose text columns contain the search text, ignoring case. */
export function matchAccessions(rows: readonly AccessionRow[], search: string): AccessionRow[] {
  const needle = search.trim().toLowerCase();
  if (!needle) return [...rows];
  return rows.filter((row) =>
    [row.accessionNumber, row.name, row.site, row.otherNames].some((text) => text.toLowerCase().includes(needle)),
  );
}

/** Rows sorted by one column; numbers numerically, text in natural order ("A-2" before "A-10"). */
export function sortAccessions(rows: readonly AccessionRow[], column: keyof AccessionRow, direction: 'asc' | 'desc' | ''): AccessionRow[] {
  if (direction === '') return [...rows];
  const sign = direction === 'asc' ? 1 : -1;
  const collator = new Intl.Collator('en', { numeric: true, sensitivity: 'base' });
  return [...rows].sort((a, b) => {
    const x = a[column];
    const y = b[column];
    return sign * (typeof x === 'number' && typeof y === 'number' ? x - y : collator.compare(String(x), String(y)));
  });
}
