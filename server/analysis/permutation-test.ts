import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { MULBERRY32_STEP, mulberry32Output } from '../../shared/random/mulberry32.js';

/** How a permutation test can be run. */
export interface PermutationOptions {
  /** Seed of the random permutations, so the same readings always give the same p-value. */
  seed: number;
  /** Random permutations when the exact test is too large; the issue asks for at least 2,000. */
  randomPermutations?: number;
  /** The largest number of distinct splits enumerated exactly. */
  exactLimit?: number;
  /**
   * Sequential stopping (Besag & Clifford 1991): the random test stops once this many permuted
   * statistics have been at least as extreme as the observed one. `Infinity` draws every permutation.
   */
  exceedances?: number;
  /** The significance level the caller decides at; the sequential rule settles "below alpha" early only with it. */
  alpha?: number;
  /**
   * The largest chance that stopping early declares "p < alpha" when the p-value of the test run to
   * the end at its true p would not be (resampling risk, Gandy 2009). 0 never stops on that side.
   */
  resamplingRisk?: number;
}

/** The outcome of a two-group permutation test on ΔE00 between the group means. */
export interface PermutationResult {
  /** ΔE00 between the two groups' CIELAB means. */
  statistic: number;
  pValue: number;
  /** Exact enumeration, every random permutation drawn, or stopped early by the sequential rule. */
  method: 'exact' | 'random' | 'sequential';
  /** Splits enumerated (exact) or drawn (random, sequential). */
  permutations: number;
}

export const RANDOM_PERMUTATIONS_DEFAULT = 4999;
export const EXACT_LIMIT_DEFAULT = 20_000;
/**
 * h of Besag & Clifford (1991): with h = 20 the sequential p-value h/l is exact-valid and, near
 * p = 0.05, rests on about 400 permutations; their paper shows h between 10 and 20 loses little
 * power against the full test.
 */
export const SEQUENTIAL_EXCEEDANCES_DEFAULT = 20;
/** Resampling risk of the early "below alpha" decision (our own choice: one test in a thousand at most). */
export const RESAMPLING_RISK_DEFAULT = 1e-3;
/** How often, in draws, the count is compared with the early-decision boundary (our own). */
const LOOK_EVERY = 100;

/**
 * Ties: a permuted statistic counts as "at least as large" when within this of the observed one,
 * so floating-point noise in the sums of identical groups cannot make p fall below 1.
 */
const TIE_TOLERANCE = 1e-9;

/**
 * Two-sample permutation test (Fisher 1935; e.g. Good, "Permutation, Parametric and Bootstrap
 * Tests of Hypotheses", 3rd ed. 2005, ch. 3) of "both groups come from one population of colours",
 * with the statistic ΔE00 between the group means. Exact over every split of the pooled colours
 * into groups of the same sizes when there are at most `exactLimit` splits, p = (splits at least as
 * extreme) / (all splits); otherwise `randomPermutations` seeded random splits with
 * p = (1 + at least as extreme) / (1 + permutations), which never reports p = 0
 * (Phipson & Smyth 2010, Stat. Appl. Genet. Mol. Biol. 9(1):39). Written here: no kept library
 * runs a permutation test on a colour-difference statistic.
 *
 * Two things keep it fast without changing what it decides:
 * - Sequential Monte Carlo p-values (Besag & Clifford 1991, Biometrika 78:301–304): the random
 *   test stops at the h-th permuted statistic at least as extreme as the observed one, drawn as the
 *   l-th permutation, with p = h/l; a difference that is plainly chance (large p) is settled after
 *   a few dozen draws instead of thousands. If h is never reached, p is (1 + extreme)/(1 + drawn)
 *   as before. Both are valid p-values (P(p ≤ u) ≤ u), so the test keeps its size.
 * - The other side, in the manner of Gandy (2009, J. Am. Stat. Assoc. 104:1504–1511, "uniformly
 *   bounded resampling risk"): every 100 draws, if so few extreme splits have been seen that a true
 *   p of alpha would give at most that many with probability below risk/looks (binomial lower
 *   tail; a union bound over the looks keeps the total at most `resamplingRisk`), "p < alpha" is
 *   settled and the test stops with p = (1 + extreme)/(1 + drawn). A plain difference between two
 *   seasons is then settled after a few hundred draws instead of 4,999; its p reads coarser
 *   (e.g. 0.003 rather than 0.0002) but the decision at alpha is the one the full run would give,
 *   up to that risk.
 * - An upper bound of ΔE00 (`deltaE00UpperBound`) that costs a few multiplications: a permuted
 *   split whose bound lies below the observed statistic cannot count as extreme, so its exact
 *   ΔE00 is never computed. The count, and so the p-value, is the same as without the bound.
 */
