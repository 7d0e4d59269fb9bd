import { stringify } from 'csv-stringify/sync';
import { spreadsheetSafeRow } from '../core/spreadsheet-safe.js';
import type { DataSource } from 'typeorm';
import { MCPD_FIELDS, type McpdField } from '../../shared/api/collection-answers.js';
import { Accession } from './accession.entity.js';

/*
 * The passport export after FAO/Bioversity Multi-Crop Passport Descriptors V.2.1 (Alercia,
 * Diulgheroff & Mackay 2015): every field in the standard's order, several values
 * in one field separated by ";", dates YYYYMMDD with hyphens for unknown parts (stored so).
 * DECLATITUDE, DECLONGITUDE and ELEVATION are where the sample was collected, as MCPD defines
 * them: the accession's own collecting coordinates, left blank when unknown, never the holding
 * site's. A last report row (no ACCENUMB) names the accessions without INSTCODE, which MCPD
 * requires, so the file's reader sees what to fix before sending it on.
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
    DECLATITUDE: degrees(a.collectingLatitude ?? null),
    DECLONGITUDE: degrees(a.collectingLongitude ?? null),
    ELEVATION: a.collectingElevationM == null ? '' : String(Math.round(a.collectingElevationM)),
    SAMPSTAT: a.sampleStatus === null ? '' : String(a.sampleStatus),
    DONORNAME: a.donorName ?? '',
    REMARKS: a.remarks ?? '',
  } satisfies Partial<Record<McpdField, string>>);
}

/** The report row: every field blank but REMARKS, which names the accessions lacking INSTCODE; null when none lacks it. */
export function instcodeReportRow(accessions: readonly Accession[]): Record<McpdField, string> | null {
  const missing = accessions.filter((a) => !a.instituteCode?.trim()).map((a) => a.accessionNumber);
  if (!missing.length) return null;
  const row = Object.fromEntries(MCPD_FIELDS.map((f) => [f, ''])) as Record<McpdField, string>;
  row.REMARKS = `Export report, not an accession: INSTCODE (required by MCPD) is missing for ${missing.length} accession${missing.length === 1 ? '' : 's'}: ${missing.join(', ')}.`;
  return row;
}

/** Every accession as MCPD passport CSV: a header of field names, CRLF line ends (RFC 4180), quotes where needed, and the INSTCODE report row when one is missing. */
export async function mcpdCsv(ds: DataSource): Promise<string> {
  const accessions = await ds.getRepository(Accession).find({ relations: { site: true }, order: { accessionNumber: 'ASC' } });
  const report = instcodeReportRow(accessions);
  const rows = [...accessions.map(toMcpdRow), ...(report ? [report] : [])];
  return stringify(rows.map((r) => spreadsheetSafeRow(r)), { header: true, columns: [...MCPD_FIELDS], record_delimiter: 'windows' });
}
