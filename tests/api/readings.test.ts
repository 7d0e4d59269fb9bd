// Readings (issue 5, items 1 and 3): every method creates a reading matched against the current
// set; bad input is a 400 naming the field and writes nothing; the list filters, sorts and pages
// in SQL; one reading opens with its matches, provenance, versions and history.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Color from 'colorjs.io';
import type { ChipDto } from '../../shared/api/reference-set-answers.js';
import type { ReadingDetail, ReadingDto, ReadingList } from '../../shared/api/reading-answers.js';
import { READINGS_PAGE_SIZE_MAX } from '../../shared/api/reading-answers.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { fromRaw, paintScene, uploadPhoto } from './photo-fixtures.js';
import { instrumentBody, readingWorld, type ReadingWorld } from './reading-fixtures.js';

/**
 * ΔE00 by colorjs.io 0.7.1 `deltaE2000`, an independent implementation of Sharma, Wu & Dalal
 * (2005). It works in its own `lab` space (D50 white) and would convert a `lab-d65` colour there
 * first, so our D65 numbers are handed to it as `lab` coordinates: the formula itself does not
 * depend on the white (as tests/reference/cross-check.test.ts does).
 */
function colorjsDeltaE00(p: readonly number[], q: readonly number[]): number {
  return new Color('lab', [p[0]!, p[1]!, p[2]!]).deltaE2000(new Color('lab', [q[0]!, q[1]!, q[2]!]));
}

