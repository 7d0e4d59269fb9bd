// D50 → D65 CIELAB by the Bradford chromatic adaptation, checked against the Bradford matrix built
// here from its published parts rather than against culori's own constants.
import assert from 'node:assert/strict';
import { test } from 'node:test';
import { converter } from 'culori';

import { labD50ToD65 } from '../../shared/colour/chromatic-adaptation.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';

type M3 = [[number, number, number], [number, number, number], [number, number, number]];
type V3 = [number, number, number];

/**
 * The Bradford cone-response matrix M_A of K. M. Lam (1985), as printed in B. Lindbloom,
 * "Chromatic Adaptation" (brucelindbloom.com, Bradford row of the cone response table) and in
 * ICC.1:2010 Annex E (the linear Bradford transform).
 */
const M_BRADFORD: M3 = [
  [0.8951, 0.2664, -0.1614],
  [-0.7502, 1.7135, 0.0367],
  [0.0389, -0.0685, 1.0296],
];

/**
 * White points from the chromaticities of D65 (x 0.3127, y 0.3290; IEC 61966-2-1, sRGB) and D50
 * (x 0.3457, y 0.3585; ICC.1:2010 PCS white, rounded as CSS Color 4 gives it), values from memory.
 */
const white = (x: number, y: number): V3 => [x / y, 1, (1 - x - y) / y];
const D65 = white(0.3127, 0.329);
const D50 = white(0.3457, 0.3585);

const mul = (m: M3, v: V3): V3 => m.map((row) => row[0] * v[0] + row[1] * v[1] + row[2] * v[2]) as V3;
function inverse(m: M3): M3 {
  const [[a, b, c], [d, e, f], [g, h, i]] = m;
  const det = a * (e * i - f * h) - b * (d * i - f * g) + c * (d * h - e * g);
  return [
    [(e * i - f * h) / det, (c * h - b * i) / det, (b * f - c * e) / det],
    [(f * g - d * i) / det, (a * i - c * g) / det, (c * d - a * f) / det],
    [(d * h - e * g) / det, (b * g - a * h) / det, (a * e - b * d) / det],
  ];
}

/** XYZ under D50 → XYZ under D65 by Bradford, step by step: into cone space, scale by the whites' cone ratios, back (Lindbloom, eq. of the page above). */
function bradfordD50ToD65(xyz: V3): V3 {
  const src = mul(M_BRADFORD, D50);
  const dst = mul(M_BRADFORD, D65);
  const cone = mul(M_BRADFORD, xyz);
  const scaled: V3 = [cone[0] * (dst[0] / src[0]), cone[1] * (dst[1] / src[1]), cone[2] * (dst[2] / src[2])];
  return mul(inverse(M_BRADFORD), scaled);
}

const toXyz50 = converter('xyz50');
const toLab65 = converter('lab65');

/** Tissue-like colours of our own (a purple petiole, a cream corm, a leaf green, a near-neutral). */
const SAMPLES: V3[] = [
  [35, 28, -12],
  [82, 2, 18],
  [45, -22, 30],
  [60, 0.5, -0.5],
];

test('should adapt D50 CIELAB to D65 as the Bradford matrix from Lam (1985) via Lindbloom does, within ΔE00 0.001', () => {
  for (const [l, a, b] of SAMPLES) {
    const xyz = toXyz50({ mode: 'lab', l, a, b });
    const [x, y, z] = bradfordD50ToD65([xyz.x, xyz.y, xyz.z]);
    const expected = toLab65({ mode: 'xyz65', x, y, z });
    const got = labD50ToD65({ l, a, b });
    const gap = deltaE00(got, { l: expected.l, a: expected.a, b: expected.b });
    assert.ok(gap < 0.001, `L*a*b* D50 ${l}, ${a}, ${b}: ΔE00 ${gap} from the Bradford matrix built from its parts`);
  }
});

test('should move a leaf green by more than the just-perceptible ΔE00 (the numbers cannot be kept as if D65)', () => {
  // Measured here: about ΔE00 1.25 for L*a*b* 45, −22, 30; about 1.75 for the cream 82, 2, 18.
  const got = labD50ToD65({ l: 45, a: -22, b: 30 });
  assert.ok(deltaE00(got, { l: 45, a: -22, b: 30 }) > 1, 'a green read against D50 is not the same numbers against D65');
});

test('should carry the D50 white to the D65 white (a von Kries-type transform maps white to white; Lindbloom, ibid.)', () => {
  const white = labD50ToD65({ l: 100, a: 0, b: 0 });
  assert.ok(Math.abs(white.l - 100) < 0.01 && Math.abs(white.a) < 0.01 && Math.abs(white.b) < 0.01, JSON.stringify(white));
  const grey = labD50ToD65({ l: 50, a: 0, b: 0 });
  assert.ok(Math.abs(grey.a) < 0.01 && Math.abs(grey.b) < 0.01, 'a neutral stays neutral');
});
