// The drift overview of the whole collection (issue 14): the demo's drifting pair first, the steady
// pair absent, a difference between two sites within one season found (and the same two sites in
// different seasons not mistaken for one), kept results reused until the readings change, roles and
// bad input.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import type { DriftOverviewAnswer } from '../../shared/api/analysis-answers.js';
import { DEMO_DRIFT, DEMO_STEADY } from '../../server/demo/demo-readings.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, signedInAs, startHarness, type Harness } from './harness.js';

describe('the drift overview', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let reviewer: Client;
  const ids = { accession: 0, character: 0, north: 0, south: 0 };
  const overview = async (client: Client = reviewer) => {
    const res = await client.get('/api/analysis/overview');
    assert.equal(res.status, 200, res.text);
    return res.body as DriftOverviewAnswer;
  };
  const read = (siteId: number, day: string, lab: [number, number, number]) =>
    recorder.post('/api/readings', { accessionId: ids.accession, characterId: ids.character, siteId, observedAt: `${day}T10:00:00Z`, method: 'instrument', lab, light: 'overcast' }).expect(201);

  before(async () => {
    h = await startHarness({ demo: true });
    [admin, recorder, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
    const seasons = [{ name: 'Wet', start: '11-01', end: '04-30' }, { name: 'Dry', start: '05-01', end: '10-31' }];
    ids.north = (await admin.post('/api/sites', { code: 'OVN', name: 'Overview north plot', timezone: 'UTC', seasons }).expect(201)).body.id;
    ids.south = (await admin.post('/api/sites', { code: 'OVS', name: 'Overview south plot', timezone: 'UTC', seasons }).expect(201)).body.id;
    ids.accession = (await admin.post('/api/accessions', { accessionNumber: 'OV-0001', name: 'Overview Example', siteId: ids.north }).expect(201)).body.id;
    ids.character = (await admin.post('/api/characters', { code: 'sheath.overview.example', organ: 'sheath', label: 'Overview example sheath', howToRead: 'Inside of the outer sheath.' }).expect(201)).body.id;
    // Dry 2025: north L* 40–41.5, south L* 44–45.5, four each: ΔE00 about 3.7 (below the demo's
    // drift), and an exact test of C(8, 4) = 70 splits gives p = 2/70 < 0.05 (only the observed split
    // and its mirror are as extreme), so the two sites differ within that season.
    for (const [i, l] of [40, 40.5, 41, 41.5].entries()) await read(ids.north, `2025-06-0${i + 2}`, [l, 20, -10]);
    for (const [i, l] of [44, 44.5, 45, 45.5].entries()) await read(ids.south, `2025-06-1${i + 2}`, [l, 20, -10]);
  });
  after(() => h.close());

  test('should list the demo drifting pair first and leave out the steady pair', async () => {
    const o = await overview();
    assert.ok(o.items.length >= 1);
    assert.equal(o.items[0]!.accessionNumber, DEMO_DRIFT.accessionNumber);
    assert.equal(o.items[0]!.characterCode, DEMO_DRIFT.characterCode);
    assert.ok(o.items[0]!.flags.every((f) => f.kind === 'season-drift' && f.deltaE00 >= 1.8 && f.pValue < 0.05));
    assert.ok(!o.items.some((i) => i.accessionNumber === DEMO_STEADY.accessionNumber && i.characterCode === DEMO_STEADY.characterCode));
    const sorted = o.items.map((i) => i.deltaE00);
    assert.deepEqual(sorted, [...sorted].sort((x, y) => y - x), 'largest ΔE00 first');
    assert.ok(o.pairs > 0 && o.readings >= o.pairs);
  });

  test('should flag two sites that differ within one season, naming the season', async () => {
    const o = await overview();
    const item = o.items.find((i) => i.accessionId === ids.accession) ?? assert.fail('the overview example is listed');
    assert.deepEqual(item.flags.map((f) => [f.kind, f.label, f.season, f.seasonYear]), [['site-difference', 'OVN ↔ OVS in Dry 2025', 'Dry', 2025]]);
    assert.ok(Math.abs(item.flags[0]!.pValue - 2 / 70) < 1e-12, `exact p = 2/70, got ${item.flags[0]!.pValue}`);
    assert.match(item.flags[0]!.reason, /p = 0\.029/);
  });

  test('should compare sites within the season group the overview names', async () => {
    const q = `accessionId=${ids.accession}&characterId=${ids.character}`;
    const within = (await reviewer.get(`/api/analysis/sites?${q}&season=Dry&seasonYear=2025`).expect(200)).body;
    assert.deepEqual([within.season, within.seasonYear, within.sites.map((s: { siteCode: string; n: number }) => `${s.siteCode} ${s.n}`)], ['Dry', 2025, ['OVN 4', 'OVS 4']]);
    assert.deepEqual((await reviewer.get(`/api/analysis/sites?${q}&season=Wet&seasonYear=2025`).expect(200)).body.sites, []);
    assertInvalidFields(await reviewer.get(`/api/analysis/sites?${q}&season=Dry`), 'seasonYear');
    assertInvalidFields(await reviewer.get(`/api/analysis/sites?${q}&season=Dry&seasonYear=twenty`), 'seasonYear');
  });

  test('should not call a season change a site difference', async () => {
    // Wet (11-01…04-30) wraps the year end, so the flag names it by both years.
    // South read again in Wet 2025, much lighter: a season change; north has no Wet 2025 readings,
    // so north and south never share that season group and nothing new is flagged between the sites.
    for (const [i, l] of [52, 52.5, 53, 53.5].entries()) await read(ids.south, `2025-12-0${i + 2}`, [l, 20, -10]);
    const o = await overview();
    const item = o.items.find((i) => i.accessionId === ids.accession)!;
    assert.deepEqual(item.flags.filter((f) => f.kind === 'site-difference').map((f) => f.label), ['OVN ↔ OVS in Dry 2025']);
    assert.ok(item.flags.some((f) => f.kind === 'season-drift' && f.label === 'Dry 2025 → Wet 2025–26'), JSON.stringify(item.flags));
  });

  test('should reuse kept results until the readings change, then analyse only the changed pair', async () => {
    await overview();
    assert.equal((await overview()).recomputed, 0);
    await read(ids.north, '2025-06-20', [40.2, 20, -10]);
    assert.equal((await overview()).recomputed, 1);
  });

  test('should be read by every role and refused when signed out', async () => {
    for (const role of ['admin', 'trainer', 'reviewer', 'recorder'] as const) await (await signedInAs(h, role)).get('/api/analysis/overview').expect(200);
    assertProblem(await new Client(h.app).get('/api/analysis/overview'), 401);
  });

  test('should refuse parameters it does not take with problem+json', async () => {
    assertInvalidFields(await reviewer.get('/api/analysis/overview?accessionId=1'), 'query');
  });
});
