// The drift analysis of issue 6: season-group means and spreads, ΔE00 between means, and the
// permutation test, checked against values worked out by hand and against colorjs.io.
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Color from 'colorjs.io';
import { analyseDrift, type DriftInput } from '../../server/analysis/drift.js';
import { meanLab, spreadDeltaE00 } from '../../server/analysis/lab-stats.js';
import fc from 'fast-check';
import { binomial, binomialLowerTail, deltaE00UpperBound, permutationTest, SEQUENTIAL_EXCEEDANCES_DEFAULT } from '../../server/analysis/permutation-test.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';

const lab = (l: number, a: number, b: number): Lab => ({ l, a, b });
const close = (actual: number, expected: number, tol = 1e-5, what = '') => assert.ok(Math.abs(actual - expected) <= tol, `${what} ${actual} ≠ ${expected}`);

/**
 * colorjs.io's CIEDE2000, an independent implementation. Its deltaE2000 runs on its `lab` space
 * (D50 white), so it is handed the same L*a*b* numbers in that space: the formula is what is
 * compared (see tests/reference/cross-check.test.ts).
 */
function colorjsDE00(p: Lab, q: Lab): number {
  return new Color('lab', [p.l, p.a, p.b]).deltaE(new Color('lab', [q.l, q.a, q.b]), '2000');
}

/** Readings of one season group, observed a day apart from `start`. */
function group(season: string, seasonYear: number, start: string, labs: Lab[]): DriftInput[] {
  const t0 = Date.parse(start);
  return labs.map((x, i) => ({ lab: x, season, seasonYear, observedAt: new Date(t0 + i * 86_400_000) }));
}

describe('worked example, by hand (CIEDE2000 of CIE 142-2001 / Sharma, Wu & Dalal 2005)', () => {
  // Two groups differing in L* only, with a* = 10, b* = 0 throughout. With equal a* and b* the
  // chroma and hue terms of CIEDE2000 vanish (ΔC' = ΔH' = 0, so R_T contributes nothing) and
  // ΔE00 = |ΔL*| / S_L, S_L = 1 + 0.015 (L̄ − 50)² / √(20 + (L̄ − 50)²), L̄ the mean L* of the pair.
  //   wet 2025: L* 50, 52, 54 → mean (52, 10, 0)
  //     ΔE00 to the mean: 2 / S_L(51) = 2 / 1.0032733 = 1.993475; 0; 2 / S_L(53) = 2 / 1.0250694 = 1.951088
  //     spread = (1.993475 + 0 + 1.951088) / 3 = 1.314854
  //   dry 2026: L* 60, 62, 64 → mean (62, 10, 0)
  //     2 / S_L(61) = 1.734830; 0; 2 / S_L(63) = 1.688627 → spread = 1.141152
  //   ΔE00 between the means: 10 / S_L(57) = 10 / 1.0884843 = 9.187093
  //   Exact permutation test: C(6, 3) = 20 ways to split six readings into two groups of three;
  //   only the observed split and its mirror are as extreme, so p = 2 / 20 = 0.1.
  const wet = [lab(50, 10, 0), lab(52, 10, 0), lab(54, 10, 0)];
  const dry = [lab(60, 10, 0), lab(62, 10, 0), lab(64, 10, 0)];
  const result = analyseDrift([...group('wet', 2025, '2025-12-01T00:00:00Z', wet), ...group('dry', 2026, '2026-06-01T00:00:00Z', dry)]);

  test('gives each group its CIELAB mean and its spread', () => {
    assert.equal(result.groups.length, 2);
    const [g, h] = result.groups;
    assert.deepEqual([g!.season, g!.seasonYear, g!.n], ['wet', 2025, 3]);
    assert.deepEqual(g!.meanLab, lab(52, 10, 0));
    assert.deepEqual(h!.meanLab, lab(62, 10, 0));
    close(g!.spreadDeltaE00, 1.314854, 1e-6, 'wet spread');
    close(h!.spreadDeltaE00, 1.141152, 1e-6, 'dry spread');
  });

  test('gives ΔE00 between the means as worked out, and colorjs.io agrees', () => {
    const c = result.comparisons[0]!;
    close(c.deltaE00, 9.187093, 1e-6, 'ΔE00');
    close(colorjsDE00(lab(52, 10, 0), lab(62, 10, 0)), 9.187093, 1e-5, 'colorjs.io');
  });

  test('gives the exact p = 2/20 = 0.1, so three readings a side can never show drift at p < 0.05', () => {
    const c = result.comparisons[0]!;
    assert.equal(c.test, 'exact');
    assert.equal(c.permutations, 20);
    close(c.pValue, 0.1, 1e-12);
    assert.equal(c.drift, false);
    assert.match(c.reason, /chance/);
  });

  test('flags drift with four readings a side: exact p = 2 / C(8, 4) = 2/70', () => {
    const r = analyseDrift([
      ...group('wet', 2025, '2025-12-01T00:00:00Z', [...wet, lab(52, 10, 0)]),
      ...group('dry', 2026, '2026-06-01T00:00:00Z', [...dry, lab(62, 10, 0)]),
    ]);
    const c = r.comparisons[0]!;
    close(c.pValue, 2 / 70, 1e-12);
    assert.equal(c.drift, true);
  });
});

