// The printable characterisation record of one accession (issue 14): each colour character's
// accepted colour as a swatch on a neutral grey surround with its chip code under it, the numbers,
// the season notes, then the descriptor summaries and the cautions. pdfkit's built-in Helvetica
// has no Greek letters, so ΔE00 is spelt "dE00" and arrows as "->" (as on the calibration certificate).
import PDFDocument from 'pdfkit';
import type { AccessionProfile, CharacterProfile, DescriptorSummary } from '../../shared/api/profile-answers.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { instantWords } from '../core/day-words.js';

/** The caution every printed record carries. */
export const RECORD_CAUTION =
  'Colours on screens and on paper are approximate: displays and printers vary, so a printed swatch only stands in for its numbers. ' +
  'The chip codes and CIELAB values are what count; compare plants against a printed card you have re-measured, in good, even light.';

/** Neutral grey surround: L* 50, a* = b* = 0, as sRGB. */
const NEUTRAL_GREY = displayHex({ l: 50, a: 0, b: 0 }).hex;
const OUTLINE = '#5e5e5e';
/** Geometry in PDF points (1/72 in); A4. Our own layout. */
const LAYOUT = { margin: 40, surround: 84, swatch: 56, gap: 14 } as const;

/** Helvetica-safe text: Greek Δ, arrows, the true minus and the degree sign spelt in ASCII or Latin-1. */
export function pdfText(text: string): string {
  return text.replaceAll('ΔE00', 'dE00').replaceAll('→', '->').replaceAll('↔', '<->').replaceAll('−', '-').replaceAll('≤', '<=').replaceAll('≥', '>=').replaceAll('…', '...');
}

const n1 = (x: number) => x.toFixed(1);
const n2 = (x: number) => x.toFixed(2);

/** Renders the record; `compress: false` leaves the text readable in the file (tests). */
export function profilePdf(profile: AccessionProfile, opts: { compress?: boolean } = {}): Promise<Buffer> {
  const doc = new PDFDocument({
    size: 'A4',
    margin: LAYOUT.margin,
    compress: opts.compress ?? true,
    info: { Title: `Characterisation record ${profile.accessionNumber}`, Author: 'Hueledger', Subject: `Accepted colours and descriptors of ${profile.accessionNumber} ${profile.name}` },
  });
  const parts: Buffer[] = [];
  doc.on('data', (chunk: Buffer) => parts.push(chunk));
  const done = new Promise<Buffer>((resolve, reject) => {
    doc.on('end', () => resolve(Buffer.concat(parts)));
    doc.on('error', reject);
  });
  const width = doc.page.width - 2 * LAYOUT.margin;
  doc.font('Helvetica-Bold').fontSize(16).fillColor('#000000').text(pdfText(`Characterisation record · ${profile.accessionNumber} ${profile.name}`), { width });
  doc
    .font('Helvetica')
    .fontSize(9)
    .fillColor('#333333')
    .text(pdfText(`Reference set ${profile.referenceSet.id} (version ${profile.referenceSet.version}); CIELAB ${profile.referenceSet.white}, ${profile.referenceSet.observer} observer. Computed ${instantWords(new Date(profile.computedAt))}.`), { width })
    .text(pdfText(`Accepted colour: the ${profile.statistic}. It rests on the approved readings once any are approved, else on every reading in force.`), { width })
    .moveDown(0.4);
  caution(doc, RECORD_CAUTION, width);
  const rawTissue = profile.characters.find((c) => c.caution)?.caution;
  if (rawTissue) caution(doc, rawTissue, width);
  doc.moveDown(0.6);

  if (profile.characters.length === 0) doc.font('Helvetica').fontSize(10).fillColor('#000000').text('No colour readings of this accession yet.', { width });
  for (const c of profile.characters) drawCharacter(doc, c, width);

  if (profile.descriptors.length) {
    ensureSpace(doc, 60);
    doc.moveDown(0.5).font('Helvetica-Bold').fontSize(12).fillColor('#000000').text('Descriptors across plants', LAYOUT.margin, doc.y, { width });
    doc.font('Helvetica').fontSize(9);
    for (const d of profile.descriptors) doc.text(pdfText(`${d.label}: ${descriptorLine(d)}`), { width });
  }
  doc.end();
  return done;
}

function caution(doc: PDFKit.PDFDocument, text: string, width: number): void {
  doc.font('Helvetica-Bold').fontSize(8.5).fillColor('#000000').text('Caution: ', LAYOUT.margin, doc.y, { continued: true, width }).font('Helvetica').text(pdfText(text), { width });
}

