import type { ChipIndex } from './chip-index.js';
import type { Lab } from './lab.js';
import { nearestChips, type ChipMatch } from './nearest.js';

/** Where a reading falls between its two nearest chips. */
export interface Between<T> {
  /** The nearest chip (t = 0 end). */
  from: ChipMatch<T>;
  /** The second-nearest chip (t = 1 end). */
  to: ChipMatch<T>;
  /**
   * Position in [0, 1] of the reading's orthogonal projection on the CIELAB segment from → to,
   * clamped; t < 0.5 reads "nearer `from`".
   */
  t: number;
}

/**
 * t of the projection of `p` on the segment a → b in CIELAB (Euclidean, ΔE*ab geometry), clamped
 * to [0, 1]; 0 when a and b coincide.
 */
export function segmentPosition(p: Lab, a: Lab, b: Lab): number {
  const ab = [b.l - a.l, b.a - a.a, b.b - a.b];
  const ap = [p.l - a.l, p.a - a.a, p.b - a.b];
  const length2 = ab[0] * ab[0] + ab[1] * ab[1] + ab[2] * ab[2];
  if (length2 === 0) return 0;
  const t = (ap[0] * ab[0] + ap[1] * ab[1] + ap[2] * ab[2]) / length2;
  return Math.min(1, Math.max(0, t));
}

/**
 * The two chips nearest `query` by ΔE00 (through the index) and where the reading lies between
 * them, so a recorder can say "between X and Y, nearer X". `undefined` for a set of fewer than two.
 */
export function between<T>(index: ChipIndex, chips: readonly T[], labOf: (chip: T) => Lab, query: Lab): Between<T> | undefined {
  const [from, to] = nearestChips(index, chips, query, 2);
  if (!from || !to) return undefined;
  return { from, to, t: segmentPosition(query, labOf(from.chip), labOf(to.chip)) };
}