describe('group statistics', () => {
  test('mean and spread of one colour are that colour and 0', () => {
    assert.deepEqual(meanLab([lab(40, -20, 30)]), lab(40, -20, 30));
    assert.equal(spreadDeltaE00([lab(40, -20, 30), lab(40, -20, 30)]), 0);
  });
  test('binomial coefficients', () => {
    assert.deepEqual([binomial(6, 3), binomial(8, 4), binomial(20, 10), binomial(5, 0)], [20, 70, 184756, 1]);
  });
});

describe('the permutation test', () => {
  const random = mulberry32(7);
  const cloud = (centre: Lab, n: number, sd: number) => Array.from({ length: n }, () => lab(centre.l + (random() - 0.5) * sd, centre.a + (random() - 0.5) * sd, centre.b + (random() - 0.5) * sd));
  const a = cloud(lab(45, 30, -10), 40, 2);
  const b = cloud(lab(45, 30, -10), 40, 2);
  const far = cloud(lab(52, 24, -2), 40, 2);

  test('is deterministic for a seed, and uses at least 2,000 random permutations when exact is too large and it is not settled early', () => {
    const one = permutationTest(a, b, { seed: 11, exceedances: Infinity, resamplingRisk: 0 });
    const two = permutationTest(a, b, { seed: 11, exceedances: Infinity, resamplingRisk: 0 });
    assert.deepEqual(one, two);
    assert.equal(one.method, 'random');
    assert.ok(one.permutations >= 2000);
    const sep = permutationTest(a, far, { seed: 11, exceedances: Infinity, resamplingRisk: 0 });
    assert.deepEqual([sep.method, sep.permutations], ['random', 4999], 'with both sequential rules off, every permutation is drawn');
  });

  test('settles a plain difference early once p < alpha is all but certain (binomial lower tail below risk/looks)', () => {
    const sep = permutationTest(a, far, { seed: 11 });
    assert.equal(sep.method, 'sequential');
    // 49 looks share a risk of 0.001; (1 − 0.05)^m ≤ 0.001/49 first holds at m = 210, so the look at 300 decides (0 extreme so far).
    assert.ok(Math.pow(0.95, 200) > 0.001 / 49 && Math.pow(0.95, 300) <= 0.001 / 49);
    assert.deepEqual([sep.permutations, sep.pValue], [300, 1 / 301]);
    const full = permutationTest(a, far, { seed: 11, exceedances: Infinity, resamplingRisk: 0 });
    assert.ok(full.pValue < 0.05, 'the full run decides the same');
  });

  test('computes the binomial lower tail (checked by hand: Bin(10, 0.5), P(X ≤ 2) = 56/1024)', () => {
    close(binomialLowerTail(2, 10, 0.5), 56 / 1024, 1e-15);
    close(binomialLowerTail(0, 300, 0.05), Math.pow(0.95, 300), 1e-18);
  });

  test('stops at the h-th extreme permutation with p = h/l (Besag & Clifford 1991, Biometrika 78:301–304)', () => {
    const seq = permutationTest(a, b, { seed: 11 });
    assert.equal(seq.method, 'sequential');
    assert.ok(seq.permutations < 4999);
    close(seq.pValue, SEQUENTIAL_EXCEEDANCES_DEFAULT / seq.permutations, 1e-15, 'p = h/l');
    // The same draws without stopping: the h-th extreme one is the l-th draw, so the full count
    // from the first l draws is h and the full test agrees the difference is chance.
    const upTo = permutationTest(a, b, { seed: 11, exceedances: Infinity, resamplingRisk: 0, randomPermutations: seq.permutations });
    close(upTo.pValue, (1 + SEQUENTIAL_EXCEEDANCES_DEFAULT) / (1 + seq.permutations), 1e-15, 'h extreme among the first l draws');
    const full = permutationTest(a, b, { seed: 11, exceedances: Infinity, resamplingRisk: 0 });
    assert.equal(seq.pValue >= 0.05, full.pValue >= 0.05, 'the same decision at alpha 0.05');
  });

  test('counts exactly what it would count without the ΔE00 upper bound (a plain loop over the same draws with culori)', () => {
    for (const [x, y, seed] of [[a, b, 21], [a, far, 22], [b.slice(0, 12), far.slice(0, 9), 23]] as const) {
      const got = permutationTest(x, y, { seed, exceedances: Infinity, resamplingRisk: 0, randomPermutations: 999, exactLimit: 0 });
      // The reference: partial Fisher–Yates with the same generator, ΔE00 of every split by culori.
      const pooled = [...x, ...y];
      const k = Math.min(x.length, y.length);
      const mean = (xs: Lab[]) => lab(xs.reduce((s, q) => s + q.l, 0) / xs.length, xs.reduce((s, q) => s + q.a, 0) / xs.length, xs.reduce((s, q) => s + q.b, 0) / xs.length);
      const small = x.length <= y.length ? x : y;
      const big = x.length <= y.length ? y : x;
      const observed = deltaE00(mean(small), mean(big));
      const random = mulberry32(seed);
      const order = pooled.map((_, i) => i);
      let extreme = 0;
      for (let r = 0; r < 999; r++) {
        for (let i = 0; i < k; i++) {
          const j = i + Math.floor(random() * (pooled.length - i));
          [order[i], order[j]] = [order[j]!, order[i]!];
        }
        const inside = new Set(order.slice(0, k));
        const stat = deltaE00(mean(pooled.filter((_, i) => inside.has(i))), mean(pooled.filter((_, i) => !inside.has(i))));
        if (stat >= observed - 1e-9 * Math.max(1, observed)) extreme++;
      }
      close(got.pValue, (1 + extreme) / 1000, 1e-12, `seed ${seed}`);
    }
  });

  test('bounds ΔE00 from above: √(ΔL² + 4.5Δa² + 2Δb²) ≥ culori ΔE00 on Sharma, Wu & Dalal (2005) Table 1 pairs 9–12, 17 and random pairs', () => {
    // Pairs 9–12 straddle the a* axis at low chroma, where G is largest; 17 is a large difference.
    const pairs: [number, number, number, number, number, number][] = [
      [50, 2.49, -0.001, 50, -2.49, 0.0009], [50, 2.49, -0.001, 50, -2.49, 0.001], [50, 2.49, -0.001, 50, -2.49, 0.0011],
      [50, 2.49, -0.001, 50, -2.49, 0.0012], [50, 2.5, 0, 73, 25, -18],
    ];
    for (const [l1, a1, b1, l2, a2, b2] of pairs) assert.ok(deltaE00UpperBound(l1 - l2, a1 - a2, b1 - b2) >= deltaE00(lab(l1, a1, b1), lab(l2, a2, b2)));
    const channel = (min: number, max: number) => fc.double({ min, max, noNaN: true });
    fc.assert(
      fc.property(channel(0, 100), channel(-128, 128), channel(-128, 128), channel(-3, 3), channel(-3, 3), channel(-3, 3), (l, a1, b1, dl, da, db) => {
        const p = lab(l, a1, b1);
        const q = lab(Math.min(100, Math.max(0, l + dl)), a1 + da, b1 + db);
        return deltaE00UpperBound(p.l - q.l, p.a - q.a, p.b - q.b) >= deltaE00(p, q);
      }),
      { numRuns: 5_000, seed: 14 },
    );
  });

  test('gives p = 1 for identical groups, exact or random', () => {
    const same = Array.from({ length: 5 }, () => lab(60, 5, 40));
    assert.equal(permutationTest(same, same, { seed: 1 }).pValue, 1);
    const many = Array.from({ length: 40 }, () => lab(60, 5, 40));
    assert.equal(permutationTest(many, many, { seed: 1 }).pValue, 1);
  });

  test('gives a large p for two samples of one population and the smallest possible p for well-separated groups', () => {
    assert.ok(permutationTest(a, b, { seed: 3 }).pValue > 0.05);
    const sep = permutationTest(a, far, { seed: 3 });
    assert.equal(sep.pValue, 1 / (1 + sep.permutations), 'none of the random splits is as extreme (Phipson & Smyth 2010: never 0)');
  });

  test('random permutations approach the exact p-value', () => {
    const x = [lab(50, 0, 0), lab(51, 0, 1), lab(49, 1, 0), lab(52, 0, 0), lab(50.5, 0.5, 0.5)];
    const y = [lab(51, 0, 0), lab(53, 1, 0), lab(52, 0, 1), lab(52.5, 0, 0), lab(51.5, 0.5, 0.5)];
    const exact = permutationTest(x, y, { seed: 5 });
    const sampled = permutationTest(x, y, { seed: 5, exactLimit: 0, randomPermutations: 20_000, exceedances: Infinity, resamplingRisk: 0 });
    assert.equal(exact.method, 'exact');
    assert.equal(sampled.method, 'random');
    close(sampled.pValue, exact.pValue, 0.01, 'random vs exact');
  });
});

