// Readings as spreadsheets: the rows the list's filters select (every page, superseded ones only
// when asked), as CSV (csv-stringify) or XLSX (exceljs). One column list serves both, so the two
// files always hold the same columns in the same order.
import { stringify } from 'csv-stringify';
import ExcelJS from 'exceljs';
import type { Writable } from 'node:stream';
import { IsNull, Not, type DataSource } from 'typeorm';
import { Descriptor } from '../collection/descriptor.entity.js';
import { Observation } from '../collection/observation.entity.js';
import type { ListReadingsQuery } from '../../shared/api/readings.js';
import { clusterWords } from '../../shared/api/reading-answers.js';
import { labToLch } from '../../shared/colour/lab.js';
import { spreadsheetSafe } from '../core/spreadsheet-safe.js';
import type { Reading } from './reading.entity.js';
import { readingsQuery } from './reading-list.js';
import { nameBestChips } from '../reference-sets/chip-names.js';

/** Rows read per query while exporting: bounded memory whatever the filters select. */
const BATCH = 500;

type Cell = string | number | null;

/** One exported column: its header, how wide in XLSX, its number format, and its value. */
interface ExportColumn {
  header: string;
  width: number;
  numFmt?: string;
  value(r: Reading, publicUrl: string): Cell;
  /** The XLSX cell when it differs from the CSV text: a real date, which spreadsheets sort and filter as one. */
  xlsx?(r: Reading): Date | Cell;
}

/** Site-local wall-clock time as a Date whose UTC fields hold it: spreadsheet dates carry no time zone. */
function siteLocalDate(instant: Date, timeZone: string): Date {
  const [date, time] = siteLocalTime(instant, timeZone).split(' ');
  return new Date(`${date}T${time}:00Z`);
}

const localFormats = new Map<string, Intl.DateTimeFormat>();

/** "YYYY-MM-DD HH:MM" on the site's clock (ECMA-402 `Intl.DateTimeFormat`, no time-zone library). */
export function siteLocalTime(instant: Date, timeZone: string): string {
  let f = localFormats.get(timeZone);
  if (!f) {
    f = new Intl.DateTimeFormat('en-CA', { timeZone, year: 'numeric', month: '2-digit', day: '2-digit', hour: '2-digit', minute: '2-digit', hourCycle: 'h23', calendar: 'gregory', numberingSystem: 'latn' });
    localFormats.set(timeZone, f);
  }
  const p = Object.fromEntries(f.formatToParts(instant).map((x) => [x.type, x.value]));
  return `${p['year']}-${p['month']}-${p['day']} ${p['hour']}:${p['minute']}`;
}

const lchOf = (r: Reading) => labToLch({ l: r.l, a: r.a, b: r.b });
const round = (x: number, places: number) => Math.round(x * 10 ** places) / 10 ** places;

