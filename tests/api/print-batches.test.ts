// Re-measuring a printed card or booklet: an admin records a print batch and the CIELAB measured
// on its patches; each patch's ΔE00 from its chip and the batch's median and largest are checked
// against colorjs.io's CIEDE2000 on the same numbers (tests/reference/cross-check.test.ts shows
// colorjs.io agrees with Sharma, Wu & Dalal 2005), the median by hand. Bad input is refused naming
// the field and leaves nothing written.
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import Color from 'colorjs.io';
import type { PrintBatchDetail, PrintBatchDto } from '../../shared/api/print-batch-answers.js';
import type { ChipDto } from '../../shared/api/reference-set-answers.js';
import type { LabTuple } from '../../shared/colour/lab.js';
import { AuditEvent } from '../../server/audit/audit-event.entity.js';
import { PrintBatch, PrintPatch } from '../../server/reference-sets/print-batch.entity.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';

const colorjsDE00 = (p: LabTuple, q: LabTuple) => new Color('lab', p).deltaE(new Color('lab', q), '2000');
const close = (actual: number, expected: number, what: string) => assert.ok(Math.abs(actual - expected) <= 1e-6, `${what}: ${actual} ≠ ${expected}`);

/** Invented instrument readings: each chip's CIELAB moved as a printer might move it (lighter, duller, warmer). */
const OFFSETS: LabTuple[] = [[0.4, -0.3, 0.2], [1.5, -1.2, 2.0], [-0.8, 0.5, -0.6], [3.0, -2.5, 4.0], [0.1, 0.1, -0.1]];