describe('readings: create, list, detail', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let trainer: Client;
  let w: ReadingWorld;
  let chips: Map<string, ChipDto>;

  before(async () => {
    h = await startHarness();
    [admin, recorder, trainer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'trainer')]);
    w = await readingWorld(admin);
    chips = new Map(((await recorder.get('/api/reference-sets/v1/chips').expect(200)).body as ChipDto[]).map((c) => [c.code, c]));
  });
  after(() => h.close());

  describe('each method', () => {
    test('should take an instrument reading without a light, adapt D50/2° to D65/2° by Bradford (checked with colorjs.io) and keep what was reported', async () => {
      const reported: [number, number, number] = [38.2, 24.5, -12.1];
      const res = await recorder.post('/api/readings', instrumentBody(w, { light: undefined, illuminant: 'D50/2', lab: reported }));
      assert.equal(res.status, 201, res.text);
      const r = res.body as ReadingDetail;
      assert.equal(r.light, null);
      assert.equal(r.provenance.illuminant, 'D50/2');
      assert.deepEqual(r.provenance.reportedLab, reported);
      // colorjs.io 0.7.1: its `lab` is CIELAB D50 and `lab-d65` CIELAB D65, linked by the Bradford matrices of CSS Color 4.
      const expected = new Color('lab', reported).to('lab-d65').coords as number[];
      r.lab.forEach((v, i) => assert.ok(Math.abs(v - expected[i]!) < 0.01, `${['L*', 'a*', 'b*'][i]} ${v} vs colorjs.io ${expected[i]}`));
      assert.ok(colorjsDeltaE00(r.lab, reported) > 0.3, 'the stored numbers are the adapted ones, not those reported');
      const best = chips.get(r.bestChip)!;
      assert.ok(Math.abs(r.deltaE00 - colorjsDeltaE00(r.lab, best.lab)) < 1e-9, 'matched on the adapted colour');
      const again = (await recorder.get(`/api/readings/${r.id}`).expect(200)).body as ReadingDetail;
      assert.deepEqual([again.light, again.provenance.illuminant, again.provenance.reportedLab], [null, 'D50/2', reported]);
    });

    test('should keep a D65/10° instrument reading as reported (10° cannot become 2° without the spectrum), marked 10°', async () => {
      const res = await recorder.post('/api/readings', instrumentBody(w, { light: undefined, illuminant: 'D65/10' }));
      assert.equal(res.status, 201, res.text);
      const r = res.body as ReadingDetail;
      assert.deepEqual(r.lab, [38.2, 24.5, -12.1]);
      assert.equal(r.provenance.illuminant, 'D65/10');
      assert.equal(r.provenance.reportedLab, null);
    });

    test('should store an instrument reading with its best chip, ΔE00 (checked with colorjs.io), eye chip, season and plant age', async () => {
      const res = await recorder.post('/api/readings', instrumentBody(w, { eyeChipCode: 'F-092' }));
      assert.equal(res.status, 201, res.text);
      const r = res.body as ReadingDetail;
      assert.equal(res.headers['location'], `/api/readings/${r.id}`);
      assert.deepEqual(r.lab, [38.2, 24.5, -12.1]);
      assert.equal(r.method, 'instrument');
      assert.equal(r.provenance.instrument, 'Bench spectro A');
      assert.equal(r.setId, 'v1');
      const best = chips.get(r.bestChip)!;
      assert.ok(Math.abs(r.deltaE00 - colorjsDeltaE00(r.lab, best.lab)) < 1e-9, `ΔE00 ${r.deltaE00} vs colorjs.io`);
      assert.equal(r.matches[0]!.code, r.bestChip);
      // The best chip is the true nearest: no chip of the set is nearer by colorjs.io's ΔE00.
      let nearest = Infinity;
      for (const c of chips.values()) nearest = Math.min(nearest, colorjsDeltaE00(r.lab, c.lab));
      assert.ok(Math.abs(nearest - r.deltaE00) < 1e-9, `nearest by colorjs.io ${nearest}, stored ${r.deltaE00}`);
      assert.equal(r.eyeChipCode, 'F-092');
      assert.ok(Math.abs(r.eyeDeltaE00! - colorjsDeltaE00(r.lab, chips.get('F-092')!.lab)) < 1e-9);
      // Observed 10 Feb 2026 in Fiji: Wet began 1 Nov 2025, so season-year 2025.
      assert.deepEqual([r.season, r.seasonYear, r.siteId], ['Wet', 2025, w.wetDry.id]);
      // Planted 2025-01-20, read 2026-02-10 local: 12 completed months.
      assert.equal(r.plantAgeMonths, 12);
      assert.equal(r.status, 'submitted');
      assert.equal(r.supersedesId, null);
      assert.equal(r.supersededById, null);
      assert.match(r.hex, /^#[0-9a-f]{6}$/);
    });

    test('should take a chip reading as the chip’s own CIELAB (ΔE00 0 to it)', async () => {
      const res = await recorder.post('/api/readings', { ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'chip', chipCode: 'F-092.010' });
      assert.equal(res.status, 201, res.text);
      const r = res.body as ReadingDetail;
      assert.deepEqual(r.lab, chips.get('F-092.010')!.lab);
      assert.equal(r.provenance.source, 'F-092.010');
      assert.equal(r.deltaE00, 0);
      assert.equal(r.eyeChipCode, null);
    });

    test('should take a swatch reading from its hex (CIELAB checked against colorjs.io’s sRGB → Lab D65)', async () => {
      const res = await trainer.post('/api/readings', { ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'swatch', hex: '#7B3F6E' });
      assert.equal(res.status, 201, res.text);
      const r = res.body as ReadingDetail;
      const expected = new Color('#7b3f6e').to('lab-d65').coords;
      r.lab.forEach((v, i) => assert.ok(Math.abs(v - expected[i]!) < 0.01, `${v} vs ${expected[i]}`));
      assert.equal(r.provenance.source, '#7b3f6e');
      assert.equal(r.hex, '#7b3f6e');
      assert.equal(r.observerName, 'Test trainer');
    });

    test('should sample a photo reading on the server, with its provenance', async () => {
      const bytes = await fromRaw(paintScene(64, 64, [200, 200, 200], [{ rgb: [123, 63, 110], x: 8, y: 8, width: 40, height: 40 }]), 64, 64).png().toBuffer();
      const photo = (await uploadPhoto(recorder, bytes, 'leaf.png', 'image/png').expect(201)).body;
      const region = { shape: 'rect', x: 12, y: 12, width: 30, height: 30 };
      const sample = (await recorder.post(`/api/photos/${photo.id}/sample`, { region }).expect(200)).body;
      const res = await recorder.post('/api/readings', { ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'photo', photo: { photoId: photo.id, region }, eyeChipCode: 'F-092' });
      assert.equal(res.status, 201, res.text);
      const r = res.body as ReadingDetail;
      assert.deepEqual(r.lab, sample.lab);
      assert.equal(r.bestChip, sample.matches[0].code);
      assert.equal(r.provenance.photoId, photo.id);
      assert.deepEqual(r.provenance.region, region);
      assert.equal(r.provenance.pixelCount, 900);
      assert.equal(r.provenance.pixelsDropped, 0);
      assert.equal(r.provenance.uniform, true);
      assert.deepEqual(r.provenance.correction, { kind: 'none' });
      assert.equal(r.provenance.pipeline, sample.pipeline);
      assert.deepEqual([r.provenance.photoWidth, r.provenance.photoHeight], [64, 64]);
    });

    test('should default the site to the plant’s, else the accession’s', async () => {
      const atCoast = (await recorder.post('/api/readings', instrumentBody(w, { plantId: w.violet.plants[1]!.id })).expect(201)).body as ReadingDetail;
      assert.equal(atCoast.siteId, w.coast.id);
      // 2026-02-10 at the coast garden is its Dry season (01-01…05-31) of 2026.
      assert.deepEqual([atCoast.season, atCoast.seasonYear], ['Dry', 2026]);
      const noPlant = (await recorder.post('/api/readings', instrumentBody(w, { plantId: null })).expect(201)).body as ReadingDetail;
      assert.deepEqual([noPlant.siteId, noPlant.plantId, noPlant.plantAgeMonths], [w.wetDry.id, null, null]);
    });
  });

  describe('refusals', () => {
    const cases: [string, (w: ReadingWorld) => object, string][] = [
      ['a photo reading without the light', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, light: undefined, method: 'photo', photo: { photoId: 99999, region: { shape: 'point', x: 1, y: 1, radius: 1 } } }), 'light'],
      ['an unknown light', (w) => instrumentBody(w, { light: 'moonlight' as never }), 'light'],
      ['an instrument reading without lab', (w) => ({ ...instrumentBody(w), lab: undefined }), 'lab'],
      ['L* above 100', (w) => instrumentBody(w, { lab: [100.5, 0, 0] }), 'lab.0'],
      ['a* below −200', (w) => instrumentBody(w, { lab: [50, -250, 0] }), 'lab.1'],
      ['b* not a number', (w) => instrumentBody(w, { lab: [50, 0, 'x' as never] }), 'lab.2'],
      ['a lab of two numbers', (w) => instrumentBody(w, { lab: [50, 0] as never }), 'lab'],
      ['a chip code on an instrument reading', (w) => instrumentBody(w, { chipCode: 'F-001' }), 'chipCode'],
      ['an unknown method', (w) => instrumentBody(w, { method: 'guess' as never }), 'method'],
      ['an unknown accession', (w) => instrumentBody(w, { accessionId: 99999, plantId: null }), 'accessionId'],
      ['an unknown character', (w) => instrumentBody(w, { characterId: 99999 }), 'characterId'],
      ['an unknown site', (w) => instrumentBody(w, { siteId: 99999 }), 'siteId'],
      ['an unknown plant', (w) => instrumentBody(w, { plantId: 99999 }), 'plantId'],
      ['a plant of another accession', (w) => instrumentBody(w, { plantId: w.amber.plants[0]!.id }), 'plantId'],
      ['a plant read before it was planted', (w) => instrumentBody(w, { plantId: w.violet.plants[1]!.id, observedAt: '2025-05-20T10:00:00-04:00' }), 'plantId'],
      ['a time in the future', (w) => instrumentBody(w, { observedAt: new Date(Date.now() + 3_600_000).toISOString() }), 'observedAt'],
      ['a time without an offset', (w) => instrumentBody(w, { observedAt: '2026-02-10T09:30:00' }), 'observedAt'],
      ['an eye chip not in the set', (w) => instrumentBody(w, { eyeChipCode: 'F-999.999' }), 'eyeChipCode'],
      ['an eye chip on a chip reading', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'chip', chipCode: 'F-092', eyeChipCode: 'F-093' }), 'eyeChipCode'],
      ['a chip not in the set', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'chip', chipCode: 'F-999' }), 'chipCode'],
      ['a bad hex', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'swatch', hex: 'purple' }), 'hex'],
      ['an unknown photo', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'photo', photo: { photoId: 99999, region: { shape: 'point', x: 1, y: 1, radius: 1 } } }), 'photo.photoId'],
      ['seconds since cut beyond a day', (w) => instrumentBody(w, { secondsSinceCut: 86_401 }), 'secondsSinceCut'],
      ['notes over 2000 characters', (w) => instrumentBody(w, { notes: 'x'.repeat(2001) }), 'notes'],
      ['an unknown field', (w) => ({ ...instrumentBody(w), colour: 'purple' }), 'body'],
      ['a chip reading without the light', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, light: undefined, method: 'chip', chipCode: 'F-092' }), 'light'],
      ['an unknown illuminant/observer', (w) => instrumentBody(w, { illuminant: 'A/10' as never }), 'illuminant'],
      ['an illuminant/observer on a swatch reading', (w) => ({ ...instrumentBody(w), lab: undefined, instrument: undefined, method: 'swatch', hex: '#7b3f6e', illuminant: 'D65/2' }), 'illuminant'],
    ];
    for (const [what, body, field] of cases) {
      test(`should refuse ${what} with 400 naming ${field}, writing nothing`, async () => {
        const before = await rowCounts(h.ds);
        assertInvalidFields(await recorder.post('/api/readings', body(w)), field);
        assert.deepEqual(await rowCounts(h.ds), before);
      });
    }

    test('should say in words, not ISO dates, when a plant was planted after the reading', async () => {
      const res = await recorder.post('/api/readings', instrumentBody(w, { plantId: w.violet.plants[1]!.id, observedAt: '2025-05-20T10:00:00-04:00' }));
      const problem = assertProblem(res, 400);
      const message = problem.errors!.find((e) => e.field === 'plantId')!.message;
      assert.match(message, /^plant \S+ was planted on \d{1,2} [A-Z][a-z]{2} \d{4}, after this reading \(20 May 2025 at \S+\)$/);
      assert.doesNotMatch(message, /\d{4}-\d{2}-\d{2}/);
    });

    test('should name every unknown id at once', async () => {
      const res = await recorder.post('/api/readings', instrumentBody(w, { accessionId: 99998, characterId: 99997, plantId: null }));
      assertInvalidFields(res, 'accessionId', 'characterId');
    });

    test('should refuse a retired character and a non-colour one, naming characterId', async () => {
      const retired = (await admin.post('/api/characters', { code: 'test.retired', organ: 'leaf', label: 'Retired test character', howToRead: 'Not read any more; kept for old readings.' }).expect(201)).body;
      await admin.patch(`/api/characters/${retired.id}`, { active: false }).expect(200);
      const plain = (await admin.post('/api/characters', { code: 'test.shape', organ: 'leaf', label: 'Leaf shape (not a colour)', howToRead: 'Look at the outline of the blade.', colour: false }).expect(201)).body;
      for (const id of [retired.id, plain.id]) {
        const before = await rowCounts(h.ds);
        assertInvalidFields(await recorder.post('/api/readings', instrumentBody(w, { characterId: id })), 'characterId');
        assert.deepEqual(await rowCounts(h.ds), before);
      }
    });

    test('should answer a resend with the same Idempotency-Key from the first save, storing one reading', async () => {
      const body = instrumentBody(w, { notes: 'sent twice from a phone' });
      const first = await recorder.post('/api/readings', body).set('Idempotency-Key', 'reading-resend-0001');
      assert.equal(first.status, 201, first.text);
      const before = await rowCounts(h.ds);
      const again = await recorder.post('/api/readings', body).set('Idempotency-Key', 'reading-resend-0001');
      assert.equal(again.status, 201, again.text);
      assert.equal(again.headers['idempotent-replayed'], 'true');
      assert.equal(again.body.id, first.body.id);
      assert.equal((await rowCounts(h.ds))['reading'], before['reading']);
    });

    test('should refuse a reviewer with 403, writing nothing', async () => {
      const reviewer = await signedInAs(h, 'reviewer');
      const before = await rowCounts(h.ds);
      assertProblem(await reviewer.post('/api/readings', instrumentBody(w)), 403);
      assert.deepEqual(await rowCounts(h.ds), before);
    });
  });

  describe('the list', () => {
    let own: Client;
    const made: ReadingDto[] = [];

    before(async () => {
      own = await signedInAs(h, 'recorder');
      const petiole = w.characters.get('petiole.third.upper')!.id;
      const ring = w.characters.get('petiole.ring.basal')!.id;
      // Nine readings over two seasons, two characters, two accessions, three methods.
      const bodies = [
        instrumentBody(w, { observedAt: '2025-06-15T10:00:00+12:00', lab: [40, 20, -10], characterId: ring }),
        instrumentBody(w, { observedAt: '2025-07-15T10:00:00+12:00', lab: [41, 21, -11] }),
        instrumentBody(w, { observedAt: '2025-11-15T10:00:00+12:00', lab: [42, 22, -12] }),
        instrumentBody(w, { observedAt: '2025-12-15T10:00:00+12:00', lab: [43, 23, -13], characterId: ring }),
        instrumentBody(w, { observedAt: '2026-01-15T10:00:00+12:00', lab: [44, 24, -14] }),
        { ...instrumentBody(w, { observedAt: '2026-03-15T10:00:00+12:00' }), lab: undefined, instrument: undefined, method: 'chip' as const, chipCode: 'F-050' },
        { ...instrumentBody(w, { observedAt: '2026-05-15T10:00:00+12:00' }), lab: undefined, instrument: undefined, method: 'swatch' as const, hex: '#556b2f' },
        instrumentBody(w, { accessionId: w.amber.id, plantId: w.amber.plants[0]!.id, observedAt: '2026-07-01T10:00:00-04:00', lab: [70, 5, 40] }),
        instrumentBody(w, { accessionId: w.amber.id, plantId: null, observedAt: '2026-08-01T10:00:00-04:00', lab: [71, 6, 41], characterId: petiole }),
      ];
      for (const body of bodies) made.push((await own.post('/api/readings', body).expect(201)).body);
    });

    const list = async (query: string) => (await admin.get(`/api/readings?${query}`).expect(200)).body as ReadingList;
    const ids = (page: ReadingList) => page.items.map((r) => r.id);
    const ownIds = () => new Set(made.map((r) => r.id));

    test('should filter by observer, accession, character, site, method, season and season-year', async () => {
      const observerId = made[0]!.observerId;
      const mine = await list(`observerId=${observerId}&pageSize=100`);
      assert.equal(mine.total, 9);
      assert.ok(mine.items.every((r) => ownIds().has(r.id)));
      assert.equal((await list(`observerId=${observerId}&accessionId=${w.amber.id}`)).total, 2);
      assert.equal((await list(`observerId=${observerId}&characterId=${w.characters.get('petiole.ring.basal')!.id}`)).total, 2);
      assert.equal((await list(`observerId=${observerId}&siteId=${w.coast.id}`)).total, 2);
      assert.deepEqual(ids(await list(`observerId=${observerId}&method=chip`)), [made[5]!.id]);
      // Wet 2025 at the Fiji plot: 15 Nov 2025, 15 Dec 2025, 15 Jan 2026, 15 Mar 2026.
      const wet = await list(`observerId=${observerId}&season=Wet&seasonYear=2025&siteId=${w.wetDry.id}&sort=observedAt&dir=asc`);
      assert.deepEqual(ids(wet), [made[2]!.id, made[3]!.id, made[4]!.id, made[5]!.id]);
      assert.equal((await list(`observerId=${observerId}&status=submitted`)).total, 9);
      assert.equal((await list(`observerId=${observerId}&status=approved`)).total, 0);
    });

    test('should filter by date range, both ends inclusive (UTC days)', async () => {
      const observerId = made[0]!.observerId;
      // 2025-11-15T10:00+12:00 is 2025-11-14 22:00 UTC; 2026-01-15T10:00+12:00 is 2026-01-14 22:00 UTC.
      const range = await list(`observerId=${observerId}&from=2025-11-14&to=2026-01-14&sort=observedAt&dir=asc`);
      assert.deepEqual(ids(range), [made[2]!.id, made[3]!.id, made[4]!.id]);
      assert.equal((await list(`observerId=${observerId}&from=2025-11-15&to=2026-01-13`)).total, 1);
    });

    test('should sort by each key in SQL, both directions, ties broken by id', async () => {
      const observerId = made[0]!.observerId;
      const byDe = await list(`observerId=${observerId}&sort=deltaE00&dir=asc&pageSize=100`);
      const des = byDe.items.map((r) => r.deltaE00);
      assert.deepEqual(des, [...des].sort((a, b) => a - b));
      assert.equal(byDe.items[0]!.id, made[5]!.id, 'the chip reading has ΔE00 0');
      const byAccessionDesc = await list(`observerId=${observerId}&sort=accession&dir=desc&pageSize=100`);
      const numbers = byAccessionDesc.items.map((r) => r.accessionNumber);
      assert.deepEqual(numbers, [...numbers].sort().reverse());
      const byTime = await list(`observerId=${observerId}&pageSize=100`);
      const times = byTime.items.map((r) => r.observedAt);
      assert.deepEqual(times, [...times].sort().reverse(), 'the default is newest observed first');
      for (const sort of ['character', 'site', 'observer', 'method', 'status']) {
        for (const dir of ['asc', 'desc']) assert.equal((await list(`observerId=${observerId}&sort=${sort}&dir=${dir}`)).total, 9, `${sort} ${dir}`);
      }
      const bySite = await list(`observerId=${observerId}&sort=site&dir=asc&pageSize=100`);
      const codes = bySite.items.map((r) => r.siteCode);
      assert.deepEqual(codes, [...codes].sort());
    });

    test('should page without overlap or gaps, with the total of all pages', async () => {
      const observerId = made[0]!.observerId;
      const seen: number[] = [];
      for (let page = 1; page <= 4; page++) {
        const p = await list(`observerId=${observerId}&sort=method&dir=asc&page=${page}&pageSize=4`);
        assert.equal(p.total, 9);
        assert.equal(p.items.length, page < 3 ? 4 : page === 3 ? 1 : 0);
        seen.push(...ids(p));
      }
      assert.deepEqual([...seen].sort((a, b) => a - b), [...ownIds()].sort((a, b) => a - b));
    });

    test(`should cap pageSize at ${READINGS_PAGE_SIZE_MAX} and name every bad filter`, async () => {
      assertInvalidFields(await admin.get(`/api/readings?pageSize=${READINGS_PAGE_SIZE_MAX + 1}`), 'pageSize');
      assertInvalidFields(await admin.get('/api/readings?pageSize=0&page=0'), 'pageSize', 'page');
      assertInvalidFields(await admin.get('/api/readings?accessionId=abc&characterId=-1&siteId=1.5&observerId=x'), 'accessionId', 'characterId', 'siteId', 'observerId');
      assertInvalidFields(await admin.get('/api/readings?method=guess&status=lost&sort=colour&dir=up'), 'method', 'status', 'sort', 'dir');
      assertInvalidFields(await admin.get('/api/readings?from=2026-13-01&seasonYear=twenty'), 'from', 'seasonYear');
      assertInvalidFields(await admin.get('/api/readings?from=2026-02-01&to=2026-01-01'), 'to');
      assertInvalidFields(await admin.get('/api/readings?includeSuperseded=maybe'), 'includeSuperseded');
      assertInvalidFields(await admin.get('/api/readings?colour=purple'), 'query');
    });
  });

  describe('one reading', () => {
    test('should open with five matches, between, provenance, itself as the only version, and its creation in the history', async () => {
      const created = (await recorder.post('/api/readings', instrumentBody(w, { notes: 'Read beside the path.', leafPosition: 'third leaf', secondsSinceCut: 30 })).expect(201)).body as ReadingDetail;
      const res = await (await signedInAs(h, 'reviewer')).get(`/api/readings/${created.id}`);
      assert.equal(res.status, 200, res.text);
      const r = res.body as ReadingDetail;
      assert.equal(r.matches.length, 5);
      assert.equal(r.matches[0]!.code, r.bestChip);
      assert.ok(r.matches.every((m, i) => i === 0 || m.deltaE00 >= r.matches[i - 1]!.deltaE00));
      assert.equal(r.between?.a, r.bestChip);
      assert.deepEqual([r.notes, r.leafPosition, r.secondsSinceCut, r.light], ['Read beside the path.', 'third leaf', 30, 'open-shade']);
      assert.deepEqual(r.versions.map((v) => [v.id, v.current, v.reason]), [[r.id, true, null]]);
      assert.deepEqual(r.history.map((e) => [e.action, e.actorName]), [['reading.created', 'Test recorder']]);
      assert.equal(r.accessionNumber, 'RT-V');
      assert.equal(r.plantLabel, 'P1');
      assert.equal(r.characterCode, 'petiole.third.upper');
      assert.equal(r.siteCode, 'RWD');
    });

    test('should answer 404 problem+json for no such reading', async () => {
      assertProblem(await recorder.get('/api/readings/999999'), 404);
      assertProblem(await recorder.get('/api/readings/abc'), 404);
    });
  });
});
