// Regions with more than one colour: a striped petiole's region averages to a colour that is not
// on the plant, so a region that is not uniform is split into its colours. Synthetic striped
// photos whose colours are known; truths computed with culori from the sRGB values written
// (IEC 61966-2-1 sRGB, CIELAB D65), ΔE00 culori's CIEDE2000.
import assert from 'node:assert/strict';
import { after, before, describe, test } from 'node:test';
import type { PhotoDto, PhotoSample } from '../../shared/api/photo-answers.js';
import type { MatchAnswer } from '../../shared/api/reference-set-answers.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { fromRaw, hexToRgb8, labOfRgb8, uploadPhoto, type Rgb8 } from './photo-fixtures.js';

/** Invented tissue colours: a leaf-green petiole ground, a purple stripe, a cream fleck. */
const GROUND = hexToRgb8('#4f7a28');
const STRIPE = hexToRgb8('#6b2d5c');
const FLECK = hexToRgb8('#e8dcb8');

const WIDTH = 400;
const HEIGHT = 200;

/** Vertical stripes repeating the given colours and widths (pixels) across the image. */
function stripes(pattern: readonly { rgb: Rgb8; width: number }[]): Buffer {
  const period = pattern.reduce((n, p) => n + p.width, 0);
  const px = Buffer.alloc(WIDTH * HEIGHT * 3);
  for (let x = 0; x < WIDTH; x++) {
    let offset = x % period;
    const band = pattern.find((p) => (offset -= p.width) < 0)!;
    for (let y = 0; y < HEIGHT; y++) px.set(band.rgb, (y * WIDTH + x) * 3);
  }
  return px;
}

let h: Harness;
let recorder: Client;

before(async () => {
  h = await startHarness();
  recorder = await signedInAs(h, 'recorder');
});
after(() => h.close());

async function sampleOf(bytes: Buffer, filename: string, type: string): Promise<PhotoSample> {
  const up = await uploadPhoto(recorder, bytes, filename, type);
  assert.ok(up.status === 201 || up.status === 200, up.text);
  const photo = up.body as PhotoDto;
  // Whole periods of the pattern (400 px = 10 periods of 40), clear of the image edge.
  const res = await recorder.post(`/api/photos/${photo.id}/sample`, { region: { shape: 'rect', x: 0, y: 20, width: 400, height: 160 } });
  assert.equal(res.status, 200, res.text);
  return res.body as PhotoSample;
}

async function nearestChip(rgb: Rgb8): Promise<string> {
  const lab = labOfRgb8(rgb);
  const answer = (await recorder.post('/api/match', { lab: [lab.l, lab.a, lab.b], k: 1 }).expect(200)).body as MatchAnswer;
  return answer.matches[0]!.code;
}

