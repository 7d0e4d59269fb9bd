// The bootstrap interval of Fleiss' κ (shared/stats/kappa-interval.ts), checked against an
// independent estimator of the same spread: the jackknife over subjects (Efron & Tibshirani 1993,
// An Introduction to the Bootstrap, ch. 11 — from memory), written out here on its own.
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { fleissKappa } from '../../shared/stats/fleiss-kappa.js';
import { fleissKappaInterval, quantileSorted } from '../../shared/stats/kappa-interval.js';

// Fleiss (1971), Psychological Bulletin 76(5):378–382, Table 1 (κ = 0.4302), as transcribed and
// checked against Fleiss's totals in tests/reference/kappa.test.ts.
const fleiss1971 = [
  [0, 0, 0, 6, 0], [0, 3, 0, 0, 3], [0, 1, 4, 0, 1], [0, 0, 0, 0, 6], [0, 3, 0, 3, 0],
  [2, 0, 4, 0, 0], [0, 0, 4, 0, 2], [2, 0, 3, 1, 0], [2, 0, 0, 4, 0], [0, 0, 0, 0, 6],
  [1, 0, 0, 5, 0], [1, 1, 0, 4, 0], [0, 3, 3, 0, 0], [1, 0, 0, 5, 0], [0, 2, 0, 3, 1],
  [0, 0, 5, 0, 1], [3, 0, 0, 1, 2], [5, 1, 0, 0, 0], [0, 2, 0, 4, 0], [1, 0, 2, 0, 3],
  [0, 0, 0, 0, 6], [0, 1, 0, 5, 0], [0, 2, 0, 1, 3], [2, 0, 0, 4, 0], [1, 0, 0, 4, 1],
  [0, 5, 0, 1, 0], [4, 0, 0, 0, 2], [0, 2, 0, 4, 0], [1, 0, 5, 0, 0], [0, 0, 0, 0, 6],
];

/** Jackknife standard error: sqrt((n − 1)/n · Σ (κ₍ᵢ₎ − κ̄₍·₎)²), leaving out one subject at a time. */
function jackknifeSE(table: number[][]): number {
  const n = table.length;
  const leaveOut = table.map((_, i) => fleissKappa(table.filter((__, j) => j !== i)).kappa!);
  const mean = leaveOut.reduce((s, k) => s + k, 0) / n;
  return Math.sqrt(((n - 1) / n) * leaveOut.reduce((s, k) => s + (k - mean) ** 2, 0));
}

describe("bootstrap interval of Fleiss' κ", () => {
  test('Fleiss (1971) Table 1: the 95 % interval holds κ = 0.4302 and its width is about 2 × 1.96 jackknife standard errors (within 25 %)', () => {
    const ci = fleissKappaInterval(fleiss1971)!;
    const kappa = fleissKappa(fleiss1971).kappa!;
    assert.ok(ci.lower < kappa && kappa < ci.upper, `${ci.lower} < ${kappa} < ${ci.upper}`);
    const expectedWidth = 2 * 1.96 * jackknifeSE(fleiss1971);
    const width = ci.upper - ci.lower;
    assert.ok(Math.abs(width / expectedWidth - 1) < 0.25, `bootstrap width ${width} against jackknife ${expectedWidth}`);
    assert.equal(ci.level, 0.95);
    assert.equal(ci.method, 'percentile bootstrap over specimens');
  });

  test('should give the same interval for the same table (seeded) and a different one for another seed', () => {
    assert.deepEqual(fleissKappaInterval(fleiss1971), fleissKappaInterval(fleiss1971));
    assert.notDeepEqual(fleissKappaInterval(fleiss1971, { seed: 7 })!.lower, fleissKappaInterval(fleiss1971)!.lower);
  });

  test('should narrow with more subjects: the first 6 subjects give a wider interval than all 30', () => {
    const few = fleissKappaInterval(fleiss1971.slice(0, 6))!;
    const all = fleissKappaInterval(fleiss1971)!;
    assert.ok(few.upper - few.lower > all.upper - all.lower, `${few.upper - few.lower} > ${all.upper - all.lower}`);
  });

  test('unanimous subjects over several categories give κ = 1 in every resample that has a κ', () => {
    const ci = fleissKappaInterval([[3, 0, 0], [0, 3, 0], [0, 0, 3], [3, 0, 0]])!;
    assert.equal(ci.lower, 1);
    assert.equal(ci.upper, 1);
    assert.ok(ci.undefinedResamples > 0, 'a resample of one category has no κ and is left out');
  });

  test('should answer null with fewer than two rated subjects', () => {
    assert.equal(fleissKappaInterval([[2, 1]]), null);
    assert.equal(fleissKappaInterval([[2, 1], [0, 0]]), null);
  });

  test('quantiles by linear interpolation (Hyndman & Fan 1996, type 7): R quantile(1:5, 0.1) = 1.4', () => {
    assert.equal(quantileSorted([1, 2, 3, 4, 5], 0.1), 1.4);
    assert.equal(quantileSorted([1, 2, 3, 4, 5], 1), 5);
  });
});
