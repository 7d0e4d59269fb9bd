import { clampToPhoto, defaultRadius, describeRegion, dragRegion, pointRegion, polygonRegion, regionPath } from './region-drawing';

const size = { width: 400, height: 300 };

describe('region drawing', () => {
  it('should make the same rectangle whichever corner the drag starts from', () => {
    expect(dragRegion('rect', [50, 80], [10, 20], size)).toEqual({ shape: 'rect', x: 10, y: 20, width: 40, height: 60 });
  });

  it('should keep a drag that runs off the photo inside it', () => {
    expect(dragRegion('rect', [380, 290], [450, -20], size)).toEqual({ shape: 'rect', x: 380, y: 0, width: 20, height: 290 });
  });

  it('should make an ellipse inscribed in the dragged box', () => {
    expect(dragRegion('ellipse', [100, 100], [200, 140], size)).toEqual({ shape: 'ellipse', cx: 150, cy: 120, rx: 50, ry: 20 });
  });

  it('should treat a drag shorter than the minimum side as no region', () => {
    expect(dragRegion('rect', [10, 10], [11, 40], size, 2)).toBeNull();
  });

  it('should move a spot near the edge inward so the disc stays inside', () => {
    expect(pointRegion([2, 299], 10, size)).toEqual({ shape: 'point', x: 10, y: 290, radius: 10 });
  });

  it('should shrink a spot larger than the photo', () => {
    const spot = pointRegion([5, 5], 1000, { width: 40, height: 20 });
    expect(spot).toEqual({ shape: 'point', x: 10, y: 10, radius: 10 });
  });

  it('should need three points for an outline', () => {
    expect(polygonRegion([[0, 0], [10, 0]])).toBeNull();
    expect(polygonRegion([[0, 0], [10, 0], [5, 8]])).toEqual({ shape: 'polygon', points: [[0, 0], [10, 0], [5, 8]] });
  });

  it('should clamp a point to the photo', () => {
    expect(clampToPhoto([-5, 500], size)).toEqual([0, 300]);
  });

  it('should draw a closed SVG path for every shape', () => {
    expect(regionPath({ shape: 'rect', x: 1, y: 2, width: 3, height: 4 })).toBe('M1 2h3v4h-3Z');
    expect(regionPath({ shape: 'point', x: 10, y: 10, radius: 5 })).toMatch(/^M5 10a5 5 .*Z$/);
    expect(regionPath({ shape: 'polygon', points: [[0, 0], [4, 0], [2, 3]] })).toBe('M0 0L4 0L2 3Z');
  });

  it('should describe a region in words', () => {
    expect(describeRegion({ shape: 'rect', x: 10.2, y: 20.7, width: 30.4, height: 40 })).toBe('box 30 × 40 px');
    expect(describeRegion({ shape: 'point', x: 1, y: 1, radius: 6 })).toBe('spot 12 px across');
  });

  it('should size the default spot to the photo', () => {
    expect(defaultRadius({ width: 4000, height: 3000 })).toBe(60);
    expect(defaultRadius({ width: 100, height: 50 })).toBe(4);
  });
});
