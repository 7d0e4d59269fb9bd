// Sampling photos made in the test: known colours must come back through upload, profile
// conversion, orientation and correction. Truths are computed with culori from the sRGB values
// written (IEC 61966-2-1 sRGB, CIELAB D65); ΔE00 is culori's CIEDE2000.
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import sharp, { type Sharp } from 'sharp';
import type { PhotoDto, PhotoSample, SampleRequest } from '../../shared/api/photo-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { labFromTuple, labToTuple, type Lab } from '../../shared/colour/lab.js';
import { applyMatrix, linearToLab, tallyRegion, trimmedLinearMean, type LinearRgb, type Matrix3 } from '../../shared/photo/region-stats.js';
import { rasteriseRegion } from '../../shared/photo/region.js';
import { UNIFORM_SPREAD_MAX_DE00 } from '../../shared/photo/sampling-rules.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { fromRaw, hexToRgb8, insetRect, labOfRgb8, linearToRgb8, paintScene, patchGrid, rgb8ToLinear, uploadPhoto, type Patch, type Rgb8 } from './photo-fixtures.js';

/** Invented tissue-like colours: deep petiole purple, vivid pink, leaf green, corm cream, skin brown, vivid green, yellow flesh, grey. */
const COLOURS = ['#6b2d5c', '#c8287a', '#4f7a28', '#e8dcb8', '#8a5a3c', '#2f8f5b', '#d9a02b', '#777777'].map(hexToRgb8);
const BACKGROUND: Rgb8 = [128, 128, 128];

let h: Harness;
let recorder: Client;

before(async () => {
  h = await startHarness();
  recorder = await signedInAs(h, 'recorder');
});
after(() => h.close());

async function upload(bytes: Buffer): Promise<PhotoDto> {
  const res = await uploadPhoto(recorder, bytes);
  assert.ok(res.status === 201 || res.status === 200, res.text);
  return res.body as PhotoDto;
}

async function sample(photo: PhotoDto, body: SampleRequest): Promise<PhotoSample> {
  const res = await recorder.post(`/api/photos/${photo.id}/sample`, body);
  assert.equal(res.status, 200, res.text);
  return res.body as PhotoSample;
}

/** A 400 validation problem naming the region or one of its fields. */
function assertRegionRefused(res: Parameters<typeof assertProblem>[0]): void {
  const problem = assertProblem(res, 400);
  assert.ok(problem.errors?.some((e) => e.field === 'region' || e.field.startsWith('region.')), res.text);
}

function labOf(s: PhotoSample): Lab {
  return labFromTuple(s.lab);
}

/** Reads each patch of a grid photo and returns the worst ΔE00 from the colour written. */
async function worstPatchError(photo: PhotoDto, patches: readonly Patch[], truth: (p: Patch) => Lab = (p) => labOfRgb8(p.rgb)): Promise<number> {
  let worst = 0;
  for (const p of patches) worst = Math.max(worst, deltaE00(truth(p), labOf(await sample(photo, { region: insetRect(p) }))));
  return worst;
}