/** The columns of both exports, in order. Colour values to 2 places: finer than any instrument repeats. */
export const EXPORT_COLUMNS: readonly ExportColumn[] = [
  { header: 'id', width: 8, value: (r) => r.id },
  { header: 'observed at (site local)', width: 18, numFmt: 'yyyy-mm-dd hh:mm', value: (r) => siteLocalTime(r.observedAt, r.site!.timezone), xlsx: (r) => siteLocalDate(r.observedAt, r.site!.timezone) },
  { header: 'site time zone', width: 20, value: (r) => r.site!.timezone },
  { header: 'observed at (UTC)', width: 20, numFmt: 'yyyy-mm-dd hh:mm:ss', value: (r) => r.observedAt.toISOString(), xlsx: (r) => r.observedAt },
  { header: 'accession', width: 12, value: (r) => r.accession!.accessionNumber },
  { header: 'accession name', width: 18, value: (r) => r.accession!.name },
  { header: 'plant', width: 8, value: (r) => r.plant?.label ?? null },
  { header: 'character', width: 22, value: (r) => r.character!.code },
  { header: 'site', width: 8, value: (r) => r.site!.code },
  { header: 'season', width: 12, value: (r) => r.season },
  { header: 'season-year', width: 11, value: (r) => r.seasonYear },
  { header: 'plant age (months)', width: 10, value: (r) => r.plantAgeMonths },
  { header: 'observer', width: 20, value: (r) => r.observer!.name },
  { header: 'method', width: 11, value: (r) => r.method },
  { header: 'L*', width: 8, numFmt: '0.00', value: (r) => round(r.l, 2) },
  { header: 'a*', width: 8, numFmt: '0.00', value: (r) => round(r.a, 2) },
  { header: 'b*', width: 8, numFmt: '0.00', value: (r) => round(r.b, 2) },
  { header: 'C*ab', width: 8, numFmt: '0.00', value: (r) => round(lchOf(r).c, 2) },
  { header: 'h°ab', width: 8, numFmt: '0.0', value: (r) => round(lchOf(r).h, 1) },
  { header: 'hex', width: 10, value: (r) => r.hex },
  { header: 'in sRGB gamut', width: 8, value: (r) => (r.inGamut ? 'yes' : 'no') },
  { header: 'best chip', width: 12, value: (r) => r.bestChipCode },
  { header: 'best chip name', width: 24, value: (r) => r.bestChipName },
  { header: 'ΔE00', width: 8, numFmt: '0.00', value: (r) => round(r.deltaE00, 2) },
  { header: 'eye chip', width: 12, value: (r) => r.eyeChipCode },
  { header: 'eye ΔE00', width: 8, numFmt: '0.00', value: (r) => (r.eyeDeltaE00 === null ? null : round(r.eyeDeltaE00, 2)) },
  { header: 'light', width: 13, value: (r) => r.light },
  { header: 'seconds since cut', width: 9, numFmt: '0', value: (r) => r.secondsSinceCut },
  { header: 'leaf', width: 14, value: (r) => r.leafPosition },
  { header: 'notes', width: 30, value: (r) => r.notes },
  { header: 'status', width: 12, value: (r) => r.status },
  { header: 'supersedes', width: 10, value: (r) => r.supersedesId },
  { header: 'superseded by', width: 10, value: (r) => r.supersededById },
  { header: 'set id', width: 7, value: (r) => r.setId },
  { header: 'instrument', width: 14, value: (r) => r.instrument },
  { header: 'illuminant/observer', width: 10, value: (r) => r.illuminant },
  { header: 'reported L*a*b*', width: 20, value: (r) => (r.reportedLab ? r.reportedLab.join(' ') : null) },
  { header: 'photo id', width: 8, value: (r) => r.photoId },
  // A region that split into colours: which one this reading took (1 = the largest share), of how many, and its share.
  { header: 'photo colour', width: 9, value: (r) => (r.cluster ? clusterWords(r.cluster) : null) },
  { header: 'photo colour share', width: 9, numFmt: '0%', value: (r) => (r.cluster ? round(r.cluster.share, 3) : null) },
  { header: 'provenance link', width: 36, value: (r, url) => `${url}/readings/${r.id}` },
];

/** Index of the hex column, whose XLSX cells are filled with the colour. */
const HEX_COLUMN = EXPORT_COLUMNS.findIndex((c) => c.header === 'hex');

/** Every reading the filters select, in the list's order, a batch at a time. */
async function* selectedReadings(ds: DataSource, q: ListReadingsQuery): AsyncGenerator<Reading> {
  for (let offset = 0; ; offset += BATCH) {
    const rows = await readingsQuery(ds, q).offset(offset).limit(BATCH).getMany();
    yield* await nameBestChips(ds, rows);
    if (rows.length < BATCH) return;
  }
}

/** A CSV row: text typed by people (notes, names) made inert for spreadsheets (OWASP CSV injection). XLSX cells are typed, so text there never runs. */
function csvRowOf(columns: readonly ExportColumn[], r: Reading, publicUrl: string): Cell[] {
  return columns.map((c) => spreadsheetSafe(c.value(r, publicUrl)));
}

function xlsxRowOf(columns: readonly ExportColumn[], r: Reading, publicUrl: string): (Date | Cell)[] {
  return columns.map((c) => (c.xlsx ? c.xlsx(r) : c.value(r, publicUrl)));
}

/** The SI unit of a descriptor's stored values, for its column header. */
function unitWords(d: Descriptor): string {
  return d.kind === 'length' ? 'm' : d.kind === 'mass' ? 'kg' : d.kind === 'count' ? 'count' : d.kind === 'ratio' ? 'ratio' : 'category';
}

