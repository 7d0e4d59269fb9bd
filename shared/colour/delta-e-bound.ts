import { CIEDE2000_FORMULA as F } from './constants.js';
import type { Lab } from './lab.js';

/** An axis-aligned box in CIELAB (a chip-index cell), bounds inclusive. */
export interface LabBox {
  lMin: number;
  lMax: number;
  aMin: number;
  aMax: number;
  bMin: number;
  bMax: number;
}

/*
 * Why a lower bound, and why this one.
 *
 * ΔE00 is not a metric on CIELAB (it breaks the triangle inequality), so a spatial index cannot
 * prune with "distance to the cell" directly. It can prune with any number that is provably no
 * larger than ΔE00 from the query to every colour of the cell: a cell whose bound exceeds the k-th
 * best ΔE00 found so far cannot hold a better chip. Writing the formula of Sharma, Wu & Dalal
 * (2005) as
 *
 *   ΔE00² = X_L² + X_C² + X_H² + R_T·X_C·X_H,   X_L = ΔL′/S_L, X_C = ΔC′/S_C, X_H = ΔH′/S_H
 *
 * (kL = kC = kH = 1), each step below only makes the right side smaller:
 *
 * 1. Cross term. |X_C·X_H| ≤ (X_C² + X_H²)/2, so X_C² + X_H² + R_T·X_C·X_H ≥ (1 − |R_T|/2)(X_C² + X_H²).
 *    R_T = −sin(2Δθ)·R_C with Δθ ≤ 30° (eq. 16) and R_C = 2√(C̄′⁷/(C̄′⁷ + 25⁷)), increasing in C̄′.
 *    So |R_T| ≤ sin 60° · R_C(C̄′max) < √3 < 2 and the factor stays positive. No hue is assumed:
 *    the worst case (blues, where Δθ peaks) is taken everywhere.
 * 2. Weights. T (eq. 15) lies in [1 − 0.93, 1 + 0.93] whatever the hue (sum of the |coefficients|),
 *    so T < 3 and S_H = 1 + 0.015·C̄′·T ≤ 1 + 0.045·C̄′ = S_C: both X_C² and X_H² are at least their
 *    numerator over S_C².
 * 3. Chroma-hue plane. ΔC′² + ΔH′² = C′₁² + C′₂² − 2C′₁C′₂cos Δh′ = |(a′₁, b₁) − (a′₂, b₂)|², the
 *    plain distance in the (a′, b) plane (ΔH′ = 2√(C′₁C′₂)·sin(Δh′/2)); with a′ = (1 + G)·a and
 *    G ≥ 0 this is ≥ Δa² + Δb² ≥ d_ab², the distance from the query's (a, b) to the cell's rectangle.
 * 4. Chroma level. C′ ≤ (1 + G)·C for each colour, so C̄′ ≤ f(C̄) = (1 + G(C̄))·C̄; f is increasing
 *    (f′ ≥ 0.5, checked on a fine grid by a test), and C̄ ≤ (C_query + the cell's largest C)/2,
 *    which bounds C̄′ and with it S_C and R_C from above.
 * 5. Lightness. S_L grows with |L̄′ − 50|, so on the range of L̄′ = (L_query + L)/2 over the cell
 *    it is largest at an end; ΔL′ is at least the query's distance to the cell's L range.
 *
 * Together: ΔE00² ≥ (d_L / S_L,max)² + (1 − |R_T|max/2) · d_ab² / S_C,max². The chip index still
 * computes every candidate's ΔE00 with culori; the bound only decides which cells to open.
 */

const SIN_2_DELTA_THETA_MAX = Math.sin((2 * F.deltaThetaMaxDeg * Math.PI) / 180);
const PIVOT7 = Math.pow(F.chromaPivot, 7);

/** x⁷ by multiplication (Math.pow is several times slower in this hot loop). */
function pow7(x: number): number {
  const x2 = x * x;
  return x2 * x2 * x2 * x;
}

/** S_L of CIEDE2000 at mean lightness `lBar` (eq. 18). */
function sl(lBar: number): number {
  const d2 = (lBar - F.slCentre) * (lBar - F.slCentre);
  return 1 + (F.slSlope * d2) / Math.sqrt(F.slOffset + d2);
}

/** Largest possible C̄′ given the largest possible mean C*ab, via f(C̄) = (1 + G(C̄))·C̄ (eq. 3–6). */
export function meanChromaPrimeMax(meanChromaMax: number): number {
  const c7 = pow7(meanChromaMax);
  const g = 0.5 * (1 - Math.sqrt(c7 / (c7 + PIVOT7)));
  return (1 + g) * meanChromaMax;
}

/**
 * A lower bound of ΔE00 between the query (L, a, b, with chroma `qc`) and any colour in the box,
 * given as raw numbers so the chip index can call it without allocating. See the note above.
 */
export function lowerBoundRaw(
  ql: number,
  qa: number,
  qb: number,
  qc: number,
  lMin: number,
  lMax: number,
  aMin: number,
  aMax: number,
  bMin: number,
  bMax: number,
): number {
  const dl = ql < lMin ? lMin - ql : ql > lMax ? ql - lMax : 0;
  const da = qa < aMin ? aMin - qa : qa > aMax ? qa - aMax : 0;
  const db = qb < bMin ? bMin - qb : qb > bMax ? qb - bMax : 0;
  const farA = Math.max(Math.abs(aMin), Math.abs(aMax));
  const farB = Math.max(Math.abs(bMin), Math.abs(bMax));
  const cBoxMax = Math.sqrt(farA * farA + farB * farB);
  const cpMax = meanChromaPrimeMax((qc + cBoxMax) / 2);
  const sc = 1 + F.scSlope * cpMax;
  const cp7 = pow7(cpMax);
  const rc = 2 * Math.sqrt(cp7 / (cp7 + PIVOT7));
  const crossFactor = 1 - (SIN_2_DELTA_THETA_MAX * rc) / 2;
  const slMax = Math.max(sl((ql + lMin) / 2), sl((ql + lMax) / 2));
  const xl = dl / slMax;
  return Math.sqrt(xl * xl + (crossFactor * (da * da + db * db)) / (sc * sc));
}

/** A lower bound of ΔE00 from `query` to every colour in `box` (see the note in this file). */
export function deltaE00LowerBound(query: Lab, box: LabBox): number {
  const qc = Math.sqrt(query.a * query.a + query.b * query.b);
  return lowerBoundRaw(query.l, query.a, query.b, qc, box.lMin, box.lMax, box.aMin, box.aMax, box.bMin, box.bMax);
}
