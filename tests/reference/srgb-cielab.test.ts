import { test } from 'node:test';
import assert from 'node:assert/strict';
import { converter } from 'culori';
import Color from 'colorjs.io';
import { WHITE_D65_XY } from '../../shared/colour/constants.js';
import { displayHex, isInSrgbGamut } from '../../shared/colour/display-hex.js';
import { labToLch, lchToLab, type Lab } from '../../shared/colour/lab.js';
import { isHex, parseColour, parseHex } from '../../shared/colour/parse.js';

// sRGB transfer function, IEC 61966-2-1 (= CSS Color Module Level 4, § 10.2 and sample code):
// decode V ≤ 0.04045 → V/12.92, else ((V + 0.055)/1.055)^2.4; encode L ≤ 0.0031308 → 12.92·L,
// else 1.055·L^(1/2.4) − 0.055.
const decode = (v: number) => (v <= 0.04045 ? v / 12.92 : ((v + 0.055) / 1.055) ** 2.4);
const encode = (l: number) => (l <= 0.0031308 ? 12.92 * l : 1.055 * l ** (1 / 2.4) - 0.055);

// Linear sRGB → XYZ (D65), CSS Color 4 sample code, rational form; IEC 61966-2-1 prints it to
// four decimals.
const CSS_RGB_TO_XYZ = [
  [506752 / 1228815, 87881 / 245763, 12673 / 70218],
  [87098 / 409605, 175762 / 245763, 12673 / 175545],
  [7918 / 409605, 87881 / 737289, 1001167 / 1053270],
];
const IEC_RGB_TO_XYZ = [
  [0.4124, 0.3576, 0.1805],
  [0.2126, 0.7152, 0.0722],
  [0.0193, 0.1192, 0.9505],
];
// CIELAB, CIE 15:2004 § 8.2.1: ε = 216/24389, κ = 24389/27.
const EPSILON = 216 / 24389;
const KAPPA = 24389 / 27;

const toLrgb = converter('lrgb');
const toRgb = converter('rgb');
const toXyz65 = converter('xyz65');

/** sRGB (0–1 channels) → CIELAB D65 from the published formulas only, no colour library. */
function independentLab([r, g, b]: readonly number[]): Lab {
  const lin = [r, g, b].map(decode);
  const [x, y, z] = CSS_RGB_TO_XYZ.map((row) => row[0] * lin[0] + row[1] * lin[1] + row[2] * lin[2]);
  // The white is the matrix applied to linear (1, 1, 1): D65 of xy (0.3127, 0.3290).
  const white = CSS_RGB_TO_XYZ.map((row) => row[0] + row[1] + row[2]);
  const f = (t: number) => (t > EPSILON ? Math.cbrt(t) : (KAPPA * t + 16) / 116);
  const [fx, fy, fz] = [x / white[0], y / white[1], z / white[2]].map(f);
  return { l: 116 * fy - 16, a: 500 * (fx - fy), b: 200 * (fy - fz) };
}

function assertClose(actual: number, expected: number, tolerance: number, what: string) {
  assert.ok(Math.abs(actual - expected) <= tolerance, `${what}: got ${actual}, expected ${expected} ± ${tolerance}`);
}

test('IEC 61966-2-1 decode at the breakpoint V = 0.04045 is V/12.92, and just above it the power branch', () => {
  assertClose(toLrgb({ mode: 'rgb', r: 0.04045, g: 0, b: 0 }).r, 0.04045 / 12.92, 1e-15, 'decode(0.04045)');
  assertClose(toLrgb({ mode: 'rgb', r: 0.0405, g: 0, b: 0 }).r, ((0.0405 + 0.055) / 1.055) ** 2.4, 1e-15, 'decode(0.0405)');
  assertClose(toLrgb({ mode: 'rgb', r: 0.5, g: 0, b: 0 }).r, 0.21404114048223255, 1e-12, 'decode(0.5)');
  // The two branches meet at the breakpoint (that is how the IEC constants were chosen).
  assertClose(0.04045 / 12.92, ((0.04045 + 0.055) / 1.055) ** 2.4, 1e-7, 'branches at 0.04045');
});

