// The whole collection's characterisation as a workbook (issue 14): one row per accession × colour
// character, one per accession × descriptor, and a sheet that explains every column, the units,
// the reference set and the white point.
import ExcelJS from 'exceljs';
import { CENTRE_STATISTIC, type AccessionProfile, type CharacterProfile, type DescriptorSummary } from '../../shared/api/profile-answers.js';
import { KIND_QUANTITY } from '../../shared/api/descriptor-answers.js';
import { ACCEPTABILITY_THRESHOLD_DE00, PERCEPTIBILITY_THRESHOLD_DE00 } from '../../shared/colour/constants.js';
import { Accession } from '../collection/accession.entity.js';
import { accessionProfile, type ProfileDeps } from './profile.js';

type Cell = string | number | boolean | null;

interface Column<T> {
  header: string;
  width: number;
  numFmt?: string;
  /** What the column holds, with its unit, for the explanation sheet. */
  means: string;
  value(p: AccessionProfile, x: T): Cell;
}

const COLOUR_COLUMNS: readonly Column<CharacterProfile>[] = [
  { header: 'accession', width: 12, means: 'Accession number (MCPD ACCENUMB).', value: (p) => p.accessionNumber },
  { header: 'accession name', width: 18, means: 'Accession name (MCPD ACCENAME, first name).', value: (p) => p.name },
  { header: 'character', width: 22, means: 'Character code of the catalogue (organ.part.detail).', value: (_, c) => c.code },
  { header: 'character label', width: 28, means: 'What is read, in words.', value: (_, c) => c.label },
  { header: 'basis', width: 9, means: '"approved": the accepted colour rests on the approved readings; "current": on every reading in force (none approved yet).', value: (_, c) => c.basis },
  { header: 'L*', width: 8, numFmt: '0.00', means: 'Accepted colour, CIELAB L* (0 black to 100 white), D65 white, 2° observer.', value: (_, c) => c.centre.lab[0] },
  { header: 'a*', width: 8, numFmt: '0.00', means: 'Accepted colour, CIELAB a* (negative green, positive red).', value: (_, c) => c.centre.lab[1] },
  { header: 'b*', width: 8, numFmt: '0.00', means: 'Accepted colour, CIELAB b* (negative blue, positive yellow).', value: (_, c) => c.centre.lab[2] },
  { header: 'C*ab', width: 8, numFmt: '0.00', means: 'Chroma √(a*² + b*²).', value: (_, c) => c.centre.lch[1] },
  { header: 'h°ab', width: 8, numFmt: '0.0', means: 'Hue angle in degrees, 0–360 (0 for a neutral).', value: (_, c) => c.centre.lch[2] },
  { header: 'hex', width: 10, means: 'sRGB display colour (gamut-mapped when out of sRGB); the cell is filled with it. Screen and print colours are approximate.', value: (_, c) => c.centre.hex },
  { header: 'chip', width: 12, means: 'Nearest chip of the reference set by ΔE00.', value: (_, c) => c.chip.code },
  { header: 'chip name', width: 24, means: 'The chip\'s name in words.', value: (_, c) => c.chip.name },
  { header: 'chip ΔE00', width: 9, numFmt: '0.00', means: 'CIEDE2000 difference between the accepted colour and the chip (kL = kC = kH = 1).', value: (_, c) => c.chip.deltaE00 },
  { header: 'verdict', width: 16, means: `ΔE00 in words: ≤ ${PERCEPTIBILITY_THRESHOLD_DE00} indistinguishable, ≤ ${ACCEPTABILITY_THRESHOLD_DE00} close, else clearly different (Paravina et al. 2015).`, value: (_, c) => c.chip.verdict },
  { header: 'chip in each set', width: 44, means: 'The accepted colour\'s nearest chip in every stored reference set, oldest version first: set, code, ΔE00. Codes of different sets never coincide, so v1 and v2 codes can stand side by side.', value: (_, c) => c.setChips.map((s) => `${s.setId} ${s.chip.code} (ΔE00 ${s.chip.deltaE00.toFixed(2)})`).join('; ') },
  { header: 'spread ΔE00', width: 10, numFmt: '0.00', means: 'Mean ΔE00 of the basis readings from the accepted colour.', value: (_, c) => c.spreadDeltaE00 },
  { header: 'readings', width: 9, numFmt: '0', means: 'Readings the accepted colour rests on.', value: (_, c) => c.nReadings },
  { header: 'readings in force', width: 9, numFmt: '0', means: 'Readings not superseded, of any review status.', value: (_, c) => c.nCurrent },
  { header: 'observers', width: 9, numFmt: '0', means: 'Distinct observers among the basis readings.', value: (_, c) => c.nObservers },
  { header: 'plants', width: 8, numFmt: '0', means: 'Distinct plants among the basis readings.', value: (_, c) => c.nPlants },
  { header: 'threshold ΔE00', width: 10, numFmt: '0.0', means: 'The character\'s threshold for drift, site differences and outliers.', value: (_, c) => c.threshold },
  { header: 'flagged', width: 8, means: '"yes" when the drift rules flag a season change or a site difference within one season.', value: (_, c) => (c.flagged ? 'yes' : 'no') },
  { header: 'flags', width: 40, means: 'Each flag: the groups or sites and their ΔE00.', value: (_, c) => c.flags.map((f) => `${f.label} (ΔE00 ${f.deltaE00.toFixed(2)})`).join('; ') || null },
  { header: 'season groups', width: 40, means: 'Each season group: readings and ΔE00 of its centre from the accepted colour.', value: (_, c) => c.seasons.map((s) => `${s.seasonLabel}: n ${s.n}, ΔE00 ${s.deltaE00.toFixed(2)}`).join('; ') || null },
  { header: 'outliers', width: 9, numFmt: '0', means: 'Readings in force further than the threshold from the accepted colour.', value: (_, c) => c.outliers.length },
];

