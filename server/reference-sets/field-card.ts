import PDFDocument from 'pdfkit';
import { sectorLabel, type HueSector } from '../../shared/colour/chip-name.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { fieldChipsBySector } from '../../shared/colour/field-groups.js';
import type { ChipDto } from '../../shared/api/reference-set-answers.js';
import type { LoadedSet } from './reference-sets.js';

/** The caution printed on every card (docs/colour.md, judging colour by eye). */
export const PRINT_CAUTION =
  'Caution: printers vary; colours are approximate; re-measure a printed card with an instrument before trusting it. ' +
  'The codes and their CIELAB values are what count: a printed swatch only stands in for them. Judge in good, even light.';

/** Card geometry in PDF points (1/72 in); A4 is 595.28 × 841.89. Our own layout. */
const LAYOUT = {
  margin: 28,
  /** Width of the hue-sector column left of each group. */
  familyColumn: 58,
  /** Each chip's cell: swatch plus its code below. */
  cell: { width: 26, height: 31 },
  swatch: 21,
  /** Codes print at 7 pt at least, the smallest size read at arm's length in the field (common practice, no source). */
  codeSize: 7,
  /** Space between hue-sector groups. */
  groupGap: 4,
  /** Height kept free at the foot of the page for the patches and the caution. */
  footer: 104,
} as const;

/** Neutral grey patch and swatch surround: L* 50, a* = b* = 0, as sRGB (#777777). */
export const NEUTRAL_GREY = displayHex({ l: 50, a: 0, b: 0 }).hex;
/** Outline of swatches and patches: a neutral darker than the grey patch. */
export const OUTLINE = '#5e5e5e';

const cards = new WeakMap<LoadedSet, Promise<Buffer>>();

/** The set's printable field card as a PDF, rendered once per set and kept. */
export function fieldCard(set: LoadedSet): Promise<Buffer> {
  let card = cards.get(set);
  if (!card) {
    card = renderFieldCard(set);
    cards.set(set, card);
  }
  return card;
}

/**
 * Renders the card: a header with the set, every field chip as a swatch with its code beneath,
 * grouped by hue family, then a neutral grey and a white patch and the printing caution. A card
 * that does not fit one page continues on the next.
 */
export function renderFieldCard(set: LoadedSet, options: { compress?: boolean } = {}): Promise<Buffer> {
  const { summary } = set;
  const doc = new PDFDocument({
    size: 'A4',
    margin: LAYOUT.margin,
    compress: options.compress ?? true,
    info: { Title: `Hueledger field card, reference set ${summary.id}`, Author: 'Hueledger', Subject: `${summary.name}: field chips with codes, a neutral grey and a white patch` },
  });
  const parts: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => parts.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
  });
  const groups = fieldChipsBySector(set.chips);
  let y = drawHeader(doc, set, groups.reduce((n, g) => n + g.chips.length, 0));
  for (const group of groups) y = drawGroup(doc, group.family, group.chips, y);
  drawFooter(doc, summary.id, y);
  doc.end();
  return done;
}

function drawHeader(doc: PDFKit.PDFDocument, set: LoadedSet, fieldCount: number): number {
  const { margin } = LAYOUT;
  const width = doc.page.width - 2 * margin;
  const { summary } = set;
  doc.font('Helvetica-Bold').fontSize(14).fillColor('#000000').text(`Hueledger field card · reference set ${summary.id}`, margin, margin, { width });
  doc
    .font('Helvetica')
    .fontSize(8)
    .text(
      `${summary.name}. ${fieldCount} field chips, CIELAB ${summary.white}, ${summary.observer} observer. ` +
        `Each field chip refines into fine chips (${firstField(set)} into ${firstField(set)}.001 …): the booklet prints them, one page per field chip. ` +
        `Swatches sit on a neutral grey (L* 50) surround.`,
      margin,
      doc.y + 2,
      { width },
    );
  return doc.y + 8;
}

/** The set's first field code, for the header's example. */
function firstField(set: LoadedSet): string {
  return set.chips.find((c) => c.parent === null)?.code ?? 'F-001';
}

function drawGroup(doc: PDFKit.PDFDocument, sector: HueSector, chips: ChipDto[], top: number): number {
  const { margin, familyColumn, cell, swatch, codeSize, groupGap, footer } = LAYOUT;
  const gridLeft = margin + familyColumn;
  const perRow = Math.floor((doc.page.width - margin - gridLeft) / cell.width);
  const rows = Math.ceil(chips.length / perRow);
  let y = top;
  if (y + rows * cell.height > doc.page.height - margin - footer) {
    doc.addPage();
    y = margin;
  }
  doc.font('Helvetica-Bold').fontSize(8).fillColor('#000000').text(sectorLabel(sector), margin, y + 2, { width: familyColumn - 6 });
  // The neutral surround behind the group's swatches and codes (black on L* 50 reads at 4.7 : 1).
  doc.rect(gridLeft - 3, y - 2, Math.min(chips.length, perRow) * cell.width + 4, rows * cell.height + 1).fill(NEUTRAL_GREY);
  chips.forEach((chip, i) => {
    const x = gridLeft + (i % perRow) * cell.width;
    const rowTop = y + Math.floor(i / perRow) * cell.height;
    doc.lineWidth(0.4).rect(x, rowTop, swatch, swatch).fillAndStroke(chip.hex, OUTLINE);
    doc.font('Helvetica').fontSize(codeSize).fillColor('#000000').text(chip.code, x - 3, rowTop + swatch + 1, { width: swatch + 6, align: 'center', lineBreak: false });
  });
  return y + rows * cell.height + groupGap;
}

function drawFooter(doc: PDFKit.PDFDocument, setId: string, gridBottom: number): void {
  const { margin } = LAYOUT;
  const width = doc.page.width - 2 * margin;
  const top = Math.max(gridBottom + 6, doc.page.height - margin - LAYOUT.footer + 8);
  const patch = 40;
  doc.lineWidth(0.6).rect(margin, top, patch, patch).fillAndStroke(NEUTRAL_GREY, OUTLINE);
  doc.font('Helvetica').fontSize(7).fillColor('#000000').text(`neutral grey\nL* 50, a* 0, b* 0 (${NEUTRAL_GREY})`, margin + patch + 6, top + 10, { width: 120 });
  const whiteLeft = margin + 190;
  doc.lineWidth(0.6).rect(whiteLeft, top, patch, patch).fillAndStroke('#ffffff', OUTLINE);
  // fillAndStroke leaves the fill colour set to the patch's: text goes back to black.
  doc.fillColor('#000000').text('white\nunprinted paper (#ffffff)', whiteLeft + patch + 6, top + 10, { width: 120 });
  doc.font('Helvetica-Bold').fontSize(8).fillColor('#000000').text(PRINT_CAUTION, margin, top + patch + 10, { width });
  doc.font('Helvetica').fontSize(7).fillColor('#333333').text(`Reference set ${setId}. Codes are never reused: a code always means the same CIELAB value.`, margin, doc.y + 4, { width });
}
