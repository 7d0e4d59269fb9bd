// CSV import of instrument readings, all or nothing: every row is checked first (names resolved,
// values validated by the same schema as POST /api/readings, ids and chips checked by the same
// preparation); one bad row and nothing is written, with every bad row reported; otherwise all
// rows go in one transaction.
//
// The file: UTF-8 (a BOM is fine), comma-separated, RFC 4180 quoting, a header row naming the
// columns in any order (IMPORT_COLUMNS in shared/api/reading-answers.ts):
//   accessionNumber  required  e.g. HL-0001
//   characterCode    required  e.g. petiole.third.upper
//   observedAt       required  ISO 8601 with an offset, e.g. 2026-02-10T09:30:00+12:00
//   L, a, b          required  CIELAB as the instrument gives it (L 0–100, a and b ±200)
//   illuminant       optional  D65/10, D65/2, D50/2 or other: what the instrument reports; D50/2 is
//                              adapted to D65/2 (Bradford) as POST /api/readings does
//   light            optional  ambient light, kept if given (the instrument lights the sample itself)
//   plantLabel       optional  a plant of that accession, e.g. P2
//   siteCode         optional  default: the plant's site, else the accession's
//   instrument, eyeChipCode, secondsSinceCut, leafPosition, notes   optional
import { parse as parseCsv } from 'csv-parse/sync';
import { In } from 'typeorm';
import { IMPORT_COLUMNS, IMPORT_ROWS_MAX, type ImportReport, type ImportRowReport } from '../../shared/api/reading-answers.js';
import { createReadingBody } from '../../shared/api/readings.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import type { User } from '../auth/user.entity.js';
import { Accession, Plant } from '../collection/accession.entity.js';
import { Character } from '../collection/character.entity.js';
import { Site } from '../collection/site.entity.js';
import { AppError, type FieldError } from '../core/app-error.js';
import { controlCharacterErrors } from '../core/validate.js';
import { prepareReading, type ReadingValues } from './reading-input.js';
import { insertReading, type ReadingsDeps } from './readings.js';

const REQUIRED: readonly string[] = ['accessionNumber', 'characterCode', 'observedAt', 'L', 'a', 'b'];

/** The import was refused: 422 problem+json whose `rows` lists every bad row; nothing was written. */
export class ImportRefused extends AppError {
  constructor(readonly rows: ImportRowReport[]) {
    const bad = rows.filter((r) => !r.ok);
    super(
      422,
      'Import refused',
      `${bad.length} row${bad.length === 1 ? '' : 's'} of the file cannot be imported, so nothing was: ${bad.map((r) => `row ${r.row}: ${r.errors.map((e) => `${e.field} ${e.message}`).join('; ')}`).join(' | ')}.`,
      bad.flatMap((r) => r.errors.map((e) => ({ field: `row ${r.row}: ${e.field}`, message: e.message }))),
      'import-refused',
      // The row-by-row report, so a client can show each bad row.
      { rows },
    );
  }
}

/** Where a schema or preparation field shows in the file. */
const COLUMN_OF: Record<string, string> = {
  accessionId: 'accessionNumber',
  characterId: 'characterCode',
  siteId: 'siteCode',
  plantId: 'plantLabel',
  'lab.0': 'L',
  'lab.1': 'a',
  'lab.2': 'b',
};

interface Parsed {
  header: string[];
  records: { cells: string[]; row: number }[];
}

function readFile(bytes: Buffer): Parsed {
  let parsed: { record: string[]; info: { lines: number } }[];
  try {
    parsed = parseCsv(bytes, { bom: true, trim: true, skip_empty_lines: true, info: true, relax_column_count: true }) as unknown as typeof parsed;
  } catch (err) {
    const line = (err as { lines?: number }).lines ?? 1;
    throw new ImportRefused([{ row: line, ok: false, errors: [{ field: 'file', message: `is not readable CSV here: ${(err as Error).message}` }] }]);
  }
  const [head, ...rest] = parsed;
  if (!head) throw AppError.badRequest('The file is empty: it needs a header row and at least one reading.', [{ field: 'file', message: 'is empty' }]);
  if (rest.length === 0) throw AppError.badRequest('The file has a header but no readings.', [{ field: 'file', message: 'has no readings' }]);
  if (rest.length > IMPORT_ROWS_MAX) throw AppError.badRequest(`The file has ${rest.length} readings; import at most ${IMPORT_ROWS_MAX} at a time.`, [{ field: 'file', message: `has more than ${IMPORT_ROWS_MAX} rows` }]);
  return { header: head.record, records: rest.map((r) => ({ cells: r.record, row: r.info.lines })) };
}

