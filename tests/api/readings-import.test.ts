// CSV import of instrument readings (issue 5, item 5): all or nothing. One bad row and nothing
// is written, with every bad row listed by row number, column and why; a good file goes in whole.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { ImportReport, ImportRowReport, ReadingDetail } from '../../shared/api/reading-answers.js';
import { AuditEvent } from '../../server/audit/audit-event.entity.js';
import { labD50ToD65 } from '../../shared/colour/chromatic-adaptation.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { readingWorld, type ReadingWorld } from './reading-fixtures.js';

const HEADER = 'accessionNumber,plantLabel,characterCode,observedAt,L,a,b,light,instrument,eyeChipCode,notes';

function upload(client: Client, csv: string) {
  return client.raw('post', '/api/readings/import').attach('file', Buffer.from(csv, 'utf8'), { filename: 'readings.csv', contentType: 'text/csv' });
}

describe('importing instrument readings from CSV', () => {
  let h: Harness;
  let recorder: Client;
  let w: ReadingWorld;

  before(async () => {
    h = await startHarness();
    const admin = await signedInAs(h, 'admin');
    recorder = await signedInAs(h, 'recorder');
    w = await readingWorld(admin);
  });
  after(() => h.close());

  const good = (i: number) => `RT-V,P1,petiole.third.upper,2026-02-${String(10 + i).padStart(2, '0')}T09:30:00+12:00,${38 + i},24.5,-12.1,open-shade,Bench spectro A,,row ${i}`;

  test('should refuse a file with two bad rows among good ones with 422, listing each bad row, writing nothing', async () => {
    const csv = [
      HEADER,
      good(1),
      // Row 3: L* out of range and an unknown light.
      'RT-V,P1,petiole.third.upper,2026-02-11T09:30:00+12:00,120,24.5,-12.1,moonlight,,,',
      good(2),
      // Row 5: an unknown accession, a b* that is no number, a time without an offset.
      'RT-NONE,,petiole.third.upper,2026-02-12 09:30,40,24.5,minus twelve,overcast,,,',
      good(3),
    ].join('\r\n');
    const before = await rowCounts(h.ds);
    const res = await upload(recorder, csv);
    const problem = assertProblem(res, 422);
    const rows = (res.body as { rows: ImportRowReport[] }).rows;
    assert.deepEqual(rows.map((r) => [r.row, r.ok]), [[2, true], [3, false], [4, true], [5, false], [6, true]]);
    const fields = (n: number) => rows.find((r) => r.row === n)!.errors.map((e) => e.field).sort();
    assert.deepEqual(fields(3), ['L', 'light']);
    assert.deepEqual(fields(5), ['accessionNumber', 'b', 'observedAt']);
    assert.ok(rows.find((r) => r.row === 3)!.errors.every((e) => e.message.length > 3), 'each error says why');
    assert.ok(problem.errors?.some((e) => e.field === 'row 5: accessionNumber'));
    assert.match(problem.detail ?? '', /2 rows .* nothing was/);
    assert.deepEqual(await rowCounts(h.ds), before, 'nothing written');
  });

  test('should report unknown plants, characters, chips and future times by column', async () => {
    const future = new Date(Date.now() + 86_400_000).toISOString();
    const csv = [HEADER, 'RT-V,P9,petiole.third.upper,2026-02-11T09:30:00+12:00,40,20,-10,overcast,,,', 'RT-V,P1,no.such.character,2026-02-11T09:30:00+12:00,40,20,-10,overcast,,,', `RT-V,P1,petiole.third.upper,${future},40,20,-10,overcast,,F-999,`, 'RT-A,P1,petiole.third.upper,2026-02-11T09:30:00+12:00,40,20,-10,overcast,,,'].join('\n');
    const before = await rowCounts(h.ds);
    const res = await upload(recorder, csv);
    assertProblem(res, 422);
    const rows = (res.body as { rows: ImportRowReport[] }).rows;
    assert.deepEqual(rows.map((r) => r.errors.map((e) => e.field)), [['plantLabel'], ['characterCode'], ['observedAt'], []]);
    assert.deepEqual(rows.map((r) => r.ok), [false, false, false, true]);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should refuse a header with unknown or missing columns, and a row of the wrong width', async () => {
    const before = await rowCounts(h.ds);
    const bad = await upload(recorder, ['accessionNumber,characterCode,observedAt,L,a,colour,light', 'RT-V,petiole.third.upper,2026-02-11T09:30:00+12:00,40,20,purple,overcast'].join('\n'));
    assertProblem(bad, 422);
    const header = (bad.body as { rows: ImportRowReport[] }).rows[0]!;
    assert.equal(header.row, 1);
    assert.deepEqual(header.errors.map((e) => e.field).sort(), ['b', 'colour']);
    const ragged = await upload(recorder, [HEADER, good(1), 'RT-V,P1,petiole.third.upper'].join('\n'));
    assertProblem(ragged, 422);
    assert.deepEqual((ragged.body as { rows: ImportRowReport[] }).rows.map((r) => [r.row, r.ok, r.errors[0]?.field]), [[2, true, undefined], [3, false, 'row']]);
    assertInvalidFields(await upload(recorder, HEADER), 'file');
    assertInvalidFields(await upload(recorder, ''), 'file');
    assertInvalidFields(await recorder.raw('post', '/api/readings/import').field('note', 'no file'), 'file');
    assertProblem(await recorder.post('/api/readings/import', { rows: [] }), 415);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should import a good file whole (201), as instrument readings of the uploader, each audited', async () => {
    const csv = '\ufeff' + [HEADER, good(1), good(2), good(3), 'RT-A,,corm.flesh.centre,2026-03-01T10:00:00-04:00,86,1.5,16,viewing-booth,"Bench spectro A, unit 2",F-050,"quoted, with a comma"'].join('\r\n') + '\r\n';
    const before = await rowCounts(h.ds);
    const res = await upload(recorder, csv);
    assert.equal(res.status, 201, res.text);
    const report = res.body as ImportReport;
    assert.equal(report.imported, 4);
    assert.deepEqual(report.rows.map((r) => [r.row, r.ok]), [[2, true], [3, true], [4, true], [5, true]]);
    const after = await rowCounts(h.ds);
    assert.equal(after['reading']! - before['reading']!, 4);
    const last = (await recorder.get(`/api/readings/${report.readingIds[3]}`).expect(200)).body as ReadingDetail;
    assert.deepEqual([last.method, last.lab, last.accessionId, last.plantId, last.siteId, last.light], ['instrument', [86, 1.5, 16], w.amber.id, null, w.coast.id, 'viewing-booth']);
    assert.deepEqual([last.provenance.instrument, last.eyeChipCode, last.notes], ['Bench spectro A, unit 2', 'F-050', 'quoted, with a comma']);
    assert.deepEqual([last.season, last.seasonYear], ['Dry', 2026]);
    const firstRow = (await recorder.get(`/api/readings/${report.readingIds[0]}`).expect(200)).body as ReadingDetail;
    assert.deepEqual([firstRow.lab, firstRow.plantLabel, firstRow.observerName, firstRow.notes], [[39, 24.5, -12.1], 'P1', 'Test recorder', 'row 1']);
    const imported = await h.ds.getRepository(AuditEvent).findBy({ action: 'readings.imported' });
    assert.equal(imported.length, 1);
    assert.equal(imported[0]!.detail!['count'], 4);
  });

  test('should take a file without a light column, adapting D50/2° rows to D65/2° and refusing an unknown illuminant by column', async () => {
    const header = 'accessionNumber,plantLabel,characterCode,observedAt,L,a,b,illuminant';
    const bad = await upload(recorder, [header, 'RT-V,P1,petiole.third.upper,2026-02-20T09:30:00+12:00,38.2,24.5,-12.1,A/10'].join('\n'));
    assertProblem(bad, 422);
    assert.deepEqual((bad.body as { rows: ImportRowReport[] }).rows[0]!.errors.map((e) => e.field), ['illuminant']);
    const res = await upload(recorder, [header, 'RT-V,P1,petiole.third.upper,2026-02-20T09:30:00+12:00,38.2,24.5,-12.1,D50/2', 'RT-V,P1,petiole.third.upper,2026-02-21T09:30:00+12:00,38.2,24.5,-12.1,D65/10'].join('\n'));
    assert.equal(res.status, 201, res.text);
    const [d50, d65] = await Promise.all((res.body as ImportReport).readingIds.map(async (id) => (await recorder.get(`/api/readings/${id}`).expect(200)).body as ReadingDetail));
    assert.deepEqual([d50!.light, d50!.provenance.illuminant, d50!.provenance.reportedLab], [null, 'D50/2', [38.2, 24.5, -12.1]]);
    // The same adaptation as a reading posted one at a time (shared/colour/chromatic-adaptation.ts, checked against Bradford in tests/reference).
    const adapted = labD50ToD65({ l: 38.2, a: 24.5, b: -12.1 });
    assert.deepEqual(d50!.lab, [adapted.l, adapted.a, adapted.b]);
    assert.deepEqual([d65!.lab, d65!.provenance.illuminant, d65!.provenance.reportedLab], [[38.2, 24.5, -12.1], 'D65/10', null]);
  });

  test('should refuse a reviewer with 403, writing nothing', async () => {
    const reviewer = await signedInAs(h, 'reviewer');
    const before = await rowCounts(h.ds);
    assertProblem(await upload(reviewer, [HEADER, good(1)].join('\n')), 403);
    assert.deepEqual(await rowCounts(h.ds), before);
  });
});