/** The SI unit a descriptor's numbers are in. */
function unitOf(d: DescriptorSummary): string {
  const q = KIND_QUANTITY[d.kind];
  return q === 'length' ? 'm' : q === 'mass' ? 'kg' : q === 'count' ? 'count' : d.kind === 'ratio' ? 'ratio' : '';
}

const DESCRIPTOR_COLUMNS: readonly Column<DescriptorSummary>[] = [
  { header: 'accession', width: 12, means: 'Accession number.', value: (p) => p.accessionNumber },
  { header: 'accession name', width: 18, means: 'Accession name.', value: (p) => p.name },
  { header: 'descriptor', width: 24, means: 'Descriptor code of the catalogue.', value: (_, d) => d.code },
  { header: 'descriptor label', width: 28, means: 'What is measured, in words.', value: (_, d) => d.label },
  { header: 'plants', width: 8, numFmt: '0', means: 'Plants with a value (the latest value of each plant).', value: (_, d) => d.n },
  { header: 'unit', width: 7, means: 'SI unit of median, least and greatest: m, kg, count, or a ratio (no unit).', value: (_, d) => unitOf(d) || null },
  { header: 'median', width: 10, numFmt: '0.000', means: 'Median of the plants\' values, in the unit.', value: (_, d) => d.median },
  { header: 'least', width: 10, numFmt: '0.000', means: 'Least plant value.', value: (_, d) => d.min },
  { header: 'greatest', width: 10, numFmt: '0.000', means: 'Greatest plant value.', value: (_, d) => d.max },
  { header: 'commonest category', width: 18, means: 'Categories: the commonest one (ties: catalogue order).', value: (_, d) => d.modeLabel },
  { header: 'share', width: 8, numFmt: '0%', means: 'Categories: the share of plants in the commonest one.', value: (_, d) => d.share },
];

/** Black or white text on a fill (WCAG 2.x relative luminance, mid-point 0.179), as in the readings export. */
function textOn(hex: string): string {
  const lin = [1, 3, 5].map((i) => {
    const c = parseInt(hex.slice(i, i + 2), 16) / 255;
    return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
  });
  return 0.2126 * lin[0]! + 0.7152 * lin[1]! + 0.0722 * lin[2]! > 0.179 ? 'FF000000' : 'FFFFFFFF';
}