describe('reading flat patches of known sRGB colours', () => {
  const grid = patchGrid(COLOURS, 4);
  const scene = paintScene(grid.width, grid.height, BACKGROUND, grid.patches);

  test('should read each patch of a PNG within ΔE00 0.5 of the colour written', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).png().toBuffer());
    assert.equal(photo.sourceProfile, 'none');
    const worst = await worstPatchError(photo, grid.patches);
    assert.ok(worst <= 0.5, `worst ΔE00 ${worst.toFixed(3)}`);
  });

  test('should read each patch of a quality-92 JPEG within ΔE00 1.5', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).jpeg({ quality: 92 }).toBuffer());
    assert.equal(photo.mime, 'image/jpeg');
    const worst = await worstPatchError(photo, grid.patches);
    assert.ok(worst <= 1.5, `worst ΔE00 ${worst.toFixed(3)}`);
  });

  test('should read a lossless WebP within ΔE00 0.5', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).webp({ lossless: true }).toBuffer());
    assert.equal(photo.mime, 'image/webp');
    assert.ok((await worstPatchError(photo, grid.patches)) <= 0.5);
  });

  test('should read a 16-bit PNG without a profile within ΔE00 0.5', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).toColourspace('rgb16').png().toBuffer());
    assert.ok((await worstPatchError(photo, grid.patches)) <= 0.5);
  });

  test('should read an AVIF-coded HEIF photo within ΔE00 1.5', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).avif({ quality: 90 }).toBuffer());
    assert.equal(photo.mime, 'image/avif');
    assert.ok((await worstPatchError(photo, grid.patches)) <= 1.5);
  });

  test('should give the same numbers for the same photo and region every time', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).jpeg({ quality: 80 }).toBuffer());
    const body = { region: { shape: 'ellipse' as const, cx: 80, cy: 80, rx: 50, ry: 40 } };
    assert.deepEqual(await sample(photo, body), await sample(photo, body));
  });

  test('should answer the colour in every form, with nearest chips, verdicts and the between answer', async () => {
    const photo = await upload(await fromRaw(scene, grid.width, grid.height).png().toBuffer());
    const s = await sample(photo, { region: insetRect(grid.patches[0]!), k: 3 });
    assert.equal(s.photoId, photo.id);
    assert.equal(s.hex, '#6b2d5c');
    assert.equal(s.inGamut, true);
    assert.ok(Math.abs(s.lch[1] - Math.hypot(s.lab[1], s.lab[2])) < 1e-9, 'C* is the hypotenuse of a*, b*');
    assert.equal(s.pixelCount, 80 * 80);
    assert.equal(s.pixelsDropped, 0);
    assert.equal(s.uniform, true);
    assert.ok(s.spreadDeltaE00 < 0.01, `a flat PNG patch has no spread (${s.spreadDeltaE00})`);
    assert.equal(s.matches.length, 3);
    assert.match(s.matches[0]!.code, /^F-\d{3}(\.\d{3})?$/);
    assert.ok(s.matches[0]!.deltaE00 <= s.matches[1]!.deltaE00);
    assert.ok(['indistinguishable', 'close', 'clearly different'].includes(s.matches[0]!.verdict));
    assert.ok(s.between && s.between.a === s.matches[0]!.code && s.between.t >= 0 && s.between.t <= 1);
    assert.deepEqual(s.correction, { kind: 'none' });
    assert.equal(s.setId, 'v1');
  });
});

