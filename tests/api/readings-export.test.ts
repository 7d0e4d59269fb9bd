// Readings exports (issue 5, item 5): CSV and XLSX with CIELAB, LCh, hex, chips, ΔE00,
// conditions, season and a provenance link, honouring the list's filters across every page.
// The CSV is read back with csv-parse, the XLSX with exceljs.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { parse as parseCsv } from 'csv-parse/sync';
import ExcelJS from 'exceljs';
import type { ReadingDetail } from '../../shared/api/reading-answers.js';
import { EXPORT_COLUMNS } from '../../server/readings/reading-export.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, PUBLIC_URL, signedInAs, startHarness, type Harness } from './harness.js';
import { instrumentBody, readingWorld, type ReadingWorld } from './reading-fixtures.js';
import { bytes } from './reference-set-file.js';

describe('readings exports', () => {
  let h: Harness;
  let recorder: Client;
  let reviewer: Client;
  let w: ReadingWorld;
  let first: ReadingDetail;
  let corrected: ReadingDetail;
  let observerId: number;

  before(async () => {
    h = await startHarness();
    const admin = await signedInAs(h, 'admin');
    [recorder, reviewer] = await Promise.all([signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
    w = await readingWorld(admin);
    first = (await recorder.post('/api/readings', instrumentBody(w, { eyeChipCode: 'F-092', secondsSinceCut: 45, leafPosition: 'third leaf', notes: '=HYPERLINK("x") typed by mistake' })).expect(201)).body;
    const old = (await recorder.post('/api/readings', instrumentBody(w, { lab: [50, 10, 10], observedAt: '2026-06-01T08:00:00+12:00' })).expect(201)).body;
    corrected = (await recorder.post(`/api/readings/${old.id}/supersede`, { ...instrumentBody(w, { lab: [51, 10, 10], observedAt: '2026-06-01T08:00:00+12:00' }), reason: 'L* misread' }).expect(201)).body;
    // More than one list page's worth (the export holds every page).
    for (let i = 0; i < 110; i++) await recorder.post('/api/readings', instrumentBody(w, { accessionId: w.amber.id, plantId: null, lab: [60 + (i % 20), 5, 30], observedAt: `2026-0${1 + (i % 8)}-15T10:00:00-04:00` })).expect(201);
    observerId = first.observerId;
    // Plant P1 of the violet accession measured: 40 in of petiole (1.016 m in SI).
    const descriptors = (await reviewer.get('/api/descriptors').expect(200)).body as { id: number; code: string }[];
    await recorder.post('/api/observations', { accessionId: w.violet.id, plantId: w.violet.plants[0]!.id, descriptorId: descriptors.find((d) => d.code === 'petiole.length')!.id, value: 40, unit: 'in' }).expect(201);
  });
  after(() => h.close());

  test('should export CSV with the documented header and one row per current reading, values as stored', async () => {
    const res = await reviewer.get(`/api/readings/export.csv?observerId=${observerId}&accessionId=${w.violet.id}`);
    assert.equal(res.status, 200, res.text);
    assert.match(String(res.headers['content-type']), /^text\/csv/);
    assert.match(String(res.headers['content-disposition']), /attachment; filename="?readings-\d{4}-\d{2}-\d{2}\.csv"?/);
    assert.ok(res.text.startsWith('\ufeff'), 'UTF-8 BOM, so spreadsheets read ΔE and ° right');
    assert.ok(res.text.includes('\r\n'), 'CRLF line ends (RFC 4180)');
    const rows = parseCsv(res.text, { bom: true, columns: true }) as Record<string, string>[];
    const headers = Object.keys(rows[0]!);
    assert.deepEqual(headers.slice(0, EXPORT_COLUMNS.length), EXPORT_COLUMNS.map((c) => c.header));
    // Then the plant's latest value of each descriptor of the catalogue, SI unit in the header.
    const descriptors = (await reviewer.get('/api/descriptors').expect(200)).body as { code: string }[];
    assert.deepEqual(headers.slice(EXPORT_COLUMNS.length).map((x) => x.replace(/^plant (\S+) \(.*\)$/, '$1')), descriptors.map((d) => d.code));
    assert.ok(headers.includes('plant petiole.length (m)'));
    // 40 in × 0.0254 m/in = 1.016 m (NIST SP 811, exact).
    assert.equal(Number(rows.find((r) => Number(r['id']) === first.id)!['plant petiole.length (m)']), 1.016);
    for (const h of ['observed at (site local)', 'observed at (UTC)', 'L*', 'a*', 'b*', 'C*ab', 'h°ab', 'hex', 'best chip', 'ΔE00', 'eye chip', 'eye ΔE00', 'light', 'seconds since cut', 'leaf', 'notes', 'status', 'supersedes', 'superseded by', 'set id', 'instrument', 'illuminant/observer', 'reported L*a*b*', 'provenance link', 'season', 'season-year']) {
      assert.ok(h in rows[0]!, `column ${h}`);
    }
    assert.deepEqual(rows.map((r) => Number(r['id'])).sort((a, b) => a - b), [first.id, corrected.id]);
    const row = rows.find((r) => Number(r['id']) === first.id)!;
    // 09:30 in Fiji (UTC+12) is 21:30 UTC the day before.
    assert.equal(row['observed at (site local)'], '2026-02-10 09:30');
    assert.equal(row['site time zone'], 'Pacific/Fiji');
    assert.equal(row['observed at (UTC)'], '2026-02-09T21:30:00.000Z');
    assert.deepEqual([row['L*'], row['a*'], row['b*']], ['38.2', '24.5', '-12.1']);
    assert.equal(Number(row['C*ab']), Math.round(first.lch[1] * 100) / 100);
    assert.equal(Number(row['h°ab']), Math.round(first.lch[2] * 10) / 10);
    assert.equal(row['hex'], first.hex);
    assert.equal(row['best chip'], first.bestChip);
    assert.equal(Number(row['ΔE00']), Math.round(first.deltaE00 * 100) / 100);
    assert.equal(row['eye chip'], 'F-092');
    assert.equal(Number(row['eye ΔE00']), Math.round(first.eyeDeltaE00! * 100) / 100);
    assert.deepEqual([row['season'], row['season-year'], row['light'], row['seconds since cut'], row['leaf']], ['Wet', '2025', 'open-shade', '45', 'third leaf']);
    assert.equal(row['notes'], `'=HYPERLINK("x") typed by mistake`, 'a formula typed into notes is made inert (OWASP CSV injection)');
    assert.equal(row['provenance link'], `${PUBLIC_URL}/readings/${first.id}`);
    assert.equal(row['set id'], 'v1');
    const fixed = rows.find((r) => Number(r['id']) === corrected.id)!;
    assert.equal(Number(fixed['supersedes']), corrected.supersedesId);
  });

  test('should include superseded readings only when asked, and honour the other filters', async () => {
    const text = async (q: string) => parseCsv((await reviewer.get(`/api/readings/export.csv?${q}`).expect(200)).text, { bom: true, columns: true }) as Record<string, string>[];
    const all = await text(`observerId=${observerId}&accessionId=${w.violet.id}&includeSuperseded=true`);
    assert.equal(all.length, 3);
    assert.equal(Number(all.find((r) => Number(r['id']) === corrected.supersedesId)!['superseded by']), corrected.id);
    // Dates are UTC days: 08:00 on 1 June in Fiji is 20:00 UTC on 31 May.
    assert.equal((await text(`observerId=${observerId}&from=2026-05-31&to=2026-05-31`)).length, 1);
    assert.equal((await text(`observerId=${observerId}&from=2026-06-01&to=2026-06-01`)).length, 0);
    assert.equal((await text(`observerId=${observerId}&siteId=${w.coast.id}`)).length, 110);
    assert.equal((await text(`observerId=${observerId}&method=chip`)).length, 0);
  });

  test('should export every page (110 + 2 readings, more than pageSize allows), in the list’s order', async () => {
    const rows = parseCsv((await reviewer.get(`/api/readings/export.csv?observerId=${observerId}&sort=deltaE00&dir=asc`).expect(200)).text, { bom: true, columns: true }) as Record<string, string>[];
    assert.equal(rows.length, 112);
    const des = rows.map((r) => Number(r['ΔE00']));
    assert.deepEqual(des, [...des].sort((a, b) => a - b));
  });

  test('should export XLSX with a frozen bold header, number formats and each hex cell filled with its colour', async () => {
    const res = await reviewer.get(`/api/readings/export.xlsx?observerId=${observerId}`).buffer(true).parse(bytes);
    assert.equal(res.status, 200);
    assert.match(String(res.headers['content-type']), /spreadsheetml\.sheet/);
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(res.body as ArrayBuffer);
    const sheet = book.getWorksheet('Readings')!;
    assert.equal(sheet.rowCount, 1 + 112);
    const header = (sheet.getRow(1).values as unknown[]).slice(1);
    assert.deepEqual(header.slice(0, EXPORT_COLUMNS.length), EXPORT_COLUMNS.map((c) => c.header));
    assert.equal(sheet.getRow(1).font?.bold, true);
    assert.deepEqual(sheet.views.map((v) => [v.state, (v as { ySplit?: number }).ySplit]), [['frozen', 1]]);
    const col = (name: string) => EXPORT_COLUMNS.findIndex((c) => c.header === name) + 1;
    const row = sheet.getRows(2, 112)!.find((r) => r.getCell(1).value === first.id)!;
    assert.equal(row.getCell(col('L*')).value, 38.2);
    // Dates are real dates: the instant in UTC, and the site's wall clock (09:30 in Fiji) as a zone-less date.
    assert.deepEqual(row.getCell(col('observed at (UTC)')).value, new Date('2026-02-09T21:30:00.000Z'));
    assert.equal(row.getCell(col('observed at (UTC)')).numFmt, 'yyyy-mm-dd hh:mm:ss');
    assert.deepEqual(row.getCell(col('observed at (site local)')).value, new Date('2026-02-10T09:30:00.000Z'));
    assert.equal(row.getCell(col('plant')).value, 'P1');
    assert.equal(row.getCell(col('L*')).numFmt, '0.00');
    assert.equal(row.getCell(col('ΔE00')).numFmt, '0.00');
    assert.equal(row.getCell(col('notes')).value, '=HYPERLINK("x") typed by mistake', 'XLSX cells are typed text, never formulas, so no apostrophe');
    const hex = row.getCell(col('hex'));
    assert.equal(hex.value, first.hex);
    const fill = hex.fill as ExcelJS.FillPattern;
    assert.equal(fill.pattern, 'solid');
    assert.equal(fill.fgColor?.argb, `FF${first.hex.slice(1).toUpperCase()}`);
    assert.equal(row.getCell(col('provenance link')).value, `${PUBLIC_URL}/readings/${first.id}`);
  });

  test('should refuse bad filters with 400 naming them, and a signed-out caller with 401', async () => {
    assertInvalidFields(await reviewer.get('/api/readings/export.csv?method=guess'), 'method');
    assertInvalidFields(await reviewer.get('/api/readings/export.xlsx?from=yesterday'), 'from');
    assertProblem(await (await new Client(h.app).prime()).get('/api/readings/export.csv'), 401);
  });
});
