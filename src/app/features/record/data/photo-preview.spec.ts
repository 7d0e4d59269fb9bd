import { previewRegion, type Pixels } from './photo-preview';

/** RGBA pixels: the left half one colour, the right half another. */
function halves(width: number, height: number, left: number[], right: number[]): Pixels {
  const data = new Uint8ClampedArray(width * height * 4);
  for (let y = 0; y < height; y++) {
    for (let x = 0; x < width; x++) data.set([...(x < width / 2 ? left : right), 255], (y * width + x) * 4);
  }
  return { data, width, height };
}

describe('photo preview', () => {
  it('should read a flat region of the display copy as its colour, in photo coordinates', () => {
    const pixels = halves(200, 100, [107, 45, 92], [230, 220, 184]);
    // The photo is 4× the display copy.
    const preview = previewRegion(pixels, 800, { shape: 'rect', x: 40, y: 40, width: 200, height: 200 });
    expect(preview?.hex).toBe('#6b2d5c');
    expect(preview?.pixelCount).toBe(50 * 50);
    expect(preview?.balanced).toBe(false);
  });

  it('should make a warm card neutral, and shift the tissue with it', () => {
    const pixels = halves(200, 100, [150, 128, 100], [107, 45, 92]);
    const card = { shape: 'rect' as const, x: 10, y: 10, width: 60, height: 60 };
    const onCard = previewRegion(pixels, 200, card, card)!;
    expect(Math.abs(onCard.lab[1])).toBeLessThan(0.5);
    expect(Math.abs(onCard.lab[2])).toBeLessThan(0.5);
    const tissue = { shape: 'rect' as const, x: 120, y: 10, width: 60, height: 60 };
    expect(previewRegion(pixels, 200, tissue, card)!.lab[2]).toBeLessThan(previewRegion(pixels, 200, tissue)!.lab[2]);
  });

  it('should give no preview for a region too small for the display copy', () => {
    const pixels = halves(20, 10, [10, 10, 10], [200, 200, 200]);
    expect(previewRegion(pixels, 2000, { shape: 'rect', x: 0, y: 0, width: 10, height: 10 })).toBeNull();
  });
});