describe('regions of every shape', () => {
  // Four quadrants of distinct colours in a 400 × 300 PNG.
  const [a, b, c, d] = [COLOURS[0]!, COLOURS[2]!, COLOURS[3]!, COLOURS[6]!];
  const patches: Patch[] = [
    { rgb: a, x: 0, y: 0, width: 200, height: 150 },
    { rgb: b, x: 200, y: 0, width: 200, height: 150 },
    { rgb: c, x: 0, y: 150, width: 200, height: 150 },
    { rgb: d, x: 200, y: 150, width: 200, height: 150 },
  ];
  let photo: PhotoDto;
  before(async () => {
    photo = await upload(await fromRaw(paintScene(400, 300, BACKGROUND, patches), 400, 300).png().toBuffer());
  });

  const cases: [string, SampleRequest['region'], Rgb8, number | null][] = [
    ['a rectangle', { shape: 'rect', x: 10, y: 10, width: 30, height: 20 }, a, 600],
    ['an ellipse', { shape: 'ellipse', cx: 300, cy: 75, rx: 60, ry: 40 }, b, null],
    ['a polygon', { shape: 'polygon', points: [[20, 170], [180, 170], [100, 280]] }, c, null],
    ['a tap with a radius', { shape: 'point', x: 300, y: 225, radius: 30 }, d, null],
  ];
  for (const [what, region, rgb, count] of cases) {
    test(`should read ${what} from the patch it lies on`, async () => {
      const s = await sample(photo, { region });
      assert.ok(deltaE00(labOfRgb8(rgb), labOf(s)) < 0.5);
      if (count !== null) assert.equal(s.pixelCount, count);
    });
  }

  test('should count the pixels whose centres lie in a disc (about π r²)', async () => {
    const s = await sample(photo, { region: { shape: 'point', x: 300, y: 225, radius: 30 } });
    assert.ok(Math.abs(s.pixelCount - Math.PI * 900) < 2 * Math.PI * 30 * 0.5, `${s.pixelCount} pixels`);
  });

  test('should flag a region across two colours as not uniform', async () => {
    const s = await sample(photo, { region: { shape: 'rect', x: 150, y: 20, width: 100, height: 50 } });
    assert.equal(s.uniform, false);
    assert.ok(s.spreadDeltaE00 > UNIFORM_SPREAD_MAX_DE00, `spread ${s.spreadDeltaE00}`);
  });

  test('should refuse a region reaching outside the image with 400', async () => {
    for (const region of [
      { shape: 'rect', x: 380, y: 10, width: 40, height: 10 },
      { shape: 'point', x: 5, y: 5, radius: 10 },
      { shape: 'polygon', points: [[10, 10], [50, 10], [30, 301]] },
      { shape: 'ellipse', cx: 200, cy: 150, rx: 201, ry: 10 },
    ]) {
      assertRegionRefused(await recorder.post(`/api/photos/${photo.id}/sample`, { region }));
    }
  });

  test('should refuse a degenerate region with 400', async () => {
    for (const region of [
      { shape: 'rect', x: 10, y: 10, width: 0, height: 10 },
      { shape: 'rect', x: 10.6, y: 10.6, width: 0.3, height: 0.3 },
      { shape: 'polygon', points: [[10, 10], [50, 10], [90, 10]] },
      { shape: 'polygon', points: [[10, 10], [50, 10]] },
      { shape: 'point', x: 50, y: 50, radius: -1 },
      { shape: 'circle', x: 50, y: 50 },
    ]) {
      assertRegionRefused(await recorder.post(`/api/photos/${photo.id}/sample`, { region }));
    }
  });
});

describe('clipped, specular and near-black pixels', () => {
  const base = COLOURS[2]!; // leaf green
  const width = 200;
  const height = 200;
  /** Every 7th pixel of the patch is a white glint; every 11th (not a glint) is black. */
  function speckled(): { px: Buffer; glints: number; blacks: number } {
    const px = paintScene(width, height, base, []);
    let glints = 0;
    let blacks = 0;
    for (let i = 0; i < width * height; i++) {
      if (i % 7 === 0) {
        px.set([255, 255, 255], i * 3);
        glints++;
      } else if (i % 11 === 0) {
        px.set([4, 4, 4], i * 3);
        blacks++;
      }
    }
    return { px, glints, blacks };
  }

  test('should drop white glints and near-black pixels and read the leaf underneath', async () => {
    const { px, glints, blacks } = speckled();
    const photo = await upload(await fromRaw(px, width, height).png().toBuffer());
    const s = await sample(photo, { region: { shape: 'rect', x: 0, y: 0, width, height } });
    assert.equal(s.clipped, glints);
    assert.equal(s.dark, blacks);
    assert.equal(s.pixelsDropped, glints + blacks);
    assert.equal(s.pixelCount, width * height - glints - blacks);
    assert.ok(deltaE00(labOfRgb8(base), labOf(s)) < 0.5);
    // What a plain mean in linear light would have said: pulled far towards white.
    const plain = [0, 1, 2].map((c) => {
      let sum = 0;
      for (let i = 0; i < width * height; i++) sum += rgb8ToLinear([px[i * 3]!, px[i * 3 + 1]!, px[i * 3 + 2]!])[c]!;
      return sum / (width * height);
    }) as LinearRgb;
    assert.ok(deltaE00(labOfRgb8(base), linearToLab(plain)) > 5, 'the glints matter');
  });

  test('should refuse a region where every pixel is blown out', async () => {
    const photo = await upload(await fromRaw(paintScene(60, 60, [255, 255, 250], []), 60, 60).png().toBuffer());
    assertRegionRefused(await recorder.post(`/api/photos/${photo.id}/sample`, { region: { shape: 'rect', x: 0, y: 0, width: 60, height: 60 } }));
  });
});

