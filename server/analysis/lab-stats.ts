import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';

/** The arithmetic mean of CIELAB colours, L*, a* and b* each (a group's mean colour). */
export function meanLab(labs: readonly Lab[]): Lab {
  if (labs.length === 0) throw new RangeError('meanLab of no colours');
  let l = 0;
  let a = 0;
  let b = 0;
  for (const x of labs) {
    l += x.l;
    a += x.a;
    b += x.b;
  }
  return { l: l / labs.length, a: a / labs.length, b: b / labs.length };
}

/** A group's spread (docs/colour.md): the mean ΔE00 of its colours from their CIELAB mean. */
export function spreadDeltaE00(labs: readonly Lab[], mean: Lab = meanLab(labs)): number {
  if (labs.length === 0) throw new RangeError('spread of no colours');
  let sum = 0;
  for (const x of labs) sum += deltaE00(mean, x);
  return sum / labs.length;
}
