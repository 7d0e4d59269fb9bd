// The pure parts of photo sampling: which pixels a region holds, the histogram trimmed mean
// against a plain sort-and-cut one, and the EXIF and ICC readers on good and hostile bytes.
import assert from 'node:assert/strict';
import { describe, test } from 'node:test';
import { exifCaptureTime } from '../../server/photos/exif.js';
import { iccProfileName, NO_PROFILE } from '../../server/photos/icc.js';
import { LINEAR_OF_CODE, RegionAccumulator, trimmedLinearMean } from '../../shared/photo/region-stats.js';
import { rasteriseRegion, RegionError, type Region } from '../../shared/photo/region.js';
import { TRIM_FRACTION } from '../../shared/photo/sampling-rules.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';

/** Pixels of a mask as "x,y" strings. */
function pixelsOf(region: Region, width = 100, height = 100): Set<string> {
  const mask = rasteriseRegion(region, width, height);
  const out = new Set<string>();
  for (let s = 0; s < mask.spans.length; s += 3) for (let x = mask.spans[s + 1]!; x < mask.spans[s + 2]!; x++) out.add(`${x},${mask.spans[s]}`);
  assert.equal(out.size, mask.count);
  return out;
}

describe('region masks', () => {
  test('should take the pixels whose centres lie in a rectangle', () => {
    assert.equal(pixelsOf({ shape: 'rect', x: 10, y: 20, width: 5, height: 3 }).size, 15);
    // Centres at 10.5 … 14.5: a rectangle from 10.6 misses column 10, one to 15.4 takes column 14 only.
    assert.deepEqual([...pixelsOf({ shape: 'rect', x: 10.6, y: 0, width: 4.8, height: 1 })].sort(), ['11,0', '12,0', '13,0', '14,0']);
  });

  test('should give a disc the same pixels as the ellipse with equal radii, symmetric about its centre', () => {
    const disc = pixelsOf({ shape: 'point', x: 50, y: 50, radius: 10 });
    assert.deepEqual(disc, pixelsOf({ shape: 'ellipse', cx: 50, cy: 50, rx: 10, ry: 10 }));
    for (const p of disc) {
      const [x, y] = p.split(',').map(Number) as [number, number];
      assert.ok(disc.has(`${99 - x},${y}`) && disc.has(`${x},${99 - y}`), `mirror of ${p}`);
    }
  });

  test('should fill a self-crossing polygon by the even-odd rule', () => {
    // A bow tie on its side: two triangles, left and right, meeting at (50, 50).
    const bowTie = pixelsOf({ shape: 'polygon', points: [[10, 10], [90, 90], [90, 10], [10, 90]] });
    assert.ok(bowTie.has('20,50') && bowTie.has('80,50'), 'the left and right triangles are inside');
    assert.ok(!bowTie.has('50,20') && !bowTie.has('50,80'), 'the top and bottom notches are outside');
  });

  test('should refuse a region outside the image or without a pixel centre', () => {
    assert.throws(() => rasteriseRegion({ shape: 'rect', x: -1, y: 0, width: 5, height: 5 }, 100, 100), RegionError);
    assert.throws(() => rasteriseRegion({ shape: 'point', x: 99, y: 50, radius: 2 }, 100, 100), RegionError);
    assert.throws(() => rasteriseRegion({ shape: 'polygon', points: [[0, 0], [10, 10], [20, 20]] }, 100, 100), RegionError);
    assert.throws(() => rasteriseRegion({ shape: 'rect', x: 0, y: 0, width: Number.NaN, height: 1 }, 100, 100), RegionError);
  });
});

describe('the trimmed mean in linear light', () => {
  test('should equal a sort-and-cut trimmed mean of the decoded values, per channel', () => {
    const random = mulberry32(0x7472696d);
    const n = 997;
    const acc = new RegionAccumulator(n);
    const channels: number[][] = [[], [], []];
    for (let i = 0; i < n; i++) {
      const rgb = [20 + Math.floor(random() * 220), 20 + Math.floor(random() * 200), 30 + Math.floor(random() * 210)];
      acc.add(rgb[0]!, rgb[1]!, rgb[2]!);
      rgb.forEach((v, c) => channels[c]!.push(LINEAR_OF_CODE[v]!));
    }
    const cut = Math.floor(n * TRIM_FRACTION);
    const expected = channels.map((values) => {
      const kept = [...values].sort((a, b) => a - b).slice(cut, n - cut);
      return kept.reduce((a, b) => a + b, 0) / kept.length;
    });
    trimmedLinearMean(acc.tally())!.forEach((v, c) => assert.ok(Math.abs(v - expected[c]!) < 1e-12, `channel ${c}`));
  });

  test('should average in linear light, not in code values', () => {
    // Half black-ish, half white-ish: the linear mean is far lighter than code value 128 would be.
    const acc = new RegionAccumulator(2);
    acc.add(40, 40, 40);
    acc.add(240, 240, 240);
    const [r] = trimmedLinearMean(acc.tally())!;
    assert.ok(Math.abs(r - (LINEAR_OF_CODE[40]! + LINEAR_OF_CODE[240]!) / 2) < 1e-12);
    assert.ok(r > LINEAR_OF_CODE[140]!);
  });
});

describe('EXIF and ICC readers', () => {
  test('should ignore EXIF blocks that are cut short or point outside themselves', () => {
    assert.equal(exifCaptureTime(undefined), null);
    assert.equal(exifCaptureTime(Buffer.from('Exif\0\0II*\0')), null);
    assert.equal(exifCaptureTime(Buffer.from('Exif\0\0II*\0\xff\xff\xff\x7f', 'latin1')), null);
    assert.equal(exifCaptureTime(Buffer.from('not exif at all')), null);
  });

  test('should read a v2 profile description and survive a damaged tag table', () => {
    const desc = Buffer.concat([Buffer.from('desc\0\0\0\0', 'latin1'), Buffer.from([0, 0, 0, 11]), Buffer.from('Leaf Camera\0', 'latin1')]);
    const header = Buffer.alloc(132);
    header.writeUInt32BE(1, 128);
    const entry = Buffer.alloc(12);
    entry.write('desc', 0, 'latin1');
    entry.writeUInt32BE(144, 4);
    entry.writeUInt32BE(desc.length, 8);
    assert.equal(iccProfileName(Buffer.concat([header, entry, desc])), 'Leaf Camera');
    const damaged = Buffer.concat([header, entry]);
    damaged.writeUInt32BE(10_000, 132 + 4);
    assert.equal(iccProfileName(damaged), 'unnamed profile');
    assert.equal(iccProfileName(undefined), NO_PROFILE);
  });
});