function headerErrors(header: string[]): FieldError[] {
  const known = new Set<string>(IMPORT_COLUMNS);
  const errors: FieldError[] = header.filter((h) => !known.has(h)).map((h) => ({ field: h || '(blank)', message: `is not a column of the import (columns: ${IMPORT_COLUMNS.join(', ')})` }));
  for (const h of new Set(header.filter((h, i) => header.indexOf(h) !== i))) errors.push({ field: h, message: 'appears twice' });
  for (const r of REQUIRED.filter((c) => !header.includes(c))) errors.push({ field: r, message: 'column is missing' });
  return errors;
}

/** The rows the file names, fetched once: accessions by number, characters by code, sites by code, plants by accession and label. */
async function namesOf(deps: ReadingsDeps, rows: Record<string, string>[]) {
  const distinct = (col: string) => [...new Set(rows.map((r) => r[col]).filter((v): v is string => !!v))];
  const m = deps.ds.manager;
  const accessions = new Map((await m.find(Accession, { where: { accessionNumber: In(distinct('accessionNumber')) } })).map((a) => [a.accessionNumber, a]));
  const characters = new Map((await m.find(Character, { where: { code: In(distinct('characterCode')) } })).map((c) => [c.code, c]));
  const sites = new Map((await m.find(Site, { where: { code: In(distinct('siteCode')) } })).map((s) => [s.code, s]));
  const plantRows = accessions.size ? await m.find(Plant, { where: { accession: { id: In([...accessions.values()].map((a) => a.id)) } }, relations: { accession: true } }) : [];
  const plants = new Map(plantRows.map((p) => [`${p.accession.id}/${p.label}`, p]));
  return { accessions, characters, sites, plants };
}

/** A cell as a number: undefined when empty, NaN when it is not a plain decimal. */
function numberOf(text: string | undefined): number | undefined {
  if (text === undefined || text === '') return undefined;
  return /^[-+]?(\d+\.?\d*|\.\d+)([eE][-+]?\d+)?$/.test(text) ? Number(text) : NaN;
}

/** A row as a `POST /api/readings` body, names resolved to ids; what cannot be resolved is an error of its column. */
function bodyOf(row: Record<string, string>, names: Awaited<ReturnType<typeof namesOf>>, errors: FieldError[]): unknown {
  const accession = names.accessions.get(row['accessionNumber'] ?? '');
  if (row['accessionNumber'] && !accession) errors.push({ field: 'accessionNumber', message: `${row['accessionNumber']} is not an accession` });
  const character = names.characters.get(row['characterCode'] ?? '');
  if (row['characterCode'] && !character) errors.push({ field: 'characterCode', message: `${row['characterCode']} is not a character` });
  const site = row['siteCode'] ? names.sites.get(row['siteCode']) : undefined;
  if (row['siteCode'] && !site) errors.push({ field: 'siteCode', message: `${row['siteCode']} is not a site` });
  const plant = row['plantLabel'] && accession ? names.plants.get(`${accession.id}/${row['plantLabel']}`) : undefined;
  if (row['plantLabel'] && accession && !plant) errors.push({ field: 'plantLabel', message: `${accession.accessionNumber} has no plant ${row['plantLabel']}` });
  const numbers = { L: numberOf(row['L']), a: numberOf(row['a']), b: numberOf(row['b']), secondsSinceCut: numberOf(row['secondsSinceCut']) };
  for (const [col, v] of Object.entries(numbers)) if (Number.isNaN(v)) errors.push({ field: col, message: `"${row[col]}" is not a number` });
  for (const col of ['L', 'a', 'b'] as const) if (numbers[col] === undefined) errors.push({ field: col, message: 'is required' });
  // A missing or unreadable L*, a* or b* is reported above under its own column; 0 stands in so the schema checks the rest.
  const lab = [numbers.L, numbers.a, numbers.b].map((v) => (v === undefined || Number.isNaN(v) ? 0 : v));
  const text = (col: string) => row[col] || undefined;
  return {
    // Unresolved names become an id no row has, so the schema's own checks of the other columns still run.
    accessionId: accession?.id ?? (row['accessionNumber'] ? 0 : undefined),
    plantId: plant?.id,
    characterId: character?.id ?? (row['characterCode'] ? 0 : undefined),
    siteId: site?.id,
    observedAt: text('observedAt'),
    method: 'instrument',
    lab,
    light: text('light'),
    illuminant: text('illuminant'),
    instrument: text('instrument'),
    eyeChipCode: text('eyeChipCode'),
    secondsSinceCut: Number.isNaN(numbers.secondsSinceCut) ? undefined : numbers.secondsSinceCut,
    leafPosition: text('leafPosition'),
    notes: text('notes'),
  };
}