describe('drift rules', () => {
  const steady = (season: string, year: number, start: string, n: number) => group(season, year, start, Array.from({ length: n }, (_, i) => lab(48 + (i % 2) * 0.2, 35, -12)));
  const shifted = (season: string, year: number, start: string, n: number, dl: number) => group(season, year, start, Array.from({ length: n }, (_, i) => lab(48 + dl + (i % 2) * 0.2, 35, -12)));

  test('does not flag a difference below the threshold even when it is unlikely by chance', () => {
    const r = analyseDrift([...steady('wet', 2025, '2025-12-01T00:00:00Z', 8), ...shifted('dry', 2026, '2026-06-01T00:00:00Z', 8, 1)]);
    const c = r.comparisons[0]!;
    assert.ok(c.pValue < 0.05 && c.deltaE00 < 1.8);
    assert.equal(c.drift, false);
    assert.match(c.reason, /below 1.8/);
  });

  test('uses a character\'s own threshold', () => {
    const r = analyseDrift([...steady('wet', 2025, '2025-12-01T00:00:00Z', 8), ...shifted('dry', 2026, '2026-06-01T00:00:00Z', 8, 1)], { threshold: 0.5 });
    assert.equal(r.comparisons[0]!.drift, true);
  });

  test('reports groups too small but never flags them', () => {
    const r = analyseDrift([...steady('wet', 2025, '2025-12-01T00:00:00Z', 2), ...shifted('dry', 2026, '2026-06-01T00:00:00Z', 20, 10)]);
    assert.equal(r.groups[0]!.n, 2);
    assert.equal(r.comparisons[0]!.drift, false);
    assert.match(r.comparisons[0]!.reason, /too few/);
  });

  test('compares consecutive groups and the same season a year apart, oldest first, and leaves unseasoned readings out', () => {
    const r = analyseDrift([
      ...shifted('dry', 2026, '2026-06-01T00:00:00Z', 5, 0),
      ...steady('wet', 2025, '2025-12-01T00:00:00Z', 5),
      ...steady('wet', 2026, '2026-12-01T00:00:00Z', 5),
      { lab: lab(50, 0, 0), season: null, seasonYear: null, observedAt: new Date('2026-03-01T00:00:00Z') },
    ]);
    assert.deepEqual(r.groups.map((g) => `${g.season} ${g.seasonYear}`), ['wet 2025', 'dry 2026', 'wet 2026']);
    assert.deepEqual(r.comparisons.map((c) => `${c.kind}: ${c.from.season} ${c.from.seasonYear} → ${c.to.season} ${c.to.seasonYear}`), [
      'consecutive: wet 2025 → dry 2026',
      'consecutive: dry 2026 → wet 2026',
      'same-season: wet 2025 → wet 2026',
    ]);
    assert.equal(r.unseasoned, 1);
  });

  test('keeps a pair\'s p-value when another group is added', () => {
    const base = [...steady('wet', 2025, '2025-12-01T00:00:00Z', 30), ...shifted('dry', 2026, '2026-06-01T00:00:00Z', 30, 0.1)];
    const p1 = analyseDrift(base).comparisons[0]!.pValue;
    const p2 = analyseDrift([...base, ...steady('wet', 2026, '2026-12-01T00:00:00Z', 30)]).comparisons[0]!.pValue;
    assert.equal(p1, p2);
  });
});
