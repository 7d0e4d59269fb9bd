import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { renderBooklet } from '../../server/reference-sets/booklet.js';
import { renderFieldCard } from '../../server/reference-sets/field-card.js';
import { ReferenceSets } from '../../server/reference-sets/reference-sets.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { bytes, readSetV2 } from './reference-set-file.js';

// The printed field card and the fine-chip booklet: codes readable at 7 pt or more, one booklet
// page per field chip with its fine chips. Text is read back from the PDFs' uncompressed content
// streams (PDF 32000-1:2008 § 9.4: Tf sets the font size, TJ shows strings).

/** Every font size set and every string shown, in order, from uncompressed PDF page content. */
function pdfText(pdf: Buffer): { sizes: number[]; strings: string[] } {
  const text = pdf.toString('latin1');
  const sizes = [...text.matchAll(/ ([\d.]+) Tf\b/g)].map((m) => Number(m[1]));
  const strings = [...text.matchAll(/\[((?:<[0-9a-f]*>\s*-?[\d.]*\s*)+)\] TJ/g)].map((m) =>
    [...m[1]!.matchAll(/<([0-9a-f]*)>/g)].map((h) => Buffer.from(h[1]!, 'hex').toString('latin1')).join(''),
  );
  return { sizes, strings };
}

const pages = (pdf: Buffer) => pdf.toString('latin1').match(/\/Type \/Page\b(?!s)/g)?.length ?? 0;

describe('printing the reference sets', () => {
  let h: Harness;
  let recorder: Client;
  let sets: ReferenceSets;
  const v2 = readSetV2();
  const field = v2.chips.filter((c) => c.parent === null);

  before(async () => {
    h = await startHarness();
    recorder = await signedInAs(h, 'recorder');
    sets = new ReferenceSets(h.ds);
  });
  after(() => h.close());

  test('the v2 field card fits one A4 page, prints every field code, and no text on it is under 7 pt', async () => {
    const pdf = await renderFieldCard(await sets.get('v2'), { compress: false });
    assert.equal(pages(pdf), 1);
    const { sizes, strings } = pdfText(pdf);
    assert.ok(sizes.length > 0 && sizes.every((s) => s >= 7), `font sizes ${[...new Set(sizes)].join(', ')}`);
    const shown = new Set(strings);
    assert.deepEqual(field.filter((c) => !shown.has(c.code)).map((c) => c.code), []);
    assert.ok(strings.some((s) => s.startsWith('leaf h')), 'sector headings with their hue range');
  });

  test('the booklet has one page per field chip, each headed by its code, with every fine chip’s digits, at 7 pt or more', async () => {
    const pdf = await renderBooklet(await sets.get('v2'), { compress: false });
    assert.equal(pages(pdf), field.length);
    const { sizes, strings } = pdfText(pdf);
    assert.ok(sizes.every((s) => s >= 7), `font sizes ${[...new Set(sizes)].join(', ')}`);
    for (const f of field.slice(0, 20)) {
      const at = strings.indexOf(f.code);
      assert.ok(at >= 0, `page of ${f.code}`);
      const fines = v2.chips.filter((c) => c.parent === f.code).map((c) => c.code.slice(5));
      // The page's swatch labels follow the head, in picker order (v2's codes follow it too).
      const labels = strings.slice(at).filter((s) => /^\.\d{3}$/.test(s)).slice(0, fines.length);
      assert.deepEqual(labels, fines, `fine chips of ${f.code}`);
    }
  });

  test('the booklet downloads as a PDF for every role', async () => {
    const res = await recorder.get('/api/reference-sets/v1/booklet.pdf').buffer(true).parse(bytes).expect(200);
    assert.equal(res.headers['content-type'], 'application/pdf');
    assert.match(String(res.headers['content-disposition']), /^attachment; filename="hueledger-fine-chip-booklet-v1\.pdf"$/);
    assert.equal(pages(res.body as Buffer), 189);
  });
});