describe('print batches: printed patches re-measured against their chips', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let chips: ChipDto[];
  let batch: PrintBatchDetail;

  before(async () => {
    h = await startHarness();
    [admin, recorder] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder')]);
    const all = (await admin.get('/api/reference-sets/v2/chips').expect(200)).body as { chips: ChipDto[] } | ChipDto[];
    chips = (Array.isArray(all) ? all : all.chips).filter((c) => c.parent === null).slice(0, OFFSETS.length);
  });
  after(() => h.close());

  test('should record a batch of the v2 card and show each patch with its ΔE00 from the chip, furthest first, and the median and largest', async () => {
    const created = await admin.post('/api/print-batches', { setId: 'v2', kind: 'card', printedOn: '2026-11-20', note: 'Office laser, 160 g matt paper' });
    assert.equal(created.status, 201, created.text);
    batch = created.body as PrintBatchDetail;
    assert.equal(created.headers['location'], `/api/print-batches/${batch.id}`);
    assert.deepEqual([batch.summary.n, batch.summary.medianDeltaE00, batch.summary.maxDeltaE00], [0, null, null]);

    const measured = chips.map((c, i): LabTuple => [c.lab[0] + OFFSETS[i]![0], c.lab[1] + OFFSETS[i]![1], c.lab[2] + OFFSETS[i]![2]]);
    const res = await admin.post(`/api/print-batches/${batch.id}/patches`, { patches: chips.map((c, i) => ({ chipCode: c.code, lab: measured[i] })) });
    assert.equal(res.status, 201, res.text);
    const detail = res.body as PrintBatchDetail;
    const expected = chips.map((c, i) => ({ code: c.code, de: colorjsDE00(c.lab, measured[i]!) })).sort((p, q) => q.de - p.de);
    assert.deepEqual(detail.patches.map((p) => p.chipCode), expected.map((e) => e.code), 'furthest first');
    detail.patches.forEach((p, i) => close(p.deltaE00, expected[i]!.de, `${p.chipCode} ΔE00 against colorjs.io`));
    // Five distances: the median is the third of them sorted, by hand.
    const sorted = expected.map((e) => e.de).sort((p, q) => p - q);
    close(detail.summary.medianDeltaE00!, sorted[2]!, 'median');
    close(detail.summary.maxDeltaE00!, sorted[4]!, 'largest');
    assert.equal(detail.summary.n, 5);
    // Paravina et al. 2015 acceptability threshold, ΔE00 1.8.
    assert.equal(detail.summary.overAcceptable, sorted.filter((d) => d > 1.8).length);
    assert.ok(detail.summary.overAcceptable >= 1, 'the (3, −2.5, 4) patch is clearly off');
    assert.match(detail.caution, /approximate/);
    // Chip names use today's scheme (reference-colors/README.md), never the stored file's words.
    assert.ok(detail.patches.every((p) => p.chipName === chips.find((c) => c.code === p.chipCode)!.name));

    const list = (await recorder.get('/api/print-batches').expect(200)).body as PrintBatchDto[];
    const listed = list.find((b) => b.id === batch.id)!;
    assert.deepEqual(listed.summary, detail.summary);
    assert.equal(listed.note, 'Office laser, 160 g matt paper');
    assert.equal((await recorder.get(`/api/print-batches/${batch.id}`).expect(200)).body.patches.length, 5);
  });

  test('should refuse bad patches naming the field and unit, writing nothing', async () => {
    const counts = async () => [await h.ds.getRepository(PrintPatch).count(), await h.ds.getRepository(AuditEvent).count()];
    const before = await counts();
    // Field chips of v2 not measured in the batch yet (v2's field chips run F-190 to F-424).
    const fresh = ['F-300', 'F-301'];
    assert.ok(fresh.every((code) => !chips.some((c) => c.code === code)));
    const good = { chipCode: fresh[0], lab: [50, 10, 10] };
    const cases: [object, string, RegExp][] = [
      [{ patches: [good, { chipCode: 'F-999', lab: [50, 0, 0] }] }, 'patches.1.chipCode', /not a chip of set v2/],
      [{ patches: [good, { chipCode: chips[0]!.code, lab: [50, 0, 0] }] }, 'patches.1.chipCode', /already measured/],
      [{ patches: [good, { ...good }] }, 'patches.1.chipCode', /given twice/],
      [{ patches: [good, { chipCode: fresh[1], lab: [120, 0, 0] }] }, 'patches.1.lab.0', /L\* must be from 0 to 100/],
      [{ patches: [good, { chipCode: fresh[1], lab: [50, 0] }] }, 'patches.1.lab', /L\*, a\*, b\*/],
      [{ patches: [] }, 'patches', /at least one/],
    ];
    for (const [body, field, message] of cases) {
      const res = await admin.post(`/api/print-batches/${batch.id}/patches`, body);
      assertInvalidFields(res, field);
      assert.match(res.body.errors.find((e: { field: string }) => e.field === field).message, message, field);
    }
    assert.deepEqual(await counts(), before, 'no patch and no audit event written');
    assertProblem(await admin.post('/api/print-batches/999999/patches', { patches: [good] }), 404);
  });

  test('should refuse a batch of a set not loaded, printed in the future, or without printer and paper', async () => {
    const before = await h.ds.getRepository(PrintBatch).count();
    assertInvalidFields(await admin.post('/api/print-batches', { setId: 'v9', kind: 'card', printedOn: '2026-01-01', note: 'x' }), 'setId');
    assertInvalidFields(await admin.post('/api/print-batches', { setId: 'v2', kind: 'card', printedOn: '2999-01-01', note: 'x' }), 'printedOn');
    assertInvalidFields(await admin.post('/api/print-batches', { setId: 'v2', kind: 'poster', printedOn: '2026-01-01', note: ' ' }), 'kind', 'note');
    assertInvalidFields(await admin.post('/api/print-batches', { setId: 'v2', kind: 'card', printedOn: '20-01-2026', note: 'x' }), 'printedOn');
    assert.equal(await h.ds.getRepository(PrintBatch).count(), before);
  });

  test('should let only admins record batches and patches', async () => {
    assertProblem(await recorder.post('/api/print-batches', { setId: 'v2', kind: 'card', printedOn: '2026-01-01', note: 'x' }), 403);
    assertProblem(await recorder.post(`/api/print-batches/${batch.id}/patches`, { patches: [{ chipCode: 'F-190', lab: [50, 0, 0] }] }), 403);
  });
});
