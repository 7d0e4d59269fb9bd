import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';

/** How a permutation test can be run. */
export interface PermutationOptions {
  /** Seed of the random permutations, so the same readings always give the same p-value. */
  seed: number;
  /** Random permutations when the exact test is too large; the issue asks for at least 2,000. */
  randomPermutations?: number;
  /** The largest number of distinct splits enumerated exactly. */
  exactLimit?: number;
}

/** The outcome of a two-group permutation test on ΔE00 between the group means. */
export interface PermutationResult {
  /** ΔE00 between the two groups' CIELAB means. */
  statistic: number;
  pValue: number;
  method: 'exact' | 'random';
  /** Splits enumerated (exact) or drawn (random). */
  permutations: number;
}

export const RANDOM_PERMUTATIONS_DEFAULT = 4999;
export const EXACT_LIMIT_DEFAULT = 20_000;

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

  if (splits <= (opts.exactLimit ?? EXACT_LIMIT_DEFAULT)) {
    let extreme = 0;
    enumerate(n, k, (idx) => {
      let sl = 0, sa = 0, sb = 0;
      for (const i of idx) {
        sl += L[i]!;
        sa += A[i]!;
        sb += B[i]!;
      }
      if (statOf(sl, sa, sb) >= threshold) extreme++;
    });
    return { statistic: observed, pValue: extreme / splits, method: 'exact', permutations: splits };
  }

  const rounds = opts.randomPermutations ?? RANDOM_PERMUTATIONS_DEFAULT;
  const random = mulberry32(opts.seed);
  const order = Uint32Array.from({ length: n }, (_, i) => i);
  let extreme = 0;
  for (let r = 0; r < rounds; r++) {
    // Partial Fisher–Yates (Knuth, TAOCP vol. 2, Algorithm P): the first k places become a uniform random k-subset.
    let sl = 0, sa = 0, sb = 0;
    for (let i = 0; i < k; i++) {
      const j = i + Math.floor(random() * (n - i));
      const t = order[i]!;
      order[i] = order[j]!;
      order[j] = t;
      const p = order[i]!;
      sl += L[p]!;
      sa += A[p]!;
      sb += B[p]!;
    }
    if (statOf(sl, sa, sb) >= threshold) extreme++;
  }
  return { statistic: observed, pValue: (1 + extreme) / (1 + rounds), method: 'random', permutations: rounds };
}

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