describe('photo regions with more than one colour', () => {
  test('a PNG of green ground with purple stripes (3 : 1) gives both colours, their shares and chips', async () => {
    const png = await fromRaw(stripes([{ rgb: GROUND, width: 30 }, { rgb: STRIPE, width: 10 }]), WIDTH, HEIGHT).png().toBuffer();
    const s = await sampleOf(png, 'stripes.png', 'image/png');
    assert.equal(s.uniform, false);
    // The mean is a mixture: far from both colours actually on the plant.
    assert.ok(deltaE00(labFromTuple(s.lab), labOfRgb8(GROUND)) > 5 && deltaE00(labFromTuple(s.lab), labOfRgb8(STRIPE)) > 5);
    assert.equal(s.clusters.length, 2, JSON.stringify(s.clusters.map((c) => [c.lab, c.share])));
    const [ground, stripe] = s.clusters;
    assert.ok(deltaE00(labFromTuple(ground!.lab), labOfRgb8(GROUND)) < 0.5, `ground ${ground!.lab}`);
    assert.ok(deltaE00(labFromTuple(stripe!.lab), labOfRgb8(STRIPE)) < 0.5, `stripe ${stripe!.lab}`);
    assert.ok(Math.abs(ground!.share - 0.75) < 0.02 && Math.abs(stripe!.share - 0.25) < 0.02, `${ground!.share} ${stripe!.share}`);
    assert.ok(ground!.spreadDeltaE00 < 0.5 && stripe!.spreadDeltaE00 < 0.5);
    assert.equal(ground!.chip.code, await nearestChip(GROUND));
    assert.equal(stripe!.chip.code, await nearestChip(STRIPE));
    assert.equal(ground!.chip.deltaE00 >= 0, true);
  });

  test('a quality-92 JPEG of the same stripes gives the two colours within ΔE00 2', async () => {
    const jpeg = await fromRaw(stripes([{ rgb: GROUND, width: 30 }, { rgb: STRIPE, width: 10 }]), WIDTH, HEIGHT).jpeg({ quality: 92 }).toBuffer();
    const s = await sampleOf(jpeg, 'stripes.jpg', 'image/jpeg');
    assert.equal(s.clusters.length, 2);
    assert.ok(deltaE00(labFromTuple(s.clusters[0]!.lab), labOfRgb8(GROUND)) < 2, `ground ${s.clusters[0]!.lab}`);
    assert.ok(deltaE00(labFromTuple(s.clusters[1]!.lab), labOfRgb8(STRIPE)) < 2, `stripe ${s.clusters[1]!.lab}`);
    assert.ok(Math.abs(s.clusters[0]!.share - 0.75) < 0.05);
  });

  test('three bands (ground, stripe, cream fleck) give three colours, largest share first', async () => {
    const png = await fromRaw(stripes([{ rgb: GROUND, width: 20 }, { rgb: STRIPE, width: 12 }, { rgb: FLECK, width: 8 }]), WIDTH, HEIGHT).png().toBuffer();
    const s = await sampleOf(png, 'three.png', 'image/png');
    assert.equal(s.clusters.length, 3, JSON.stringify(s.clusters.map((c) => [c.lab, c.share])));
    const expected = [GROUND, STRIPE, FLECK];
    s.clusters.forEach((c, i) => assert.ok(deltaE00(labFromTuple(c.lab), labOfRgb8(expected[i]!)) < 0.5, `cluster ${i}: ${c.lab}`));
    assert.deepEqual(s.clusters.map((c) => Math.round(c.share * 100)), [50, 30, 20]);
  });

  test('the same region splits the same way every time', async () => {
    const png = await fromRaw(stripes([{ rgb: GROUND, width: 30 }, { rgb: STRIPE, width: 10 }]), WIDTH, HEIGHT).png().toBuffer();
    const a = await sampleOf(png, 'stripes.png', 'image/png');
    const b = await sampleOf(png, 'stripes.png', 'image/png');
    assert.deepEqual(a.clusters, b.clusters);
  });

  test('a uniform region is not split', async () => {
    const png = await fromRaw(stripes([{ rgb: GROUND, width: 40 }]), WIDTH, HEIGHT).png().toBuffer();
    const s = await sampleOf(png, 'flat.png', 'image/png');
    assert.equal(s.uniform, true);
    assert.deepEqual(s.clusters, []);
  });

  test('two shades closer than the not-uniform spread are one colour, not two', async () => {
    // ΔE00 about 2.3 apart: the region may or may not count as uniform, but never splits.
    const png = await fromRaw(stripes([{ rgb: GROUND, width: 20 }, { rgb: [GROUND[0] + 4, GROUND[1] + 4, GROUND[2] + 4], width: 20 }]), WIDTH, HEIGHT).png().toBuffer();
    const s = await sampleOf(png, 'shades.png', 'image/png');
    assert.ok(deltaE00(labOfRgb8(GROUND), labOfRgb8([GROUND[0] + 4, GROUND[1] + 4, GROUND[2] + 4])) < 3.6);
    assert.deepEqual(s.clusters, []);
  });
});