function ensureSpace(doc: PDFKit.PDFDocument, height: number): void {
  if (doc.y + height > doc.page.height - LAYOUT.margin) doc.addPage();
}

/** One character: the swatch on its grey surround with the code under it, the numbers beside it, season notes below. */
function drawCharacter(doc: PDFKit.PDFDocument, c: CharacterProfile, width: number): void {
  ensureSpace(doc, LAYOUT.surround + 40);
  const top = doc.y;
  const x = LAYOUT.margin;
  const { surround, swatch } = LAYOUT;
  doc.save().rect(x, top, surround, surround + 4).fillAndStroke(NEUTRAL_GREY, OUTLINE).restore();
  const inset = (surround - swatch) / 2;
  doc.save().rect(x + inset, top + 8, swatch, swatch).fillAndStroke(c.centre.hex, OUTLINE).restore();
  doc.font('Helvetica-Bold').fontSize(8).fillColor('#ffffff').text(c.chip.code, x, top + 8 + swatch + 6, { width: surround, align: 'center' });

  const tx = x + surround + LAYOUT.gap;
  const tw = width - surround - LAYOUT.gap;
  const [l, a, b] = c.centre.lab;
  const [, chroma, hue] = c.centre.lch;
  doc.font('Helvetica-Bold').fontSize(11).fillColor('#000000').text(pdfText(c.label), tx, top, { width: tw });
  doc
    .font('Helvetica')
    .fontSize(9)
    .text(pdfText(`${c.chip.code} ${c.chip.name}, ΔE00 ${n2(c.chip.deltaE00)} (${c.chip.verdict})`), { width: tw })
    .text(pdfText(`Nearest chip in each set: ${setChipsLine(c)}.`), { width: tw })
    .text(pdfText(`L* ${n2(l)}, a* ${n2(a)}, b* ${n2(b)}; C* ${n2(chroma)}, h ${n1(hue)} deg${c.centre.inGamut ? '' : ' (outside sRGB: the swatch is an approximation)'}`), { width: tw })
    .text(pdfText(`Spread ${n2(c.spreadDeltaE00)} ΔE00 from the accepted colour; ${c.nReadings} ${c.basis === 'approved' ? 'approved ' : ''}readings (of ${c.nCurrent} in force) by ${c.nObservers} observers on ${c.nPlants} plants.`), { width: tw })
    .text(pdfText(c.flagged ? `Flagged (threshold ΔE00 ${c.threshold}): ${c.flags.map((f) => `${f.label}, ΔE00 ${n2(f.deltaE00)}`).join('; ')}.` : `Steady across ${c.seasons.length} season groups and ${c.sites.length} sites (threshold ΔE00 ${c.threshold}).`), { width: tw });
  if (c.seasons.length) {
    doc.text(pdfText(`Seasons: ${c.seasons.map((s) => `${s.seasonLabel} n ${s.n}, L* ${n1(s.centre.lab[0])} a* ${n1(s.centre.lab[1])} b* ${n1(s.centre.lab[2])}, ΔE00 ${n2(s.deltaE00)}`).join('; ')}.`), { width: tw });
  }
  if (c.outliers.length) doc.text(pdfText(`${c.outliers.length} reading(s) further than ΔE00 ${c.threshold} from it: ${c.outliers.slice(0, 6).map((o) => `#${o.readingId}`).join(', ')}${c.outliers.length > 6 ? ', ...' : ''}.`), { width: tw });
  doc.y = Math.max(doc.y, top + surround + 4) + LAYOUT.gap;
  doc.x = LAYOUT.margin;
}

/** "v1 F-092.014, ΔE00 0.41; v2 (current) F-233.007, ΔE00 0.38", so a printed record names the chip in either set. */
export function setChipsLine(c: Pick<CharacterProfile, 'setChips'>): string {
  return c.setChips.map((s) => `${s.setId}${s.current ? ' (current)' : ''} ${s.chip.code}, ΔE00 ${n2(s.chip.deltaE00)}`).join('; ');
}

function descriptorLine(d: DescriptorSummary): string {
  if (d.kind === 'category') return `${d.modeLabel ?? '-'} (${Math.round((d.share ?? 0) * d.n)} of ${d.n} plants)`;
  if (!d.formatted) return '-';
  return d.n === 1 ? `${d.formatted.median.metric} (1 plant)` : `median ${d.formatted.median.metric} (${d.formatted.min.metric} - ${d.formatted.max.metric}, ${d.n} plants)`;
}