test('IEC 61966-2-1 encode at the breakpoint L = 0.0031308 is 12.92·L, and above it the power branch', () => {
  assertClose(toRgb({ mode: 'lrgb', r: 0.0031308, g: 0, b: 0 }).r, 12.92 * 0.0031308, 1e-12, 'encode(0.0031308)');
  assertClose(toRgb({ mode: 'lrgb', r: 0.18, g: 0, b: 0 }).r, 1.055 * 0.18 ** (1 / 2.4) - 0.055, 1e-12, 'encode(0.18)');
  // The breakpoints 0.04045 and 0.0031308 are not exact images of each other: 3e-8 apart.
  for (const v of [0, 0.01, 0.04045, 0.2, 0.5, 0.9, 1]) assertClose(encode(decode(v)), v, 1e-7, `round trip ${v}`);
});

test('CSS Color 4 rational sRGB → XYZ matrix rounds to the IEC 61966-2-1 four-decimal matrix', () => {
  CSS_RGB_TO_XYZ.forEach((row, i) => row.forEach((v, j) => assert.equal(Math.round(v * 1e4) / 1e4, IEC_RGB_TO_XYZ[i][j], `m${i}${j}`)));
});

test('sRGB white is D65 of xy (0.3127, 0.3290): XYZ (0.95046, 1, 1.08906) (IEC 61966-2-1; CSS Color 4)', () => {
  const white = toXyz65('#ffffff')!;
  assertClose(white.x, 0.95046, 5e-6, 'X');
  assertClose(white.y, 1, 1e-12, 'Y');
  assertClose(white.z, 1.08906, 5e-6, 'Z');
  assertClose(WHITE_D65_XY.x / WHITE_D65_XY.y, white.x, 1e-12, 'X from the named constant');
  assertClose((1 - WHITE_D65_XY.x - WHITE_D65_XY.y) / WHITE_D65_XY.y, white.z, 1e-12, 'Z from the named constant');
  const lab = parseHex('#ffffff')!;
  assertClose(lab.l, 100, 1e-9, 'L* of white');
  assertClose(lab.a, 0, 1e-9, 'a* of white');
  assertClose(lab.b, 0, 1e-9, 'b* of white');
});

test('linear sRGB → XYZ agrees with the CSS Color 4 rational matrix', () => {
  for (const [r, g, b] of [[1, 0, 0], [0, 1, 0], [0, 0, 1], [0.2, 0.5, 0.8]]) {
    const xyz = toXyz65({ mode: 'rgb', r, g, b });
    const lin = [r, g, b].map(decode);
    const expected = CSS_RGB_TO_XYZ.map((row) => row[0] * lin[0] + row[1] * lin[1] + row[2] * lin[2]);
    assertClose(xyz.x, expected[0], 1e-12, `X of ${[r, g, b]}`);
    assertClose(xyz.y, expected[1], 1e-12, `Y of ${[r, g, b]}`);
    assertClose(xyz.z, expected[2], 1e-12, `Z of ${[r, g, b]}`);
  }
});

test('sRGB → CIELAB D65 matches an independent computation from CSS Color 4 and CIE 15:2004', () => {
  // #010203 lies below ε (the linear branch of f), the others above; mid grey checks a* = b* = 0.
  const cases: [string, number[]][] = [
    ['#ff0000', [1, 0, 0]],
    ['#00ff00', [0, 1, 0]],
    ['#0000ff', [0, 0, 1]],
    ['#808080', [128 / 255, 128 / 255, 128 / 255]],
    ['#c8a064', [200 / 255, 160 / 255, 100 / 255]],
    ['#010203', [1 / 255, 2 / 255, 3 / 255]],
  ];
  for (const [hex, rgb] of cases) {
    const ours = parseHex(hex)!;
    const expected = independentLab(rgb);
    assertClose(ours.l, expected.l, 1e-9, `L* of ${hex}`);
    assertClose(ours.a, expected.a, 1e-9, `a* of ${hex}`);
    assertClose(ours.b, expected.b, 1e-9, `b* of ${hex}`);
  }
  // Well-known D65 figure for sRGB red, as a plausibility anchor: L* 53.24, a* 80.09, b* 67.20.
  const red = parseHex('#ff0000')!;
  assertClose(red.l, 53.24, 0.005, 'L* red');
  assertClose(red.a, 80.09, 0.005, 'a* red');
  assertClose(red.b, 67.2, 0.005, 'b* red');
  const grey = parseHex('#808080')!;
  assert.ok(Math.abs(grey.a) < 1e-9 && Math.abs(grey.b) < 1e-9, 'a neutral has a* = b* = 0');
});