function sheetOf<T>(book: ExcelJS.Workbook, name: string, columns: readonly Column<T>[]): ExcelJS.Worksheet {
  const sheet = book.addWorksheet(name, { views: [{ state: 'frozen', ySplit: 1 }] });
  sheet.columns = columns.map((c) => ({ header: c.header, width: c.width, style: c.numFmt ? { numFmt: c.numFmt } : {} }));
  sheet.getRow(1).font = { bold: true };
  return sheet;
}

/** Every accession's characterisation as an XLSX workbook: "Colours", "Descriptors" and "About". */
export async function characterisationXlsx(deps: ProfileDeps): Promise<Buffer> {
  const accessions = await deps.ds.getRepository(Accession).find({ order: { accessionNumber: 'ASC' } });
  const profiles: AccessionProfile[] = [];
  for (const a of accessions) profiles.push(await accessionProfile(deps, a.id));
  const set = (await deps.referenceSets.current()).summary;

  const book = new ExcelJS.Workbook();
  book.creator = 'Hueledger';
  const colours = sheetOf(book, 'Colours', COLOUR_COLUMNS);
  const hexColumn = COLOUR_COLUMNS.findIndex((c) => c.header === 'hex') + 1;
  for (const p of profiles) {
    for (const c of p.characters) {
      const row = colours.addRow(COLOUR_COLUMNS.map((col) => col.value(p, c)));
      const cell = row.getCell(hexColumn);
      cell.fill = { type: 'pattern', pattern: 'solid', fgColor: { argb: `FF${c.centre.hex.slice(1).toUpperCase()}` } };
      cell.font = { color: { argb: textOn(c.centre.hex) } };
    }
  }
  colours.autoFilter = { from: { row: 1, column: 1 }, to: { row: 1, column: COLOUR_COLUMNS.length } };
  const descriptors = sheetOf(book, 'Descriptors', DESCRIPTOR_COLUMNS);
  for (const p of profiles) for (const d of p.descriptors) descriptors.addRow(DESCRIPTOR_COLUMNS.map((col) => col.value(p, d)));

  const about = book.addWorksheet('About');
  about.columns = [{ width: 24 }, { width: 110 }];
  const facts: [string, string][] = [
    ['What this is', 'The characterisation of every accession of the collection, as Hueledger computed it.'],
    ['Computed', new Date().toISOString()],
    ['Reference set', `${set.id} (${set.name}, version ${set.version}); chips are matched in it by CIEDE2000.`],
    ['Colour space', `CIELAB, white point ${set.white} (the white of sRGB), ${set.observer} standard observer.`],
    ['Colour difference', 'CIEDE2000 (CIE 142-2001; Sharma, Wu & Dalal 2005), kL = kC = kH = 1.'],
    ['Accepted colour', `The ${CENTRE_STATISTIC}.`],
    ['Drift and site flags', 'ΔE00 between group means at or above the character\'s threshold, a seeded permutation test with p < 0.05, and at least 3 readings in each group; sites are compared within one season group only.'],
    ['Caution', 'Screen and printed colours are approximate; the numbers and chip codes are what count.'],
    ['', ''],
  ];
  for (const [k, v] of facts) about.addRow([k, v]);
  for (const [name, columns] of [['Colours', COLOUR_COLUMNS], ['Descriptors', DESCRIPTOR_COLUMNS]] as const) {
    about.addRow([`Sheet "${name}"`, 'column: meaning (unit)']).font = { bold: true };
    for (const c of columns as readonly Column<never>[]) about.addRow([c.header, c.means]);
    about.addRow(['', '']);
  }
  about.getColumn(1).font = { bold: true };
  about.getColumn(2).alignment = { wrapText: true, vertical: 'top' };
  return Buffer.from(await book.xlsx.writeBuffer());
}
