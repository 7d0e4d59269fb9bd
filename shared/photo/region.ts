// Regions drawn on a photo, in the upright image's pixel coordinates: x to the right, y down,
// (0, 0) the top-left corner of the top-left pixel. Pixel (i, j) covers [i, i+1) × [j, j+1) and
// belongs to a region when its centre (i + ½, j + ½) lies inside the shape.

/** An axis-aligned rectangle. */
export interface RectRegion {
  shape: 'rect';
  x: number;
  y: number;
  width: number;
  height: number;
}

/** An axis-aligned ellipse by centre and radii. */
export interface EllipseRegion {
  shape: 'ellipse';
  cx: number;
  cy: number;
  rx: number;
  ry: number;
}

/** A simple or self-crossing polygon; inside by the even-odd rule. */
export interface PolygonRegion {
  shape: 'polygon';
  points: [number, number][];
}

/** A tap with a radius: a disc. */
export interface PointRegion {
  shape: 'point';
  x: number;
  y: number;
  radius: number;
}

export type Region = RectRegion | EllipseRegion | PolygonRegion | PointRegion;
export type RegionShape = Region['shape'];

/** Why a region cannot be sampled; the server answers 400 with this message. */
export class RegionError extends Error {
  override readonly name = 'RegionError';
}

/** A region's pixels as row spans: row `y`, columns `x0` up to (not including) `x1`, rows ascending. */
export interface RegionMask {
  /** Integer bounding box of the spans. */
  left: number;
  top: number;
  width: number;
  height: number;
  /** Flat triples (y, x0, x1). */
  spans: Int32Array;
  /** Pixels inside the region. */
  count: number;
}

/** The continuous bounding box of a shape. */
export function regionBounds(region: Region): { minX: number; minY: number; maxX: number; maxY: number } {
  switch (region.shape) {
    case 'rect':
      return { minX: region.x, minY: region.y, maxX: region.x + region.width, maxY: region.y + region.height };
    case 'ellipse':
      return { minX: region.cx - region.rx, minY: region.cy - region.ry, maxX: region.cx + region.rx, maxY: region.cy + region.ry };
    case 'point':
      return { minX: region.x - region.radius, minY: region.y - region.radius, maxX: region.x + region.radius, maxY: region.y + region.radius };
    case 'polygon': {
      const xs = region.points.map((p) => p[0]);
      const ys = region.points.map((p) => p[1]);
      return { minX: Math.min(...xs), minY: Math.min(...ys), maxX: Math.max(...xs), maxY: Math.max(...ys) };
    }
  }
}

/** The same region scaled by `s` about the origin (upright pixels → a resized display copy, and back). */
export function scaleRegion(region: Region, s: number): Region {
  switch (region.shape) {
    case 'rect':
      return { shape: 'rect', x: region.x * s, y: region.y * s, width: region.width * s, height: region.height * s };
    case 'ellipse':
      return { shape: 'ellipse', cx: region.cx * s, cy: region.cy * s, rx: region.rx * s, ry: region.ry * s };
    case 'point':
      return { shape: 'point', x: region.x * s, y: region.y * s, radius: region.radius * s };
    case 'polygon':
      return { shape: 'polygon', points: region.points.map(([x, y]) => [x * s, y * s]) };
  }
}

/**
 * The pixels of a region in an image of the given size. Throws a `RegionError` when any part of
 * the shape lies outside the image or when it holds no pixel centre (degenerate).
 */
export function rasteriseRegion(region: Region, imageWidth: number, imageHeight: number): RegionMask {
  const b = regionBounds(region);
  if (![b.minX, b.minY, b.maxX, b.maxY].every(Number.isFinite)) throw new RegionError('The region has a coordinate that is not a number.');
  if (b.minX < 0 || b.minY < 0 || b.maxX > imageWidth || b.maxY > imageHeight) {
    throw new RegionError(`The region reaches outside the ${imageWidth} × ${imageHeight} image; keep it inside the photo.`);
  }
  const rowFirst = Math.max(0, Math.ceil(b.minY - 0.5));
  const rowLast = Math.min(imageHeight - 1, Math.ceil(b.maxY - 0.5) - 1);
  const triples: number[] = [];
  let count = 0;
  let left = Infinity;
  let right = -Infinity;
  for (let y = rowFirst; y <= rowLast; y++) {
    for (const [xa, xb] of rowIntervals(region, y + 0.5)) {
      // Pixel columns whose centre i + ½ lies in [xa, xb).
      const x0 = Math.max(0, Math.ceil(xa - 0.5));
      const x1 = Math.min(imageWidth, Math.ceil(xb - 0.5));
      if (x1 <= x0) continue;
      triples.push(y, x0, x1);
      count += x1 - x0;
      left = Math.min(left, x0);
      right = Math.max(right, x1);
    }
  }
  if (count === 0) throw new RegionError('The region is too small or flat to hold a whole pixel; draw it larger.');
  const top = triples[0]!;
  const bottom = triples[triples.length - 3]! + 1;
  return { left, top, width: right - left, height: bottom - top, spans: Int32Array.from(triples), count };
}

/** The x intervals [xa, xb) where the horizontal line at `yc` is inside the shape. */
function rowIntervals(region: Region, yc: number): [number, number][] {
  switch (region.shape) {
    case 'rect':
      return yc >= region.y && yc < region.y + region.height ? [[region.x, region.x + region.width]] : [];
    case 'ellipse':
      return ellipseInterval(region.cx, region.cy, region.rx, region.ry, yc);
    case 'point':
      return ellipseInterval(region.x, region.y, region.radius, region.radius, yc);
    case 'polygon':
      return polygonIntervals(region.points, yc);
  }
}

function ellipseInterval(cx: number, cy: number, rx: number, ry: number, yc: number): [number, number][] {
  if (rx <= 0 || ry <= 0) return [];
  const dy = (yc - cy) / ry;
  const q = 1 - dy * dy;
  if (q < 0) return [];
  const dx = rx * Math.sqrt(q);
  // The far edge is inclusive for a disc; nudging it keeps a centre exactly on the rim inside.
  return [[cx - dx, cx + dx + 1e-9]];
}

/** Even-odd scanline: crossings of the polygon's edges with the line, sorted and paired. */
function polygonIntervals(points: readonly [number, number][], yc: number): [number, number][] {
  const xs: number[] = [];
  for (let i = 0; i < points.length; i++) {
    const [px, py] = points[i]!;
    const [qx, qy] = points[(i + 1) % points.length]!;
    // Half-open in y, so a vertex shared by two edges is counted once.
    if ((py <= yc && yc < qy) || (qy <= yc && yc < py)) xs.push(px + ((yc - py) * (qx - px)) / (qy - py));
  }
  xs.sort((a, b) => a - b);
  const out: [number, number][] = [];
  for (let i = 0; i + 1 < xs.length; i += 2) out.push([xs[i]!, xs[i + 1]!]);
  return out;
}
