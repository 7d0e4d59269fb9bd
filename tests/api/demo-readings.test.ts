// The demo readings: a few hundred, deterministic, at every demo site, and the two pairs a drift
// analysis relies on — one that drifts by season, one that stays put (server/demo/demo-readings.ts).
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { DEMO_DRIFT, DEMO_STEADY } from '../../server/demo/demo-readings.js';
import { startHarness, type Harness } from './harness.js';

interface Row {
  season: string;
  seasonYear: number;
  l: number;
  a: number;
  b: number;
}

/** Readings of one accession + character, grouped by season and season-year, each with its CIELAB mean and spread (mean ΔE00 from the mean). */
async function groups(h: Harness, accessionNumber: string, characterCode: string) {
  const rows: Row[] = await h.ds.query(
    `SELECT r.season, r.seasonYear, r.l, r.a, r.b FROM reading r JOIN accession a ON a.id = r.accessionId JOIN "character" c ON c.id = r.characterId
     WHERE a.accessionNumber = ? AND c.code = ? AND r.supersededById IS NULL`,
    [accessionNumber, characterCode],
  );
  const by = new Map<string, Row[]>();
  for (const r of rows) by.set(`${r.season} ${r.seasonYear}`, [...(by.get(`${r.season} ${r.seasonYear}`) ?? []), r]);
  return [...by.entries()].map(([key, g]) => {
    const mean: Lab = { l: g.reduce((s, r) => s + r.l, 0) / g.length, a: g.reduce((s, r) => s + r.a, 0) / g.length, b: g.reduce((s, r) => s + r.b, 0) / g.length };
    return { key, season: g[0]!.season, n: g.length, mean, spread: g.reduce((s, r) => s + deltaE00(mean, r), 0) / g.length };
  });
}

describe('demo readings', () => {
  let h: Harness;
  before(async () => {
    h = await startHarness({ demo: true });
  });
  after(() => h.close());

  test('should hold a few hundred readings at every demo site, by more than one observer and method, with corrections', async () => {
    const [row] = await h.ds.query('SELECT COUNT(*) AS n, COUNT(DISTINCT siteId) AS sites, COUNT(DISTINCT observerId) AS observers, COUNT(DISTINCT method) AS methods, SUM(supersededById IS NOT NULL) AS superseded FROM reading');
    assert.ok(row.n >= 200 && row.n <= 800, `${row.n} readings`);
    assert.equal(row.sites, 4);
    assert.equal(row.observers, 2);
    assert.ok(row.methods >= 3);
    assert.ok(row.superseded >= 1);
  });

  test(`should give ${DEMO_DRIFT.accessionNumber} ${DEMO_DRIFT.characterCode} a seasonal drift: wet vs dry means at least 4 ΔE00 apart, 6+ readings a group, small scatter`, async () => {
    const g = await groups(h, DEMO_DRIFT.accessionNumber, DEMO_DRIFT.characterCode);
    assert.ok(g.length >= 3, g.map((x) => x.key).join(', '));
    for (const x of g) {
      assert.ok(x.n >= 6, `${x.key}: ${x.n} readings`);
      assert.ok(x.spread < 1, `${x.key}: spread ${x.spread}`);
    }
    for (const wet of g.filter((x) => x.season === 'Wet')) for (const dry of g.filter((x) => x.season === 'Dry')) assert.ok(deltaE00(wet.mean, dry.mean) >= 4, `${wet.key} vs ${dry.key}: ${deltaE00(wet.mean, dry.mean)}`);
  });

  test(`should keep ${DEMO_STEADY.accessionNumber} ${DEMO_STEADY.characterCode} steady: every season within 1 ΔE00, scatter under 1`, async () => {
    const g = await groups(h, DEMO_STEADY.accessionNumber, DEMO_STEADY.characterCode);
    assert.ok(g.length >= 3);
    for (const x of g) {
      assert.ok(x.n >= 6, `${x.key}: ${x.n}`);
      assert.ok(x.spread < 1, `${x.key}: spread ${x.spread}`);
      for (const y of g) assert.ok(deltaE00(x.mean, y.mean) < 1, `${x.key} vs ${y.key}`);
    }
  });

  test('should load the same readings every time (seeded)', async () => {
    const again = await startHarness({ demo: true });
    try {
      const sql = 'SELECT accessionId, characterId, observedAt, method, l, a, b, bestChipCode FROM reading ORDER BY id';
      assert.deepEqual(await again.ds.query(sql), await h.ds.query(sql));
    } finally {
      await again.close();
    }
  });
});
