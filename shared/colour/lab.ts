import { converter, type Lab65, type Lch65 } from 'culori';
import { LAB_MODE, LCH_MODE } from './constants.js';

/** A CIELAB colour, D65 white, 2° observer (culori's `lab65`). */
export interface Lab {
  /** L*, 0 (black) … 100 (the white). */
  l: number;
  /** a*, negative green … positive red. */
  a: number;
  /** b*, negative blue … positive yellow. */
  b: number;
}

/** CIELAB as it travels in the API and the reference-set files: `[L*, a*, b*]`. */
export type LabTuple = [number, number, number];

/** CIE LCh(ab) of a `Lab`: C*ab = √(a*² + b*²) and h°ab = atan2(b*, a*) in degrees (CIE 15:2004 § 8.2.1). */
export interface Lch {
  l: number;
  /** C*ab, chroma. */
  c: number;
  /** h°ab in [0, 360); 0 for a neutral, whose hue is undefined. */
  h: number;
}

const toLab65 = converter(LAB_MODE);
const toLch65 = converter(LCH_MODE);

/** Culori's view of a `Lab`, for calling culori functions. */
export function toCulori(lab: Lab): Lab65 {
  return { mode: LAB_MODE, l: lab.l, a: lab.a, b: lab.b };
}

/** Reads culori's answer back as a plain `Lab` (culori leaves missing channels undefined). */
export function fromCulori(colour: { l?: number; a?: number; b?: number }): Lab {
  return { l: colour.l ?? 0, a: colour.a ?? 0, b: colour.b ?? 0 };
}

/** `[L, a, b]` → `Lab`. */
export function labFromTuple(tuple: readonly [number, number, number]): Lab {
  return { l: tuple[0], a: tuple[1], b: tuple[2] };
}

/** `Lab` → `[L, a, b]`. */
export function labToTuple(lab: Lab): LabTuple {
  return [lab.l, lab.a, lab.b];
}

/** CIELAB → LCh(ab), through culori's `lch65`. */
export function labToLch(lab: Lab): Lch {
  const lch = toLch65(toCulori(lab));
  return { l: lch.l, c: lch.c, h: lch.h ?? 0 };
}

/** LCh(ab) → CIELAB, through culori's `lab65`. */
export function lchToLab(lch: Lch): Lab {
  const source: Lch65 = { mode: LCH_MODE, l: lch.l, c: lch.c, h: lch.h };
  return fromCulori(toLab65(source));
}

/** Whether every channel is a finite number. */
export function isFiniteLab(lab: Lab): boolean {
  return Number.isFinite(lab.l) && Number.isFinite(lab.a) && Number.isFinite(lab.b);
}