describe('a Display P3 photo', () => {
  const grid = patchGrid(COLOURS, 4);
  const scene = paintScene(grid.width, grid.height, BACKGROUND, grid.patches);

  for (const [what, encode, tolerance] of [
    ['JPEG (quality 92)', (s: Sharp) => s.jpeg({ quality: 92 }), 1.5],
    ['8-bit PNG', (s: Sharp) => s.png(), 1.5],
    ['16-bit PNG', (s: Sharp) => s.toColourspace('rgb16').png(), 1.5],
  ] as const) {
    test(`should read a ${what} saved in Display P3 within ΔE00 ${tolerance} of the colours`, async () => {
      // withIccProfile('p3') converts the pixels into sharp's built-in Display P3 profile and embeds it.
      const bytes = await encode(fromRaw(scene, grid.width, grid.height).withIccProfile('p3')).toBuffer();
      const photo = await upload(bytes);
      assert.notEqual(photo.sourceProfile, 'none');
      const worst = await worstPatchError(photo, grid.patches);
      assert.ok(worst <= tolerance, `worst ΔE00 ${worst.toFixed(3)}`);
    });
  }

  test('should show that reading the P3 numbers as if they were sRGB misses by several ΔE00', async () => {
    const bytes = await fromRaw(scene, grid.width, grid.height).withIccProfile('p3').jpeg({ quality: 92 }).toBuffer();
    // The stored code values themselves, the embedded profile ignored: the naive reading.
    const naive = await sharp(bytes, { ignoreIcc: true }).removeAlpha().raw().toBuffer();
    let worst = 0;
    for (const p of grid.patches) {
      const mask = rasteriseRegion(insetRect(p), grid.width, grid.height);
      const mean = trimmedLinearMean(tallyRegion(mask, naive, { left: 0, top: 0, width: grid.width, rows: grid.height, channels: 3 }))!;
      worst = Math.max(worst, deltaE00(labOfRgb8(p.rgb), linearToLab(mean)));
    }
    // More than twice the 1.5 the converted read is held to.
    assert.ok(worst > 3, `the naive read misses by ${worst.toFixed(2)} at worst`);
  });
});

describe('EXIF orientation', () => {
  // Upright 300 × 200: left half A, top-right B, bottom-right C, so every rotation differs.
  const [a, b, c] = [COLOURS[0]!, COLOURS[2]!, COLOURS[6]!];
  const upright = paintScene(300, 200, BACKGROUND, [
    { rgb: a, x: 0, y: 0, width: 150, height: 200 },
    { rgb: b, x: 150, y: 0, width: 150, height: 100 },
    { rgb: c, x: 150, y: 100, width: 150, height: 100 },
  ]);
  /** EXIF 0x0112: 3 = shown turned 180°, 6 = turned 90° clockwise, 8 = turned 90° anticlockwise; the file holds the inverse turn. */
  const storedTurn: Record<3 | 6 | 8, number> = { 3: 180, 6: 270, 8: 90 };

  for (const orientation of [3, 6, 8] as const) {
    test(`should stand a photo with orientation ${orientation} upright and read the region on the right patch`, async () => {
      const { data, info } = await fromRaw(upright, 300, 200).rotate(storedTurn[orientation]).raw().toBuffer({ resolveWithObject: true });
      const bytes = await fromRaw(data, info.width, info.height).jpeg({ quality: 95 }).withMetadata({ orientation }).toBuffer();
      assert.equal((await sharp(bytes).metadata()).orientation, orientation);
      const photo = await upload(bytes);
      assert.deepEqual([photo.width, photo.height, photo.orientation], [300, 200, orientation]);
      const readB = await sample(photo, { region: { shape: 'rect', x: 180, y: 20, width: 90, height: 60 } });
      const readC = await sample(photo, { region: { shape: 'point', x: 225, y: 150, radius: 25 } });
      assert.ok(deltaE00(labOfRgb8(b), labOf(readB)) < 1.5);
      assert.ok(deltaE00(labOfRgb8(c), labOf(readC)) < 1.5);
      const display = await sharp((await recorder.get(`/api/photos/${photo.id}/image`).expect(200)).body as Buffer).metadata();
      assert.deepEqual([display.width, display.height], [300, 200], 'the display copy is upright too');
    });
  }
});

