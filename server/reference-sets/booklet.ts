import PDFDocument from 'pdfkit';
import type { ChipDto } from '../../shared/api/reference-set-answers.js';
import { sectorLabel, hueSector, pickerOrder } from '../../shared/colour/chip-name.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { fieldChipsBySector } from '../../shared/colour/field-groups.js';
import { NEUTRAL_GREY, OUTLINE, PRINT_CAUTION } from './field-card.js';
import type { LoadedSet } from './reference-sets.js';

/** Booklet geometry in PDF points (1/72 in) on A4, 595.28 × 841.89. Our own layout. */
const LAYOUT = {
  margin: 28,
  /** The field chip's own swatch at the head of its page. */
  fieldSwatch: 56,
  /** Each fine chip's cell: swatch, then the last three digits of its code under it. */
  cell: { width: 27, height: 33 },
  swatch: 21,
  /** Codes print at 7 pt at least (common practice for text read at arm's length, no source). */
  codeSize: 7,
} as const;

/** What a renderer may be told; tests read the uncompressed page text. */
export interface RenderOptions {
  /** Whether page content is deflated (pdfkit's default, true). */
  compress?: boolean;
}

const booklets = new WeakMap<LoadedSet, Promise<Buffer>>();

/** The set's fine-chip booklet as a PDF, rendered once per set and kept. */
export function fineChipBooklet(set: LoadedSet): Promise<Buffer> {
  let booklet = booklets.get(set);
  if (!booklet) {
    booklet = renderBooklet(set);
    booklets.set(set, booklet);
  }
  return booklet;
}

/**
 * Renders the booklet: one A4 page per field chip, in card order (hue sector, then light to dark),
 * with the field chip's swatch, code, name and CIELAB at the head and its fine chips below in
 * picker order (sector, light to dark, strongest to greyest), each on the neutral grey surround
 * with the last three digits of its code under it. A page that cannot hold every fine chip
 * continues on the next, headed again.
 */
export function renderBooklet(set: LoadedSet, options: RenderOptions = {}): Promise<Buffer> {
  const { summary } = set;
  const doc = new PDFDocument({
    size: 'A4',
    margin: LAYOUT.margin,
    autoFirstPage: false,
    compress: options.compress ?? true,
    info: { Title: `Hueledger fine-chip booklet, reference set ${summary.id}`, Author: 'Hueledger', Subject: `${summary.name}: one page per field chip with its fine chips` },
  });
  const parts: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => parts.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
  });
  const fines = new Map<string, ChipDto[]>();
  for (const chip of set.chips) if (chip.parent !== null) (fines.get(chip.parent) ?? fines.set(chip.parent, []).get(chip.parent)!).push(chip);
  const fields = fieldChipsBySector(set.chips).flatMap((g) => g.chips);
  fields.forEach((field, i) => drawFieldPages(doc, summary.id, field, (fines.get(field.code) ?? []).sort((p, q) => pickerOrder(p.lab, q.lab)), i + 1, fields.length));
  doc.end();
  return done;
}

function drawFieldPages(doc: PDFKit.PDFDocument, setId: string, field: ChipDto, fines: ChipDto[], number: number, of: number): void {
  const { margin, cell, swatch, codeSize } = LAYOUT;
  const perRow = Math.floor((595.28 - 2 * margin) / cell.width);
  let index = 0;
  do {
    doc.addPage();
    let y = drawPageHead(doc, setId, field, fines.length, number, of, index > 0);
    const bottom = doc.page.height - margin - 30;
    const rows = Math.max(1, Math.min(Math.ceil((fines.length - index) / perRow), Math.floor((bottom - y) / cell.height)));
    const onPage = fines.slice(index, index + rows * perRow);
    // The neutral surround behind every swatch (black codes on L* 50 read at 4.7 : 1).
    doc.rect(margin - 2, y - 3, perRow * cell.width + 2, rows * cell.height + 2).fill(NEUTRAL_GREY);
    onPage.forEach((chip, i) => {
      const x = margin + (i % perRow) * cell.width + (cell.width - swatch) / 2;
      const top = y + Math.floor(i / perRow) * cell.height;
      doc.lineWidth(0.4).rect(x, top, swatch, swatch).fillAndStroke(chip.hex, OUTLINE);
      const suffix = chip.code.slice(chip.code.indexOf('.'));
      doc.font('Helvetica').fontSize(codeSize).fillColor('#000000').text(suffix, x - 3, top + swatch + 1, { width: swatch + 6, align: 'center', lineBreak: false });
    });
    index += onPage.length;
    y += rows * cell.height + 6;
    drawPageFoot(doc, setId);
  } while (index < fines.length);
}

function drawPageHead(doc: PDFKit.PDFDocument, setId: string, field: ChipDto, fineCount: number, number: number, of: number, continued: boolean): number {
  const { margin, fieldSwatch } = LAYOUT;
  const width = doc.page.width - 2 * margin;
  doc.font('Helvetica').fontSize(7).fillColor('#333333').text(`Hueledger fine-chip booklet · reference set ${setId} · field chip ${number} of ${of}`, margin, margin, { width });
  const top = margin + 14;
  doc.rect(margin, top, fieldSwatch + 12, fieldSwatch + 12).fill(NEUTRAL_GREY);
  doc.lineWidth(0.6).rect(margin + 6, top + 6, fieldSwatch, fieldSwatch).fillAndStroke(field.hex, OUTLINE);
  const left = margin + fieldSwatch + 22;
  const [l, a, b] = field.lab;
  doc.font('Helvetica-Bold').fontSize(20).fillColor('#000000').text(`${field.code}${continued ? ' (continued)' : ''}`, left, top, { width: width - left + margin });
  doc.font('Helvetica').fontSize(10).text(`${field.name} · ${sectorLabel(hueSector(labFromTuple(field.lab)))}`, left, doc.y + 1, { width: width - left + margin });
  doc.fontSize(8).text(`CIELAB D65: L* ${l.toFixed(2)}, a* ${a.toFixed(2)}, b* ${b.toFixed(2)} · ${fineCount} fine chips, light to dark`, left, doc.y + 2, { width: width - left + margin });
  doc.text(`Under each swatch: the last three digits of its code (.014 is ${field.code}.014).`, left, doc.y + 2, { width: width - left + margin });
  return top + fieldSwatch + 24;
}

function drawPageFoot(doc: PDFKit.PDFDocument, setId: string): void {
  const { margin } = LAYOUT;
  const width = doc.page.width - 2 * margin;
  doc.font('Helvetica').fontSize(7).fillColor('#333333').text(`${PRINT_CAUTION} Reference set ${setId}.`, margin, doc.page.height - margin - 24, { width, height: 24 });
}