/**
 * One column per descriptor of the catalogue: the reading's plant's latest value (SI, or the
 * category id; ratios from the same plant's latest parts), so a colour can be read beside the
 * plant's size and shape. Readings of no particular plant leave them empty.
 */
export async function descriptorColumns(ds: DataSource): Promise<ExportColumn[]> {
  const descriptors = await ds.getRepository(Descriptor).find({ order: { sortOrder: 'ASC', id: 'ASC' } });
  const observations = await ds.getRepository(Observation).find({ where: { supersededBy: IsNull(), plant: Not(IsNull()) }, relations: { descriptor: true }, order: { observedAt: 'DESC', id: 'DESC' } });
  const latest = new Map<number, Map<string, Observation>>();
  for (const o of observations) {
    const byCode = latest.get(o.plantId!) ?? new Map<string, Observation>();
    latest.set(o.plantId!, byCode);
    if (!byCode.has(o.descriptor.code)) byCode.set(o.descriptor.code, o);
  }
  const valueOf = (d: Descriptor, plantId: number | null): Cell => {
    const byCode = plantId === null ? undefined : latest.get(plantId);
    if (!byCode) return null;
    if (d.kind === 'ratio') {
      const top = byCode.get(d.numeratorCode!)?.valueSi;
      const bottom = byCode.get(d.denominatorCode!)?.valueSi;
      return top == null || !bottom ? null : round(top / bottom, 4);
    }
    const o = byCode.get(d.code);
    return o ? (d.kind === 'category' ? o.category : o.valueSi) : null;
  };
  return descriptors.map((d) => ({ header: `plant ${d.code} (${unitWords(d)})`, width: 12, value: (r: Reading) => valueOf(d, r.plantId) }));
}

/** Writes the CSV (header row, CRLF line ends per RFC 4180, UTF-8 with a BOM so spreadsheets read ΔE and ° right) to `out`. */
export async function writeReadingsCsv(ds: DataSource, q: ListReadingsQuery, publicUrl: string, out: Writable): Promise<void> {
  const columns = [...EXPORT_COLUMNS, ...(await descriptorColumns(ds))];
  const csv = stringify({ header: true, columns: columns.map((c) => c.header), record_delimiter: 'windows', bom: true });
  csv.pipe(out);
  const done = new Promise<void>((resolve, reject) => {
    out.on('finish', resolve);
    out.on('error', reject);
    csv.on('error', reject);
  });
  for await (const r of selectedReadings(ds, q)) {
    if (!csv.write(csvRowOf(columns, r, publicUrl))) await new Promise((resolve) => csv.once('drain', resolve));
  }
  csv.end();
  await done;
}

/** Black or white text, whichever reads better on a fill (WCAG 2.x relative luminance, mid-point 0.179). */
function textOn(hex: string): string {
  const lin = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  const luminance = 0.2126 * lin[0]! + 0.7152 * lin[1]! + 0.0722 * lin[2]!;
  return luminance > 0.179 ? 'FF000000' : 'FFFFFFFF';
}

/** The XLSX: a bold, frozen header row, number formats on the colour columns, each hex cell filled with its colour. */
export async function readingsXlsx(ds: DataSource, q: ListReadingsQuery, publicUrl: string): Promise<Buffer> {
  const book = new ExcelJS.Workbook();
  book.creator = 'Hueledger';
  const sheet = book.addWorksheet('Readings', { views: [{ state: 'frozen', ySplit: 1 }] });
  const columns = [...EXPORT_COLUMNS, ...(await descriptorColumns(ds))];
  sheet.columns = columns.map((c) => ({ header: c.header, width: c.width, style: c.numFmt ? { numFmt: c.numFmt } : {} }));
  sheet.getRow(1).font = { bold: true };
  for await (const r of selectedReadings(ds, q)) {
    const row = sheet.addRow(xlsxRowOf(columns, r, publicUrl));
    const hexCell = row.getCell(HEX_COLUMN + 1);
    hexCell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: `FF${r.hex.slice(1).toUpperCase()}` } };
    hexCell.font = { color: { argb: textOn(r.hex) } };
  }
  sheet.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: columns.length } };
  return Buffer.from(await book.xlsx.writeBuffer());
}