export function permutationTest(a: readonly Lab[], b: readonly Lab[], opts: PermutationOptions): PermutationResult {
  if (a.length === 0 || b.length === 0) throw new RangeError('permutation test needs two non-empty groups');
  const pooled = [...a, ...b];
  const n = pooled.length;
  // Draw the smaller group; the other is "everything else", so only k sums are needed per split.
  const k = Math.min(a.length, b.length);
  const L = Float64Array.from(pooled, (x) => x.l);
  const A = Float64Array.from(pooled, (x) => x.a);
  const B = Float64Array.from(pooled, (x) => x.b);
  const total = { l: sum(L), a: sum(A), b: sum(B) };
  const statOf = (sl: number, sa: number, sb: number) =>
    deltaE00({ l: sl / k, a: sa / k, b: sb / k }, { l: (total.l - sl) / (n - k), a: (total.a - sa) / (n - k), b: (total.b - sb) / (n - k) });

  const small = a.length <= b.length ? a : b;
  const observed = statOf(sumOf(small, 'l'), sumOf(small, 'a'), sumOf(small, 'b'));
  const threshold = observed - TIE_TOLERANCE * Math.max(1, observed);
  const splits = binomial(n, k);
  /** Whether a split with these sums is at least as extreme as the observed one; the bound settles most without ΔE00. */
  const extremeSplit = (sl: number, sa: number, sb: number): boolean => {
    const dl = sl / k - (total.l - sl) / (n - k);
    const da = sa / k - (total.a - sa) / (n - k);
    const db = sb / k - (total.b - sb) / (n - k);
    if (deltaE00UpperBound(dl, da, db) < threshold) return false;
    return statOf(sl, sa, sb) >= threshold;
  };

  if (splits <= (opts.exactLimit ?? EXACT_LIMIT_DEFAULT)) {
    let extreme = 0;
    enumerate(n, k, (idx) => {
      let sl = 0, sa = 0, sb = 0;
      for (const i of idx) {
        sl += L[i]!;
        sa += A[i]!;
        sb += B[i]!;
      }
      if (extremeSplit(sl, sa, sb)) extreme++;
    });
    return { statistic: observed, pValue: extreme / splits, method: 'exact', permutations: splits };
  }

  const rounds = opts.randomPermutations ?? RANDOM_PERMUTATIONS_DEFAULT;
  const h = opts.exceedances ?? SEQUENTIAL_EXCEEDANCES_DEFAULT;
  const alpha = opts.alpha ?? 0.05;
  const riskPerLook = (opts.resamplingRisk ?? RESAMPLING_RISK_DEFAULT) / Math.max(1, Math.floor(rounds / LOOK_EVERY));
  // mulberry32 (shared/random) with its state kept here: the same numbers as mulberry32(seed), drawn in the hot loop without a closure.
  let state = opts.seed >>> 0;
  const order = Uint32Array.from({ length: n }, (_, i) => i);
  let extreme = 0;
  for (let r = 0; r < rounds; r++) {
    // Partial Fisher–Yates (Knuth, TAOCP vol. 2, Algorithm P): the first k places become a uniform random k-subset.
    let sl = 0, sa = 0, sb = 0;
    for (let i = 0; i < k; i++) {
      state = (state + MULBERRY32_STEP) >>> 0;
      const j = i + Math.floor(mulberry32Output(state) * (n - i));
      const t = order[i]!;
      order[i] = order[j]!;
      order[j] = t;
      const p = order[i]!;
      sl += L[p]!;
      sa += A[p]!;
      sb += B[p]!;
    }
    if (extremeSplit(sl, sa, sb) && ++extreme >= h) {
      return { statistic: observed, pValue: h / (r + 1), method: 'sequential', permutations: r + 1 };
    }
    const drawn = r + 1;
    if (riskPerLook > 0 && drawn % LOOK_EVERY === 0 && drawn < rounds && binomialLowerTail(extreme, drawn, alpha, riskPerLook) <= riskPerLook) {
      return { statistic: observed, pValue: (1 + extreme) / (1 + drawn), method: 'sequential', permutations: drawn };
    }
  }
  return { statistic: observed, pValue: (1 + extreme) / (1 + rounds), method: 'random', permutations: rounds };
}

