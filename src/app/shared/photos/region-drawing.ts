// Turning strokes on the photo into regions, in upright photo pixels, always inside the photo
// (the server refuses a region that reaches outside).
import type { Region } from '../../../../shared/photo/region.js';

/** Drawing tools, and "move" for panning with one finger. */
export type Tool = 'rect' | 'ellipse' | 'polygon' | 'point' | 'move';

/** A photo's size. */
export interface PhotoSize {
  width: number;
  height: number;
}

/** Clamps a point into the photo. */
export function clampToPhoto([x, y]: [number, number], size: PhotoSize): [number, number] {
  return [Math.min(size.width, Math.max(0, x)), Math.min(size.height, Math.max(0, y))];
}

/** The rectangle or ellipse spanned by a drag from `a` to `b`; null while it holds less than `minSide` pixels a side. */
export function dragRegion(tool: 'rect' | 'ellipse', a: [number, number], b: [number, number], size: PhotoSize, minSide = 2): Region | null {
  const [x0, y0] = clampToPhoto(a, size);
  const [x1, y1] = clampToPhoto(b, size);
  const x = Math.min(x0, x1);
  const y = Math.min(y0, y1);
  const width = Math.abs(x1 - x0);
  const height = Math.abs(y1 - y0);
  if (width < minSide || height < minSide) return null;
  return tool === 'rect' ? { shape: 'rect', x, y, width, height } : { shape: 'ellipse', cx: x + width / 2, cy: y + height / 2, rx: width / 2, ry: height / 2 };
}

/** A tap with a radius, moved inward (and shrunk if need be) so the disc lies inside the photo. */
export function pointRegion(at: [number, number], radius: number, size: PhotoSize): Region {
  const r = Math.max(1, Math.min(radius, size.width / 2, size.height / 2));
  return {
    shape: 'point',
    x: Math.min(size.width - r, Math.max(r, at[0])),
    y: Math.min(size.height - r, Math.max(r, at[1])),
    radius: r,
  };
}

/** A polygon of the points tapped; null until it has three. */
export function polygonRegion(points: readonly [number, number][]): Region | null {
  return points.length >= 3 ? { shape: 'polygon', points: points.map((p) => [p[0], p[1]]) } : null;
}

/** A default tap radius: 2 % of the photo's shorter side (our own; about a fingertip on a leaf at arm's length). */
export function defaultRadius(size: PhotoSize): number {
  return Math.max(4, Math.round(Math.min(size.width, size.height) * 0.02));
}

/** An SVG path of a region, for the outline drawn over the photo. */
export function regionPath(region: Region): string {
  switch (region.shape) {
    case 'rect':
      return `M${region.x} ${region.y}h${region.width}v${region.height}h${-region.width}Z`;
    case 'ellipse':
      return ellipsePath(region.cx, region.cy, region.rx, region.ry);
    case 'point':
      return ellipsePath(region.x, region.y, region.radius, region.radius);
    case 'polygon':
      return `M${region.points.map((p) => `${p[0]} ${p[1]}`).join('L')}Z`;
  }
}

function ellipsePath(cx: number, cy: number, rx: number, ry: number): string {
  return `M${cx - rx} ${cy}a${rx} ${ry} 0 1 0 ${2 * rx} 0a${rx} ${ry} 0 1 0 ${-2 * rx} 0Z`;
}

/** Words for a region, for screen readers and the marks list. */
export function describeRegion(region: Region): string {
  const n = (v: number) => Math.round(v);
  switch (region.shape) {
    case 'rect':
      return `box ${n(region.width)} × ${n(region.height)} px`;
    case 'ellipse':
      return `oval ${n(2 * region.rx)} × ${n(2 * region.ry)} px`;
    case 'point':
      return `spot ${n(2 * region.radius)} px across`;
    case 'polygon':
      return `outline of ${region.points.length} points`;
  }
}
