import type { Lab } from '../../shared/colour/lab.js';

/**
 * The median of numbers (the mean of the middle two for an even count). Sorting a copy is fine at
 * the sizes a character has (hundreds of readings), and exact where quickselect tricks are not needed.
 */
export function median(xs: readonly number[]): number {
  if (xs.length === 0) throw new RangeError('median of no numbers');
  const s = [...xs].sort((p, q) => p - q);
  const mid = s.length >> 1;
  return s.length % 2 ? s[mid]! : (s[mid - 1]! + s[mid]!) / 2;
}

/**
 * The accepted colour of a set of readings: the per-channel (marginal) median of L*, a* and b*.
 *
 * Why this statistic: a character's readings mix instruments, eye-picked chips and photos, and
 * carry the odd mistyped value (an L* ten too low, a reading of the wrong leaf). The median has a
 * breakdown point of 50 % (Hampel 1971, Ann. Math. Stat. 42:1887–1896; Huber & Ronchetti, "Robust
 * Statistics", 2nd ed. 2009, §3.2), so such readings cannot drag the centre, whereas a single L*
 * typed as 99 moves a mean of ten readings by several units. Taking it channel by channel in
 * CIELAB keeps it simple to check by hand or in a spreadsheet from the exported readings; a
 * spatial median would be rotation-invariant but gains nothing here, where the channels are the
 * axes people read. With fewer than three readings it equals the mean.
 */
export function labMedian(labs: readonly Lab[]): Lab {
  if (labs.length === 0) throw new RangeError('centre of no colours');
  return { l: median(labs.map((x) => x.l)), a: median(labs.map((x) => x.a)), b: median(labs.map((x) => x.b)) };
}
