import { stringify } from 'csv-stringify/sync';
import { spreadsheetSafeRow } from '../core/spreadsheet-safe.js';
import type { DataSource } from 'typeorm';
import { MCPD_FIELDS, type McpdField } from '../../shared/api/collection-answers.js';
import { Accession } from './accession.entity.js';

/*
 * The passport export after FAO/Bioversity Multi-Crop Passport Descriptors V.2.1 (Alercia,
 * Diulgheroff & Mackay 2015): every field in the standard's order, several values
 * in one field separated by ";", dates YYYYMMDD with hyphens for unknown parts (stored so).
 * Coordinates and elevation are those of the site that holds the accession, because Hueledger
 * keeps no collecting-site coordinates; say so to anyone who reads DECLATITUDE as MCPD defines it.
 */

/** MCPD separates several values of one field with ";" (V.2.1, general notes). */
const MULTI_VALUE_SEPARATOR = ';';

/** Decimal degrees to 4 places: about 11 m of latitude, finer than a plot. */
function degrees(value: number | null): string {
  return value === null ? '' : value.toFixed(4);
}

/** One accession as an MCPD row; fields Hueledger does not hold stay blank. */
export function toMcpdRow(a: Accession): Record<McpdField, string> {
  const row = Object.fromEntries(MCPD_FIELDS.map((f) => [f, ''])) as Record<McpdField, string>;
  // A ";" inside a single name would read as two names: MCPD leaves no escape, so it becomes ",".
  const names = [a.name, ...a.otherNames].map((n) => n.replaceAll(MULTI_VALUE_SEPARATOR, ','));
  return Object.assign(row, {
    INSTCODE: a.instituteCode ?? '',
    ACCENUMB: a.accessionNumber,
    GENUS: a.genus,
    SPECIES: a.species,
    SPAUTHOR: a.speciesAuthor,
    CROPNAME: a.cropName,
    ACCENAME: names.join(MULTI_VALUE_SEPARATOR),
    ACQDATE: a.acquisitionDate ?? '',
    ORIGCTY: a.originCountry ?? '',
    COLLSITE: a.collectingSite ?? '',
    DECLATITUDE: degrees(a.site.latitude),
    DECLONGITUDE: degrees(a.site.longitude),
    ELEVATION: a.site.elevationM === null ? '' : String(Math.round(a.site.elevationM)),
    SAMPSTAT: a.sampleStatus === null ? '' : String(a.sampleStatus),
    DONORNAME: a.donorName ?? '',
    REMARKS: a.remarks ?? '',
  } satisfies Partial<Record<McpdField, string>>);
}

/** Every accession as MCPD passport CSV: a header of field names, CRLF line ends (RFC 4180), quotes where needed. */
export async function mcpdCsv(ds: DataSource): Promise<string> {
  const accessions = await ds.getRepository(Accession).find({ relations: { site: true }, order: { accessionNumber: 'ASC' } });
  return stringify(accessions.map((a) => spreadsheetSafeRow(toMcpdRow(a))), { header: true, columns: [...MCPD_FIELDS], record_delimiter: 'windows' });
}
