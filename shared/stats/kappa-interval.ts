// A confidence interval for Fleiss' kappa by a seeded percentile bootstrap over subjects.
//
// Why a bootstrap and not the large-sample standard error of Fleiss, Nee & Landis (1979,
// Psychological Bulletin 86(5):974–977): that variance is derived under the hypothesis κ = 0 and
// for the same number of raters on every subject, so it suits a test of "any agreement at all" but
// not an interval around a κ well above 0, and a calibration session often has missing answers.
// The percentile bootstrap (Efron & Tibshirani 1993, An Introduction to the Bootstrap, Chapman &
// Hall, ch. 13 — chapter from memory) resamples whole subjects with replacement, recomputes κ with
// the same rule as the estimate (shared/stats/fleiss-kappa.ts), and takes the 2.5th and 97.5th
// percentiles. Seeded, so the same answers always give the same interval.
import { mulberry32 } from '../random/mulberry32.js';
import { fleissKappa } from './fleiss-kappa.js';

/** Resamples drawn unless told otherwise (our own choice: the 2.5 % tail then rests on 50 values). */
export const BOOTSTRAP_RESAMPLES = 2000;
/** The fixed seed, so an interval never changes between two looks at the same answers. */
export const BOOTSTRAP_SEED = 20261202;

/** What `fleissKappaInterval` found. */
export interface KappaInterval {
  /** Lower and upper ends of the percentile interval. */
  lower: number;
  upper: number;
  /** Two-sided coverage, e.g. 0.95. */
  level: number;
  method: 'percentile bootstrap over specimens';
  resamples: number;
  /** Resamples in which κ was undefined (every answer in one category) and so left out. */
  undefinedResamples: number;
  seed: number;
}

/** The q-quantile of sorted values by linear interpolation between order statistics (Hyndman & Fan 1996, type 7, R's default). */
export function quantileSorted(sorted: readonly number[], q: number): number {
  if (!sorted.length) throw new RangeError('no values');
  const h = (sorted.length - 1) * q;
  const lo = Math.floor(h);
  const hi = Math.min(lo + 1, sorted.length - 1);
  return sorted[lo]! + (h - lo) * (sorted[hi]! - sorted[lo]!);
}

/**
 * The percentile bootstrap interval of Fleiss' κ over the subjects (rows) of a count table. Only
 * rows with at least one rating are resampled. Null when fewer than two rows are rated or when κ
 * is undefined in more than half the resamples (nothing steady to report).
 */
export function fleissKappaInterval(
  table: readonly (readonly number[])[],
  opts: { resamples?: number; seed?: number; level?: number } = {},
): KappaInterval | null {
  const resamples = opts.resamples ?? BOOTSTRAP_RESAMPLES;
  const seed = opts.seed ?? BOOTSTRAP_SEED;
  const level = opts.level ?? 0.95;
  const rows = table.filter((row) => row.some((c) => c > 0));
  if (rows.length < 2) return null;
  const random = mulberry32(seed);
  const kappas: number[] = [];
  for (let b = 0; b < resamples; b++) {
    const sample = Array.from({ length: rows.length }, () => rows[Math.floor(random() * rows.length)]!);
    const k = fleissKappa(sample).kappa;
    if (k !== null) kappas.push(k);
  }
  const undefinedResamples = resamples - kappas.length;
  if (kappas.length < resamples / 2) return null;
  kappas.sort((a, b) => a - b);
  const tail = (1 - level) / 2;
  return { lower: quantileSorted(kappas, tail), upper: quantileSorted(kappas, 1 - tail), level, method: 'percentile bootstrap over specimens', resamples, undefinedResamples, seed };
}