describe('correction from a neutral card', () => {
  /** A warm cast, as under late-afternoon sun or a lamp: gains per linear channel. */
  const CAST: LinearRgb = [1.3, 1.0, 0.62];
  const grey: LinearRgb = [0.2, 0.2, 0.2];
  const tissue = COLOURS[0]!; // deep purple
  const cast = (v: LinearRgb) => linearToRgb8(v.map((x, i) => x * CAST[i]!) as LinearRgb);
  const card: Patch = { rgb: cast(grey), x: 20, y: 20, width: 100, height: 100 };
  const leaf: Patch = { rgb: cast(rgb8ToLinear(tissue)), x: 160, y: 20, width: 100, height: 100 };
  let photo: PhotoDto;
  before(async () => {
    photo = await upload(await fromRaw(paintScene(280, 140, [90, 80, 60], [card, leaf]), 280, 140).png().toBuffer());
  });

  test('should be far off without correction', async () => {
    const s = await sample(photo, { region: insetRect(leaf) });
    assert.ok(deltaE00(labOfRgb8(tissue), labOf(s)) > 5);
  });

  test('should recover the tissue colour with the card and its known L*', async () => {
    const greyLab = linearToLab(grey);
    const s = await sample(photo, { region: insetRect(leaf), neutral: { region: insetRect(card), lab: labToTuple(greyLab) } });
    assert.ok(deltaE00(labOfRgb8(tissue), labOf(s)) < 1, `ΔE00 ${deltaE00(labOfRgb8(tissue), labOf(s))}`);
    assert.equal(s.correction.kind, 'neutral');
    if (s.correction.kind !== 'neutral') return;
    s.correction.gains.forEach((g, i) => assert.ok(Math.abs(g - 1 / CAST[i]!) < 0.02, `gain ${i} ${g}`));
  });

  test('should make the card itself neutral when no L* is given', async () => {
    const s = await sample(photo, { region: insetRect(card), neutral: { region: insetRect(card) } });
    assert.ok(Math.abs(s.lab[1]) < 0.3 && Math.abs(s.lab[2]) < 0.3, `a* ${s.lab[1]}, b* ${s.lab[2]}`);
  });

  test('should refuse a clipped card and a very dark card', async () => {
    const bad = await upload(await fromRaw(paintScene(200, 100, [20, 20, 20], [{ rgb: [255, 254, 252], x: 0, y: 0, width: 100, height: 100 }, { rgb: [70, 60, 75], x: 150, y: 0, width: 50, height: 100 }]), 200, 100).png().toBuffer());
    const region = { shape: 'rect', x: 160, y: 10, width: 30, height: 30 };
    const clipped = assertProblem(await recorder.post(`/api/photos/${bad.id}/sample`, { region, neutral: { region: { shape: 'rect', x: 10, y: 10, width: 80, height: 80 } } }), 400);
    assert.match(clipped.detail ?? '', /clipped/);
    const dark = assertProblem(await recorder.post(`/api/photos/${bad.id}/sample`, { region, neutral: { region: { shape: 'rect', x: 110, y: 10, width: 30, height: 30 } } }), 400);
    assert.match(dark.detail ?? '', /too dark/);
  });

  test('should refuse a coloured region marked as the card', async () => {
    const res = await recorder.post(`/api/photos/${photo.id}/sample`, { region: insetRect(card), neutral: { region: insetRect(leaf), lab: [60, 0, 0] } });
    assert.match(assertProblem(res, 400).detail ?? '', /not a neutral/);
  });
});