/** Errors of a row whose own column already explains them are not repeated (an unknown accession is not also "must be a positive id"). */
function addErrors(into: FieldError[], more: FieldError[]): void {
  for (const e of more) {
    const field = COLUMN_OF[e.field] ?? e.field;
    if (!into.some((x) => x.field === field)) into.push({ field, message: e.message });
  }
}

async function checkRow(deps: ReadingsDeps, observer: User, row: Record<string, string>, names: Awaited<ReturnType<typeof namesOf>>): Promise<{ errors: FieldError[]; values?: ReadingValues }> {
  const errors: FieldError[] = [];
  const body = bodyOf(row, names, errors);
  const parsed = createReadingBody.safeParse(body);
  if (!parsed.success) {
    addErrors(errors, parsed.error.issues.map((i) => ({ field: i.path.length ? i.path.join('.') : 'row', message: i.message })));
    return { errors };
  }
  addErrors(errors, controlCharacterErrors(parsed.data, 'row'));
  if (errors.length) return { errors };
  try {
    return { errors, values: await prepareReading(deps.ds.manager, deps, parsed.data, observer.id) };
  } catch (err) {
    if (err instanceof AppError && err.status === 400) {
      addErrors(errors, err.errors ?? [{ field: 'row', message: err.detail ?? err.title }]);
      return { errors };
    }
    throw err;
  }
}

/**
 * Imports a CSV of instrument readings as the observer: 201 with every row imported, or
 * `ImportRefused` (422) listing every bad row with its row number (the file's line; the header is
 * row 1), column and why, with nothing written. A file that is not a table of readings at all
 * (empty, no data rows, too many rows) is a 400 naming `file`.
 */
export async function importReadings(deps: ReadingsDeps, actor: Actor, observer: User, bytes: Buffer): Promise<ImportReport> {
  const { header, records } = readFile(bytes);
  const bad = headerErrors(header);
  if (bad.length) throw new ImportRefused([{ row: 1, ok: false, errors: bad }]);
  const rows = records.map((r) => Object.fromEntries(header.map((h, i) => [h, r.cells[i] ?? ''])));
  const names = await namesOf(deps, rows);
  const report: ImportRowReport[] = [];
  const values: ReadingValues[] = [];
  for (const [i, row] of rows.entries()) {
    const cells = records[i]!.cells.length;
    const checked =
      cells === header.length ? await checkRow(deps, observer, row, names) : { errors: [{ field: 'row', message: `has ${cells} values; the header has ${header.length}` }], values: undefined };
    report.push({ row: records[i]!.row, ok: checked.errors.length === 0, errors: checked.errors });
    if (checked.values) values.push(checked.values);
  }
  if (report.some((r) => !r.ok)) throw new ImportRefused(report);
  const readingIds = await deps.ds.transaction(async (m) => {
    const ids: number[] = [];
    for (const v of values) ids.push(await insertReading(m, actor, v, { imported: true }));
    await recordAudit(m, actor, 'readings.imported', null, { count: ids.length, first: ids[0], last: ids.at(-1) });
    return ids;
  });
  return { imported: readingIds.length, readingIds, rows: report };
}
