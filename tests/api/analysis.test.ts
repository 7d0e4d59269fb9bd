// Drift by season and differences by site through the API (issue 6): a worked example computed by
// hand, superseded readings left out, the character's own threshold, the demo's drifting and steady
// accessions told apart, and the site matrix.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Color from 'colorjs.io';
import type { DriftAnswer, DriftComparison, SiteComparisonAnswer } from '../../shared/api/analysis-answers.js';
import type { LabTuple } from '../../shared/colour/lab.js';
import { DEMO_DRIFT, DEMO_STEADY } from '../../server/demo/demo-readings.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';

const close = (actual: number, expected: number, tol: number, what: string) => assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} ≠ ${expected}`);

/** colorjs.io's CIEDE2000, an independent implementation, on the same L*a*b* numbers (see tests/reference/cross-check.test.ts). */
const colorjsDE00 = (p: LabTuple, q: LabTuple) => new Color('lab', p).deltaE(new Color('lab', q), '2000');

/*
 * The worked example, by hand. Every reading has a* = 20, b* = −10, so only L* differs; then the
 * chroma and hue terms of CIEDE2000 vanish (ΔC' = ΔH' = 0, R_T contributes nothing) and
 *   ΔE00 = |ΔL*| / S_L,  S_L = 1 + 0.015 (L̄ − 50)² / √(20 + (L̄ − 50)²),  L̄ the mean L* of the pair
 * (CIE 142-2001; Sharma, Wu & Dalal 2005, eq. 18). Site "WXA" (UTC), seasons Wet 11-01…04-30 and
 * Dry 05-01…10-31; the season-year of Wet is the year it starts.
 *
 *   Wet 2024, 2–5 Dec 2024:   L* 40, 42, 44, 46 → mean (43, 20, −10)
 *     to the mean: 3/S_L(41.5) = 3/1.1128355 = 2.695816; 1/S_L(42.5) = 1/1.0966260 = 0.911888;
 *                  1/S_L(43.5) = 1/1.0803245 = 0.925648; 3/S_L(44.5) = 3/1.0640101 = 2.819522
 *     spread = (2.695816 + 0.911888 + 0.925648 + 2.819522) / 4 = 1.838218
 *   Dry 2025, 2–5 Jun 2025:   L* 50, 52, 54, and a mistyped 99 corrected to 56 (the 99 is superseded,
 *     so left out) → mean (53, 20, −10)
 *     3/S_L(51.5) = 3/1.0071550 = 2.978688; 1/S_L(52.5) = 0.982031; 1/S_L(53.5) = 0.968658;
 *     3/S_L(54.5) = 3/1.0478777 = 2.862929 → spread = 1.948076
 *   Wet 2025, 2–5 Dec 2025:   L* 41, 43, 45, 47 → mean (44, 20, −10)
 *     2.735664, 0.925648, 0.939841, 2.862929 → spread = 1.866020
 *
 *   consecutive Wet 2024 → Dry 2025: 10 / S_L(48) = 10 / 1.0122474 = 9.879007
 *   consecutive Dry 2025 → Wet 2025:  9 / S_L(48.5) = 9 / 1.0071550 = 8.936063
 *   same season Wet 2024 → Wet 2025:  1 / S_L(43.5) = 1 / 1.0803245 = 0.925648
 *
 *   Exact permutation tests, 4 + 4 readings: C(8, 4) = 70 splits. Both groups' means average to the
 *   pooled mean whatever the split, so S_L is the same for every split and ΔE00 grows with |ΔL̄|:
 *   only the observed split and its mirror are as extreme when the groups do not overlap, p = 2/70.
 *   Wet 2024 vs Wet 2025 interleave (40 41 42 … 47), so p is large and that pair is no drift anyway
 *   (0.93 < 1.8, the Paravina et al. 2015 acceptability threshold, the default).
 */
const WET_2024: number[] = [40, 42, 44, 46];
const DRY_2025: number[] = [50, 52, 54];
const WET_2025: number[] = [41, 43, 45, 47];
const A = 20;
const B = -10;

describe('drift by season and site comparison, through the API', () => {
  let h: Harness;
  let admin: Client;
  let recorder: Client;
  let reviewer: Client;
  const ids = { accession: 0, character: 0, siteA: 0, siteB: 0, siteC: 0, superseded: 0, correction: 0 };

  const reading = async (siteId: number, day: string, l: number) => {
    const res = await recorder.post('/api/readings', { accessionId: ids.accession, characterId: ids.character, siteId, observedAt: `${day}T10:00:00Z`, method: 'instrument', lab: [l, A, B], light: 'overcast' });
    assert.equal(res.status, 201, res.text);
    return res.body.id as number;
  };
  const drift = async (query: string) => {
    const res = await reviewer.get(`/api/analysis/drift?${query}`);
    assert.equal(res.status, 200, res.text);
    return res.body as DriftAnswer;
  };
  const comparison = (d: DriftAnswer, from: string, to: string): DriftComparison => {
    const c = d.comparisons.find((x) => `${x.from.season} ${x.from.seasonYear}` === from && `${x.to.season} ${x.to.seasonYear}` === to);
    assert.ok(c, `a comparison ${from} → ${to} among ${JSON.stringify(d.comparisons.map((x) => [x.from, x.to]))}`);
    return c;
  };

  before(async () => {
    h = await startHarness({ demo: true });
    [admin, recorder, reviewer] = await Promise.all([signedInAs(h, 'admin'), signedInAs(h, 'recorder'), signedInAs(h, 'reviewer')]);
    const seasons = [{ name: 'Wet', start: '11-01', end: '04-30' }, { name: 'Dry', start: '05-01', end: '10-31' }];
    for (const [key, code] of [['siteA', 'WXA'], ['siteB', 'WXB'], ['siteC', 'WXC']] as const) {
      ids[key] = (await admin.post('/api/sites', { code, name: `Worked example plot ${code}`, timezone: 'UTC', seasons }).expect(201)).body.id;
    }
    ids.accession = (await admin.post('/api/accessions', { accessionNumber: 'WX-0001', name: 'Worked Example', siteId: ids.siteA }).expect(201)).body.id;
    ids.character = (await admin.post('/api/characters', { code: 'petiole.worked.example', organ: 'petiole', label: 'Worked example petiole', howToRead: 'Middle third of the youngest open leaf.' }).expect(201)).body.id;
    for (const [i, l] of WET_2024.entries()) await reading(ids.siteA, `2024-12-0${i + 2}`, l);
    for (const [i, l] of DRY_2025.entries()) await reading(ids.siteA, `2025-06-0${i + 2}`, l);
    ids.superseded = await reading(ids.siteA, '2025-06-05', 99);
    const fixed = await recorder.post(`/api/readings/${ids.superseded}/supersede`, {
      accessionId: ids.accession, characterId: ids.character, siteId: ids.siteA, observedAt: '2025-06-05T10:00:00Z', method: 'instrument', lab: [56, A, B], light: 'overcast', reason: 'Typed 99 for 56.',
    });
    assert.equal(fixed.status, 201, fixed.text);
    ids.correction = fixed.body.id;
    for (const [i, l] of WET_2025.entries()) await reading(ids.siteA, `2025-12-0${i + 2}`, l);
    // Other sites, for the site matrix and the siteId filter: WXB L* 60, 62, 64; WXC L* 50, 52.
    for (const [i, l] of [60, 62, 64].entries()) await reading(ids.siteB, `2025-07-1${i}`, l);
    for (const [i, l] of [50, 52].entries()) await reading(ids.siteC, `2025-07-2${i}`, l);
  });
  after(() => h.close());

  describe('the worked example at one site', () => {
    let d: DriftAnswer;
    before(async () => {
      d = await drift(`accessionId=${ids.accession}&characterId=${ids.character}&siteId=${ids.siteA}`);
    });

    test('should give each season group, oldest first, its size, CIELAB mean and spread as worked out', () => {
      assert.deepEqual(d.groups.map((g) => [g.season, g.seasonYear, g.n]), [['Wet', 2024, 4], ['Dry', 2025, 4], ['Wet', 2025, 4]]);
      // Wet (11-01…04-30) wraps the year end, so its groups are named by both years; the comparisons use the same names.
      assert.deepEqual(d.groups.map((g) => g.seasonLabel), ['Wet 2024–25', 'Dry 2025', 'Wet 2025–26']);
      assert.ok(d.comparisons.some((c) => c.from.seasonLabel === 'Dry 2025' && c.to.seasonLabel === 'Wet 2025–26'), JSON.stringify(d.comparisons.map((c) => [c.from, c.to])));
      const expected: [LabTuple, number][] = [[[43, A, B], 1.838218], [[53, A, B], 1.948076], [[44, A, B], 1.86602]];
      d.groups.forEach((g, i) => {
        g.meanLab.forEach((x, j) => close(x, expected[i]![0][j]!, 1e-9, `mean ${j} of group ${i}`));
        close(g.spreadDeltaE00, expected[i]![1], 1e-6, `spread of group ${i}`);
        assert.match(g.meanHex, /^#[0-9a-f]{6}$/);
        // C*ab = √(20² + 10²) = 22.360680; h°ab = atan2(−10, 20) = −26.565051° → 333.434949°.
        close(g.meanLch[1], 22.36068, 1e-5, 'C*ab');
        close(g.meanLch[2], 333.434949, 1e-5, 'h°ab');
      });
      assert.equal(d.groups[0]!.firstObservedAt, '2024-12-02T10:00:00.000Z');
      assert.equal(d.groups[0]!.lastObservedAt, '2024-12-05T10:00:00.000Z');
    });

    test('should give ΔE00 between means as worked out (colorjs.io agrees), with exact p-values and drift by the rules', () => {
      const wetDry = comparison(d, 'Wet 2024', 'Dry 2025');
      const dryWet = comparison(d, 'Dry 2025', 'Wet 2025');
      const wetWet = comparison(d, 'Wet 2024', 'Wet 2025');
      assert.deepEqual([wetDry.kind, dryWet.kind, wetWet.kind], ['consecutive', 'consecutive', 'same-season']);
      close(wetDry.deltaE00, 9.879007, 1e-6, 'Wet 2024 → Dry 2025');
      close(dryWet.deltaE00, 8.936063, 1e-6, 'Dry 2025 → Wet 2025');
      close(wetWet.deltaE00, 0.925648, 1e-6, 'Wet 2024 → Wet 2025');
      close(colorjsDE00([43, A, B], [53, A, B]), 9.879007, 1e-5, 'colorjs.io');
      for (const c of [wetDry, dryWet]) {
        assert.deepEqual([c.test, c.permutations], ['exact', 70]);
        close(c.pValue, 2 / 70, 1e-12, 'p');
        assert.equal(c.drift, true, c.reason);
      }
      assert.ok(wetWet.pValue > 0.05, `p ${wetWet.pValue}`);
      assert.equal(wetWet.drift, false);
      assert.match(wetWet.reason, /below 1\.8/);
      assert.deepEqual([d.threshold, d.alpha, d.minGroupSize, d.unseasoned, d.siteId], [1.8, 0.05, 3, 0, ids.siteA]);
    });

    test('should leave the superseded reading out of groups and points, and keep its correction', () => {
      const pointIds = d.points.map((p) => p.readingId);
      assert.equal(d.points.length, 12);
      assert.ok(!pointIds.includes(ids.superseded));
      assert.ok(pointIds.includes(ids.correction));
      assert.ok(d.points.every((p) => p.lab[0] !== 99));
      const fixed = d.points.find((p) => p.readingId === ids.correction)!;
      assert.deepEqual([fixed.season, fixed.seasonYear, fixed.lab], ['Dry', 2025, [56, A, B]]);
      assert.match(fixed.hex, /^#[0-9a-f]{6}$/);
      close(fixed.lch[1], 22.36068, 1e-5, 'point C*ab');
    });
  });

  test('should take all sites without siteId, and the character\'s own threshold when an admin changes it', async () => {
    const all = await drift(`accessionId=${ids.accession}&characterId=${ids.character}`);
    assert.equal(all.siteId, null);
    assert.equal(all.points.length, 17, '12 at WXA + 3 at WXB + 2 at WXC');
    await admin.patch(`/api/characters/${ids.character}`, { driftThreshold: 12 }).expect(200);
    try {
      const strict = await drift(`accessionId=${ids.accession}&characterId=${ids.character}&siteId=${ids.siteA}`);
      assert.equal(strict.threshold, 12);
      const c = comparison(strict, 'Wet 2024', 'Dry 2025');
      close(c.pValue, 2 / 70, 1e-12, 'p unchanged');
      assert.equal(c.drift, false, 'ΔE00 9.88 is below this character\'s 12');
      assert.match(c.reason, /below 12/);
      assert.ok(strict.comparisons.every((x) => !x.drift));
    } finally {
      await admin.patch(`/api/characters/${ids.character}`, { driftThreshold: 1.8 }).expect(200);
    }
  });

  test('should answer the site matrix: per-site means and spreads, symmetric ΔE00 with 0 on the diagonal', async () => {
    const res = await reviewer.get(`/api/analysis/sites?accessionId=${ids.accession}&characterId=${ids.character}`);
    assert.equal(res.status, 200, res.text);
    const s = res.body as SiteComparisonAnswer;
    assert.deepEqual(s.sites.map((x) => [x.siteCode, x.n]), [['WXA', 12], ['WXB', 3], ['WXC', 2]]);
    // WXA: the 12 readings above, mean L* 560 / 12 = 46.666667. WXB: L* 60, 62, 64 → mean 62, spread
    // (2/S_L(61) + 0 + 2/S_L(63)) / 3 = (1.734830 + 1.688627) / 3 = 1.141152. WXC: L* 50, 52 → mean 51,
    // spread (1/S_L(50.5) + 1/S_L(51.5)) / 2 = (0.999167 + 0.992896) / 2 = 0.996032.
    close(s.sites[0]!.meanLab[0], 560 / 12, 1e-9, 'WXA mean L*');
    close(s.sites[1]!.spreadDeltaE00, 1.141152, 1e-6, 'WXB spread');
    close(s.sites[2]!.spreadDeltaE00, 0.996032, 1e-6, 'WXC spread');
    // Between means: |ΔL̄| / S_L(L̄): WXA–WXB 15.333333 / S_L(54.333333) = 14.669792;
    // WXA–WXC 4.333333 / S_L(48.833333) = 4.314275; WXB–WXC 11 / S_L(56.5) = 10.182125.
    const expected = [[0, 14.669792, 4.314275], [14.669792, 0, 10.182125], [4.314275, 10.182125, 0]];
    for (let i = 0; i < 3; i++) {
      for (let j = 0; j < 3; j++) {
        close(s.deltaE00[i]![j]!, expected[i]![j]!, 1e-6, `ΔE00[${i}][${j}]`);
        assert.equal(s.deltaE00[i]![j], s.deltaE00[j]![i], 'symmetric');
        assert.equal(s.pValue[i]![j], s.pValue[j]![i], 'p symmetric');
      }
      assert.equal(s.deltaE00[i]![i], 0);
      assert.equal(s.pValue[i]![i], 1);
    }
    // WXB vs WXC, 3 + 2 readings that do not overlap: exact, C(5, 2) = 10 splits, p = 1/10 (the sizes
    // differ, so only the observed split is as extreme).
    close(s.pValue[1]![2]!, 0.1, 1e-12, 'WXB–WXC p');
    assert.equal(s.threshold, 1.8);
  });

  test('should tell the demo\'s drifting pair from its steady one', async () => {
    const accessions = (await reviewer.get('/api/accessions').expect(200)).body as { id: number; accessionNumber: string }[];
    const characters = (await reviewer.get('/api/characters').expect(200)).body as { id: number; code: string }[];
    const idOf = (pair: { accessionNumber: string; characterCode: string }) =>
      `accessionId=${accessions.find((a) => a.accessionNumber === pair.accessionNumber)!.id}&characterId=${characters.find((c) => c.code === pair.characterCode)!.id}`;
    const drifting = await drift(idOf(DEMO_DRIFT));
    const wetDry = drifting.comparisons.filter((c) => c.kind === 'consecutive' && c.from.season !== c.to.season);
    assert.ok(wetDry.length >= 1, JSON.stringify(drifting.groups.map((g) => [g.season, g.seasonYear, g.n])));
    assert.ok(wetDry.every((c) => c.drift), JSON.stringify(wetDry.map((c) => [c.deltaE00, c.pValue, c.reason])));
    // Dry and dry a year apart: the same colour, so no drift between them.
    assert.ok(drifting.comparisons.filter((c) => c.kind === 'same-season').every((c) => !c.drift));
    const steady = await drift(idOf(DEMO_STEADY));
    assert.ok(steady.groups.length >= 2 && steady.comparisons.length >= 1);
    assert.ok(steady.comparisons.every((c) => !c.drift), JSON.stringify(steady.comparisons.map((c) => [c.deltaE00, c.pValue])));
    assert.ok(steady.comparisons.every((c) => c.deltaE00 < steady.threshold));
  });

  test('should refuse a bad query with 400 naming the parameter', async () => {
    assertInvalidFields(await reviewer.get('/api/analysis/drift?characterId=1'), 'accessionId');
    assertInvalidFields(await reviewer.get(`/api/analysis/drift?accessionId=${ids.accession}&characterId=x`), 'characterId');
    assertInvalidFields(await reviewer.get(`/api/analysis/drift?accessionId=${ids.accession}&characterId=${ids.character}&siteId=-2`), 'siteId');
    assertInvalidFields(await reviewer.get(`/api/analysis/sites?accessionId=0&characterId=${ids.character}`), 'accessionId');
    assertProblem(await reviewer.get(`/api/analysis/sites?accessionId=${ids.accession}&characterId=${ids.character}&season=Wet`), 400);
  });

  test('should answer 404 for an unknown accession, character or site', async () => {
    const q = (a: number, c: number, s?: number) => `accessionId=${a}&characterId=${c}${s === undefined ? '' : `&siteId=${s}`}`;
    assert.match(assertProblem(await reviewer.get(`/api/analysis/drift?${q(99999, ids.character)}`), 404).detail ?? '', /accession/);
    assert.match(assertProblem(await reviewer.get(`/api/analysis/drift?${q(ids.accession, 99999)}`), 404).detail ?? '', /character/);
    assert.match(assertProblem(await reviewer.get(`/api/analysis/drift?${q(ids.accession, ids.character, 99999)}`), 404).detail ?? '', /site/);
    assert.match(assertProblem(await reviewer.get(`/api/analysis/sites?${q(99999, ids.character)}`), 404).detail ?? '', /accession/);
  });

  test('should answer empty groups for a pair with no readings', async () => {
    const other = (await admin.post('/api/characters', { code: 'petiole.worked.unread', organ: 'petiole', label: 'Never read', howToRead: 'Not read in this test.' }).expect(201)).body.id;
    const d = await drift(`accessionId=${ids.accession}&characterId=${other}`);
    assert.deepEqual([d.groups, d.comparisons, d.points], [[], [], []]);
    const s = (await reviewer.get(`/api/analysis/sites?accessionId=${ids.accession}&characterId=${other}`).expect(200)).body as SiteComparisonAnswer;
    assert.deepEqual([s.sites, s.deltaE00, s.pValue], [[], [], []]);
  });
});