/**
 * An upper bound of ΔE00 between two CIELAB colours from their differences ΔL*, Δa*, Δb*:
 *   ΔE00 ≤ √(ΔL*² + 4.5 Δa*² + 2 Δb*²).
 * In the formula of Sharma, Wu & Dalal (2005), ΔE00² = X_L² + X_C² + X_H² + R_T·X_C·X_H with
 * X = ΔL′/S_L, ΔC′/S_C, ΔH′/S_H: every S is at least 1 (S_L by eq. 18; S_C = 1 + 0.045·C̄′; S_H =
 * 1 + 0.015·C̄′·T with T ≥ 1 − 0.93 > 0); |R_T| ≤ R_C < 2 and |X_C·X_H| ≤ (X_C² + X_H²)/2, so the
 * cross term adds less than X_C² + X_H²; ΔL′ = ΔL*; and ΔC′² + ΔH′² is the squared distance in the
 * (a′, b*) plane with a′ = (1 + G)·a*, G ≤ 0.5, so at most 2.25 Δa*² + Δb*². Together
 * ΔE00² < ΔL*² + 2(2.25 Δa*² + Δb*²). A test checks it against culori on many pairs. The added
 * 1e-9 covers floating-point rounding in either computation (far below any colour difference).
 */
export function deltaE00UpperBound(dl: number, da: number, db: number): number {
  return Math.sqrt(dl * dl + 4.5 * da * da + 2 * db * db) + BOUND_SLACK;
}

/** Absolute slack on the upper bound for rounding (our own; ΔE00 is never read finer than 0.01). */
const BOUND_SLACK = 1e-9;

function sum(xs: Float64Array): number {
  let s = 0;
  for (const x of xs) s += x;
  return s;
}

function sumOf(labs: readonly Lab[], key: keyof Lab): number {
  let s = 0;
  for (const x of labs) s += x[key];
  return s;
}

/**
 * P(X ≤ g) for X ~ Binomial(m, p), summed term by term from P(X = 0) = (1 − p)^m; stops once the sum
 * passes `enough` (the caller only asks whether it is below that).
 */
export function binomialLowerTail(g: number, m: number, p: number, enough = Infinity): number {
  let term = Math.pow(1 - p, m);
  let sum = term;
  for (let i = 0; i < g && sum <= enough; i++) {
    term *= ((m - i) / (i + 1)) * (p / (1 - p));
    sum += term;
  }
  return sum;
}

/** n choose k, as a float (exact well past the limits used here). */
export function binomial(n: number, k: number): number {
  let r = 1;
  for (let i = 1; i <= k; i++) r = (r * (n - k + i)) / i;
  return Math.round(r);
}

/** Calls `visit` with each k-subset of 0…n−1 in lexicographic order (the same array, reused). */
function enumerate(n: number, k: number, visit: (idx: Uint32Array) => void): void {
  const idx = Uint32Array.from({ length: k }, (_, i) => i);
  for (;;) {
    visit(idx);
    let i = k - 1;
    while (i >= 0 && idx[i] === n - k + i) i--;
    if (i < 0) return;
    idx[i] = idx[i]! + 1;
    for (let j = i + 1; j < k; j++) idx[j] = idx[j - 1]! + 1;
  }
}