describe('correction from patches of known CIELAB', () => {
  /** The camera's error: truth (linear sRGB) = KNOWN · what the file holds. */
  const KNOWN: Matrix3 = [
    [1.08, -0.06, -0.02],
    [-0.04, 1.02, 0.06],
    [0.03, -0.09, 1.1],
  ];
  const targets = ['#a33b6e', '#5d8c3a', '#d6c69a', '#7a4a2e', '#3c6e8f', '#c9a23f', '#8e8e8e', '#b85a4a'].map(hexToRgb8);
  const probeTruth = hexToRgb8('#6b2d5c');
  const inverse = invert3(KNOWN);
  const held = (rgb: Rgb8) => linearToRgb8(applyMatrix(inverse, rgb8ToLinear(rgb)));
  const grid = patchGrid([...targets, probeTruth].map(held), 3, 100, 20);
  const patchesOf = () => targets.map((rgb, i) => ({ region: insetRect(grid.patches[i]!), lab: labToTuple(labOfRgb8(rgb)) }));
  let photo: PhotoDto;
  before(async () => {
    photo = await upload(await fromRaw(paintScene(grid.width, grid.height, BACKGROUND, grid.patches), grid.width, grid.height).png().toBuffer());
  });

  test('should recover the known matrix, report small residuals and correct another colour', async () => {
    const s = await sample(photo, { region: insetRect(grid.patches[8]!), patches: patchesOf() });
    assert.equal(s.correction.kind, 'patches');
    if (s.correction.kind !== 'patches') return;
    s.correction.matrix.forEach((row, i) => row.forEach((v, j) => assert.ok(Math.abs(v - KNOWN[i]![j]!) < 0.02, `M[${i}][${j}] = ${v}, expected ${KNOWN[i]![j]}`)));
    assert.equal(s.correction.residuals.length, targets.length);
    // What is left is the 8-bit rounding of the patches written into the file.
    assert.ok(s.correction.maxResidualDeltaE00 < 1, `max residual ${s.correction.maxResidualDeltaE00}`);
    assert.ok(deltaE00(labOfRgb8(probeTruth), labOf(s)) < 0.8);
  });

  test('should refuse a fit whose patches were marked with the wrong values', async () => {
    const patches = patchesOf();
    [patches[0]!.lab, patches[1]!.lab] = [patches[1]!.lab, patches[0]!.lab];
    const res = await recorder.post(`/api/photos/${photo.id}/sample`, { region: insetRect(grid.patches[8]!), patches });
    assert.match(assertProblem(res, 400).detail ?? '', /misses patch/);
  });

  test('should refuse patches that are all grey (no three independent colours)', async () => {
    const greyPhoto = await upload(await fromRaw(paintScene(200, 50, [40, 40, 40], [0, 1, 2, 3].map((i) => ({ rgb: [60 + 40 * i, 60 + 40 * i, 60 + 40 * i] as Rgb8, x: i * 50, y: 0, width: 50, height: 50 }))), 200, 50).png().toBuffer());
    const patches = [0, 1, 2, 3].map((i) => ({ region: { shape: 'rect', x: i * 50 + 10, y: 10, width: 30, height: 30 }, lab: [30 + 15 * i, 0, 0] }));
    const res = await recorder.post(`/api/photos/${greyPhoto.id}/sample`, { region: patches[0]!.region, patches });
    assert.match(assertProblem(res, 400).detail ?? '', /independent/);
  });

  test('should refuse fewer than four patches, and a card and patches together', async () => {
    const three = patchesOf().slice(0, 3);
    assertInvalidFields(await recorder.post(`/api/photos/${photo.id}/sample`, { region: insetRect(grid.patches[8]!), patches: three }), 'patches');
    const both = { region: insetRect(grid.patches[8]!), patches: patchesOf(), neutral: { region: insetRect(grid.patches[6]!) } };
    assertInvalidFields(await recorder.post(`/api/photos/${photo.id}/sample`, both), 'patches');
  });
});

/** Inverse of a 3×3 matrix by cofactors (test-side only, to build the photo the camera "took"). */
function invert3(m: Matrix3): Matrix3 {
  const [[a, b, c], [d, e, f], [g, hh, i]] = m;
  const det = a * (e * i - f * hh) - b * (d * i - f * g) + c * (d * hh - e * g);
  return [
    [(e * i - f * hh) / det, (c * hh - b * i) / det, (b * f - c * e) / det],
    [(f * g - d * i) / det, (a * i - c * g) / det, (c * d - a * f) / det],
    [(d * hh - e * g) / det, (b * g - a * hh) / det, (a * e - b * d) / det],
  ];
}
