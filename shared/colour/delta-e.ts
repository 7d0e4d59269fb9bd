import { differenceCiede2000, differenceEuclidean } from 'culori';
import { CIEDE2000_K, LAB_MODE } from './constants.js';
import type { Lab } from './lab.js';

const ciede2000 = differenceCiede2000(CIEDE2000_K.l, CIEDE2000_K.c, CIEDE2000_K.h);
const euclideanLab = differenceEuclidean(LAB_MODE);

/**
 * CIEDE2000 colour difference ΔE00 between two CIELAB D65 colours, kL = kC = kH = 1 (CIE 142-2001;
 * Sharma, Wu & Dalal 2005). Culori's `differenceCiede2000`; symmetric in its arguments.
 */
export function deltaE00(reference: Lab, sample: Lab): number {
  return ciede2000(
    { mode: LAB_MODE, l: reference.l, a: reference.a, b: reference.b },
    { mode: LAB_MODE, l: sample.l, a: sample.a, b: sample.b },
  );
}

/**
 * Euclidean distance in CIELAB, ΔE*ab (CIE 1976; CIE 15:2004 § 8.2.1), culori's
 * `differenceEuclidean('lab65')`. Geometry only ("between"), never for matching.
 */
export function deltaEab(p: Lab, q: Lab): number {
  return euclideanLab({ mode: LAB_MODE, l: p.l, a: p.a, b: p.b }, { mode: LAB_MODE, l: q.l, a: q.a, b: q.b });
}
