// The characterisation record of an accession (issue 14) through the API: a worked example whose
// centre, spread and outliers are computed by hand or by colorjs.io (an independent CIEDE2000),
// the approved readings taking over as the basis once a reviewer approves any, the demo's drifting
// and steady pairs, descriptor summaries, roles and bad input.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Color from 'colorjs.io';
import type { AccessionProfile, CharacterProfile } from '../../shared/api/profile-answers.js';
import type { LabTuple } from '../../shared/colour/lab.js';
import ExcelJS from 'exceljs';
import { DEMO_DRIFT, DEMO_STEADY } from '../../server/demo/demo-readings.js';
import { profilePdf, RECORD_CAUTION } from '../../server/profile/profile-pdf.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { bytes } from './reference-set-file.js';
import { Client, signedInAs, startHarness, type Harness } from './harness.js';

const close = (actual: number, expected: number, tol: number, what: string) => assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} ≠ ${expected}`);
/** colorjs.io's CIEDE2000 on the same L*a*b* numbers (tests/reference/cross-check.test.ts shows it agrees with Sharma et al. 2005). */
const colorjsDE00 = (p: LabTuple, q: LabTuple) => new Color('lab', p).deltaE(new Color('lab', q), '2000');

/*
 * The worked example: five readings of one character, the last with L* typed as 90.
 *   L* 51, 51.5, 52,  53,   90 → median 52 (the mean would be 59.5)
 *   a* 10, 10.5, 10,  10.2, 10 → median 10
 *   b*  5,  5,    5.5, 5,    5 → median 5
 * so the centre is (52, 10, 5), and the 90 lies far beyond the default threshold ΔE00 1.8
 * (Paravina et al. 2015 acceptability), the one outlier. Readings 1–3 by the recorder, 4–5 by the
 * trainer; plants P1 (readings 1, 2, 5) and P2 (3, 4).
 */
const WORKED: LabTuple[] = [[51, 10, 5], [51.5, 10.5, 5], [52, 10, 5.5], [53, 10.2, 5], [90, 10, 5]];

/** The text of an uncompressed pdfkit PDF: each TJ array's hex strings, decoded as Latin-1 (WinAnsi for these characters). */
function pdfTextOf(pdf: Buffer): string {
  return [...pdf.toString('latin1').matchAll(/\[((?:<[0-9a-f]*>\s*-?[\d.]*\s*)+)\] TJ/g)]
    .map((m) => [...m[1]!.matchAll(/<([0-9a-f]*)>/g)].map((h) => Buffer.from(h[1]!, 'hex').toString('latin1')).join(''))
    .join('\n');
}

describe('the characterisation record of an accession', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let trainer: Client;
  let reviewer: Client;
  const ids = { accession: 0, character: 0, site: 0, p1: 0, p2: 0, readings: [] as number[] };
  const profile = async (client: Client, id: number, query = '') => {
    const res = await client.get(`/api/accessions/${id}/profile${query}`);
    assert.equal(res.status, 200, res.text);
    return res.body as AccessionProfile;
  };
  const characterOf = (p: AccessionProfile, id: number): CharacterProfile => p.characters.find((c) => c.characterId === id) ?? assert.fail(`no character ${id}`);

  before(async () => {
    h = await startHarness({ demo: true });
    [admin, recorder, trainer, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'trainer'), signedInAs(h, 'reviewer')]);
    const seasons = [{ name: 'Wet', start: '11-01', end: '04-30' }, { name: 'Dry', start: '05-01', end: '10-31' }];
    ids.site = (await admin.post('/api/sites', { code: 'PWX', name: 'Profile worked example plot', timezone: 'UTC', seasons }).expect(201)).body.id;
    const accession = (await admin.post('/api/accessions', { accessionNumber: 'PW-0001', name: 'Profile Example', siteId: ids.site, plants: [{ label: 'P1', plantedOn: '2025-01-01' }, { label: 'P2', plantedOn: '2025-01-01' }] }).expect(201)).body;
    ids.accession = accession.id;
    [ids.p1, ids.p2] = accession.plants.map((p: { id: number }) => p.id);
    ids.character = (await admin.post('/api/characters', { code: 'petiole.profile.example', organ: 'petiole', label: 'Profile example petiole', howToRead: 'Middle third of the youngest open leaf.' }).expect(201)).body.id;
    const who = [recorder, recorder, recorder, trainer, trainer];
    const plant = [ids.p1, ids.p1, ids.p2, ids.p2, ids.p1];
    for (const [i, lab] of WORKED.entries()) {
      const res = await who[i]!.post('/api/readings', { accessionId: ids.accession, plantId: plant[i], characterId: ids.character, siteId: ids.site, observedAt: `2025-06-0${i + 2}T10:00:00Z`, method: 'instrument', lab, light: 'overcast' });
      assert.equal(res.status, 201, res.text);
      ids.readings.push(res.body.id);
    }
  });
  after(() => h.close());

  test("should give the accepted colour's nearest chip in v1 and in v2, marking the set the record is shown in and the current one", async () => {
    for (const query of ['', '?setId=v2']) {
      const p = await profile(reviewer, ids.accession, query);
      const c = characterOf(p, ids.character);
      assert.deepEqual(c.setChips.map((s) => [s.setId, s.current, s.shown]), [['v1', true, p.referenceSet.id === 'v1'], ['v2', false, p.referenceSet.id === 'v2']], `profile${query}`);
      for (const s of c.setChips) {
        // The same exact search the Match page runs, asked of each set in turn.
        const best = (await reviewer.post('/api/match', { lab: c.centre.lab, setId: s.setId, k: 1 }).expect(200)).body.matches[0];
        assert.equal(s.chip.code, best.code, `${s.setId} chip`);
        close(s.chip.deltaE00, colorjsDE00(c.centre.lab, best.lab), 1e-6, `${s.setId} ΔE00 against colorjs.io`);
      }
      assert.equal(c.setChips.find((s) => s.shown)!.chip.code, c.chip.code);
      // v2 codes never reuse v1's (reference-colors/README.md): v1 field chips end at F-189.
      assert.ok(Number(c.setChips[1]!.chip.code.slice(2, 5)) > 189, c.setChips[1]!.chip.code);
    }
  });

  test('should centre a character on the per-channel median, not the mean, and match the centre to the nearest chip', async () => {
    const c = characterOf(await profile(reviewer, ids.accession), ids.character);
    assert.equal(c.basis, 'current');
    assert.deepEqual(c.centre.lab, [52, 10, 5]);
    assert.deepEqual([c.nReadings, c.nCurrent, c.nObservers, c.nPlants], [5, 5, 2, 2]);
    const match = (await reviewer.post('/api/match', { lab: [52, 10, 5], k: 1 }).expect(200)).body;
    assert.equal(c.chip.code, match.matches[0].code);
    close(c.chip.deltaE00, match.matches[0].deltaE00, 1e-9, 'chip ΔE00');
    assert.equal(c.chip.verdict, c.chip.deltaE00 <= 0.8 ? 'indistinguishable' : c.chip.deltaE00 <= 1.8 ? 'close' : 'clearly different');
  });

  test('should give the spread as the mean ΔE00 from the centre (colorjs.io) and list readings beyond the threshold as outliers', async () => {
    const c = characterOf(await profile(reviewer, ids.accession), ids.character);
    const distances = WORKED.map((lab) => colorjsDE00([52, 10, 5], lab));
    close(c.spreadDeltaE00, distances.reduce((s, x) => s + x, 0) / distances.length, 1e-4, 'spread');
    assert.equal(c.threshold, 1.8);
    const beyond = ids.readings.filter((_, i) => distances[i]! > 1.8);
    assert.deepEqual(beyond, [ids.readings[4]], 'only the L* 90 lies beyond 1.8 by colorjs.io');
    assert.deepEqual(c.outliers.map((o) => o.readingId), beyond);
    close(c.outliers[0]!.deltaE00, distances[4]!, 1e-4, 'outlier ΔE00');
    assert.equal(c.outliers[0]!.plantLabel, 'P1');
  });

  test('should rest on the approved readings once a reviewer approves any', async () => {
    for (const id of ids.readings.slice(0, 2)) await reviewer.post(`/api/readings/${id}/review`, { decision: 'approve' }).expect(201);
    const c = characterOf(await profile(recorder, ids.accession), ids.character);
    assert.equal(c.basis, 'approved');
    // Median of two is their mean: L* (51 + 51.5) / 2, a* (10 + 10.5) / 2, b* 5.
    assert.deepEqual(c.centre.lab, [51.25, 10.25, 5]);
    assert.deepEqual([c.nReadings, c.nCurrent, c.nObservers, c.nPlants], [2, 5, 1, 1]);
  });

  test('should flag the demo drift pair and not the steady pair, with per-season centres', async () => {
    const accessions = (await reviewer.get('/api/accessions').expect(200)).body as { id: number; accessionNumber: string }[];
    const characters = (await reviewer.get('/api/characters').expect(200)).body as { id: number; code: string }[];
    const idOf = (n: string) => accessions.find((a) => a.accessionNumber === n)!.id;
    const charOf = (code: string) => characters.find((c) => c.code === code)!.id;
    const drifting = characterOf(await profile(reviewer, idOf(DEMO_DRIFT.accessionNumber)), charOf(DEMO_DRIFT.characterCode));
    assert.ok(drifting.flagged);
    assert.ok(drifting.flags.some((f) => f.kind === 'season-drift' && f.deltaE00 >= 1.8 && f.pValue < 0.05), JSON.stringify(drifting.flags));
    assert.ok(!drifting.flags.some((f) => /p = </.test(f.reason)), 'reasons read "p < 0.001", never "p = < 0.001"');
    assert.deepEqual(drifting.seasons.map((s) => `${s.season} ${s.seasonYear}`), ['Dry 2025', 'Wet 2025', 'Dry 2026']);
    // The demo's Wet season (November to April) wraps the year end: named by both years, in the flags too.
    assert.deepEqual(drifting.seasons.map((s) => s.seasonLabel), ['Dry 2025', 'Wet 2025–26', 'Dry 2026']);
    assert.ok(drifting.flags.some((f) => f.kind === 'season-drift' && f.label.includes('Wet 2025–26')), JSON.stringify(drifting.flags.map((f) => f.label)));
    // The wet group's centre lies near the demo's wet colour, the dry groups near the dry one.
    close(drifting.seasons[1]!.centre.lab[0], DEMO_DRIFT.wet[0], 0.5, 'wet L*');
    close(drifting.seasons[0]!.centre.lab[0], DEMO_DRIFT.dry[0], 0.5, 'dry L*');
    const steady = characterOf(await profile(reviewer, idOf(DEMO_STEADY.accessionNumber)), charOf(DEMO_STEADY.characterCode));
    assert.equal(steady.flagged, false, JSON.stringify(steady.flags));
    assert.ok(steady.spreadDeltaE00 < 0.8, `steady spread ${steady.spreadDeltaE00}`);
    assert.deepEqual(steady.outliers, []);
  });

  test('should summarise descriptors: median and range of numbers, mode and share of categories', async () => {
    const accessions = (await reviewer.get('/api/accessions').expect(200)).body as { id: number; accessionNumber: string }[];
    const id = accessions.find((a) => a.accessionNumber === DEMO_DRIFT.accessionNumber)!.id;
    const p = await profile(reviewer, id);
    const values = (await reviewer.get(`/api/accessions/${id}/descriptors`).expect(200)).body as { plants: { values: { code: string; valueSi: number | null; category: string | null }[] }[] };
    const of = (code: string) => values.plants.flatMap((x) => x.values).filter((v) => v.code === code);
    const petiole = p.descriptors.find((d) => d.code === 'petiole.length') ?? assert.fail('petiole.length summarised');
    const xs = of('petiole.length').map((v) => v.valueSi!).sort((a, b) => a - b);
    assert.equal(petiole.n, xs.length);
    assert.equal(petiole.min, xs[0]);
    assert.equal(petiole.max, xs.at(-1));
    close(petiole.median!, xs.length % 2 ? xs[(xs.length - 1) / 2]! : (xs[xs.length / 2 - 1]! + xs[xs.length / 2]!) / 2, 1e-12, 'median');
    const position = p.descriptors.find((d) => d.kind === 'category') ?? assert.fail('a category summarised');
    const cats = of(position.code).map((v) => v.category);
    const count = cats.filter((c) => c === position.mode).length;
    assert.ok(cats.every((c) => cats.filter((d) => d === c).length <= count), 'the mode is the commonest');
    close(position.share!, count / cats.length, 1e-12, 'share');
  });

  test('should print the record as a PDF with the swatch codes, numbers, season notes and the caution', async () => {
    const res = await reviewer.get(`/api/accessions/${ids.accession}/profile.pdf`).buffer(true).parse(bytes);
    assert.equal(res.status, 200);
    assert.match(String(res.headers['content-type']), /^application\/pdf/);
    assert.match(String(res.headers['content-disposition']), /characterisation-PW-0001\.pdf/);
    const file = res.body as Buffer;
    assert.equal(file.subarray(0, 5).toString('latin1'), '%PDF-');
    assert.match(file.subarray(-8).toString('latin1'), /%%EOF/);
    // The same record uncompressed, so its text can be read back: pdfkit writes Helvetica text as hex strings in TJ arrays.
    const text = pdfTextOf(await profilePdf(await profile(reviewer, ids.accession), { compress: false }));
    const c = characterOf(await profile(reviewer, ids.accession), ids.character);
    // The printed record names the accepted colour's chip in v2 as well as in the current v1.
    const v2 = c.setChips.find((s) => s.setId === 'v2')!.chip.code;
    for (const expected of ['Characterisation record \u00b7 PW-0001 Profile Example', c.chip.code, 'Nearest chip in each set:', v2, 'L* 51.25, a* 10.25, b* 5.00', 'Seasons: Dry 2025 n 5', 'Caution: ', RECORD_CAUTION.slice(0, 60)]) {
      assert.ok(text.includes(expected), `the PDF says "${expected}"`);
    }
  });

  test('should export the collection\'s characterisation as XLSX with an explanation sheet', async () => {
    const res = await reviewer.get('/api/accessions/characterisation.xlsx').buffer(true).parse(bytes);
    assert.equal(res.status, 200, String(res.body));
    const book = new ExcelJS.Workbook();
    await book.xlsx.load(res.body as ArrayBuffer);
    assert.deepEqual(book.worksheets.map((w) => w.name), ['Colours', 'Descriptors', 'About']);
    const colours = book.getWorksheet('Colours')!;
    const header = (colours.getRow(1).values as unknown[]).slice(1);
    const rows = colours.getSheetValues().slice(2).map((r) => Object.fromEntries(header.map((h, i) => [h, (r as unknown[])[i + 1]])));
    const mine = rows.find((r) => r['accession'] === 'PW-0001' && r['character'] === 'petiole.profile.example') ?? assert.fail('a row for the worked example');
    assert.deepEqual([mine['L*'], mine['a*'], mine['b*'], mine['basis'], mine['readings'], mine['readings in force']], [51.25, 10.25, 5, 'approved', 2, 5]);
    // The chip in v1 and in v2, as the record shows them.
    const record = ((await reviewer.get(`/api/accessions/${ids.accession}/profile`).expect(200)).body as AccessionProfile).characters.find((x) => x.code === 'petiole.profile.example')!;
    assert.equal(mine['chip in each set'], record.setChips.map((s) => `${s.setId} ${s.chip.code} (ΔE00 ${s.chip.deltaE00.toFixed(2)})`).join('; '));
    assert.match(String(mine['chip in each set']), /^v1 F-\d{3}\.\d{3} \(ΔE00 \d+\.\d\d\); v2 F-\d{3}(\.\d{3})? \(ΔE00 \d+\.\d\d\)$/);
    const accessions = (await reviewer.get('/api/accessions').expect(200)).body as unknown[];
    assert.ok(new Set(rows.map((r) => r['accession'])).size >= accessions.length - 1, 'every accession with colour readings has rows');
    const about = book.getWorksheet('About')!.getSheetValues().map((r) => ((r as unknown[]) ?? []).slice(1).join(' ')).join('\n');
    assert.match(about, /white point D65/);
    assert.match(about, /2° standard observer/);
    assert.match(about, /Reference set v1/i);
    for (const h of header) assert.ok(about.includes(String(h)), `the About sheet explains "${h}"`);
  });

  test('should be read by every role and refused when signed out', async () => {
    for (const client of [admin, recorder, trainer, reviewer]) await client.get(`/api/accessions/${ids.accession}/profile`).expect(200);
    assertProblem(await new Client(h.app).get(`/api/accessions/${ids.accession}/profile`), 401);
  });

  test('should refuse bad input with problem+json naming the field', async () => {
    assertInvalidFields(await reviewer.get(`/api/accessions/${ids.accession}/profile?setId=no%20such!`), 'setId');
    assertInvalidFields(await reviewer.get(`/api/accessions/${ids.accession}/profile?colour=red`), 'query');
    assert.match(assertProblem(await reviewer.get(`/api/accessions/${ids.accession}/profile?setId=v999`), 404).detail ?? '', /v999/);
    assertProblem(await reviewer.get('/api/accessions/999999/profile'), 404);
    assertProblem(await reviewer.get('/api/accessions/abc/profile'), 404);
    assertInvalidFields(await reviewer.get(`/api/accessions/${ids.accession}/profile.pdf?setId=%24`), 'setId');
    assertProblem(await reviewer.get('/api/accessions/999999/profile.pdf'), 404);
    assertInvalidFields(await reviewer.get('/api/accessions/characterisation.xlsx?sheet=1'), 'query');
    assertProblem(await new Client(h.app).get('/api/accessions/characterisation.xlsx'), 401);
  });
});