test('LCh: C*ab = √(a² + b²), h°ab = atan2(b, a) in [0, 360), h = 0 for a neutral (CIE 15:2004 § 8.2.1)', () => {
  const lch = labToLch({ l: 40, a: -30, b: -40 });
  assertClose(lch.c, 50, 1e-9, 'C');
  assertClose(lch.h, (Math.atan2(-40, -30) * 180) / Math.PI + 360, 1e-9, 'h');
  assert.equal(labToLch({ l: 60, a: 0, b: 0 }).h, 0);
  const back = lchToLab(lch);
  assertClose(back.a, -30, 1e-9, 'a back');
  assertClose(back.b, -40, 1e-9, 'b back');
});

test('parseHex takes #rgb and #rrggbb (the # optional) and refuses anything else', () => {
  assert.deepEqual(parseHex('#abc'), parseHex('#aabbcc'));
  assert.deepEqual(parseHex('AABBCC'), parseHex('#aabbcc'));
  for (const bad of ['', '#', '#abcd', '#12345', '#1234567', '#aabbccdd', 'zzzzzz', 'red', '#gg0000']) {
    assert.equal(parseHex(bad), undefined, `accepted ${JSON.stringify(bad)}`);
    assert.equal(isHex(bad), false, `isHex(${JSON.stringify(bad)})`);
  }
});

test('parseColour adapts CSS lab() from its D50 white (CSS Color 4 § 9.1) to D65, as colorjs.io does', () => {
  const ours = parseColour('lab(50 20 30)')!;
  const expected = new Color('lab', [50, 20, 30]).to('lab-d65').coords;
  assertClose(ours.l, expected[0]!, 0.01, 'L');
  assertClose(ours.a, expected[1]!, 0.01, 'a');
  assertClose(ours.b, expected[2]!, 0.01, 'b');
  assert.ok(Math.abs(ours.b - 30) > 0.3, 'lab() was taken as D65 without adaptation');
  assert.equal(parseColour('rgb(255 0 0 / 0.5)'), undefined, 'a translucent colour has no single CIELAB value');
  assert.equal(parseColour('not a colour'), undefined);
  assert.deepEqual(parseColour('rgb(255, 0, 0)'), parseHex('#ff0000'));
});

test('display hex: an sRGB colour shows as itself; one outside sRGB is gamut-mapped and flagged', () => {
  assert.deepEqual(displayHex(parseHex('#3a7bd5')!), { hex: '#3a7bd5', inGamut: true });
  const vivid: Lab = { l: 50, a: -90, b: -70 };
  assert.equal(isInSrgbGamut(vivid), false);
  const shown = displayHex(vivid);
  assert.equal(shown.inGamut, false);
  assert.match(shown.hex, /^#[0-9a-f]{6}$/);
  // CSS Color 4 § 13.2 maps by lowering OKLCh chroma at constant OKLCh lightness and hue.
  const toOklch = converter('oklch');
  const mapped = toOklch(shown.hex)!;
  const source = toOklch({ mode: 'lab65', ...vivid });
  assert.ok(mapped.c < source.c, 'chroma was not reduced');
  assertClose(mapped.l, source.l, 0.01, 'OKLCh lightness');
  assertClose(mapped.h!, source.h!, 3, 'OKLCh hue');
});
