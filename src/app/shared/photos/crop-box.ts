// The part of a photo the reading detail shows: the region with a margin of photo around it.
import { regionBounds, type Region } from '../../../../shared/photo/region.js';

/** A box in upright photo pixels. */
export interface CropBox {
  x: number;
  y: number;
  width: number;
  height: number;
}

/** Margin around the region, as a share of its larger side (our own: enough to see where on the organ it lies). */
const MARGIN_SHARE = 0.6;
/** The crop is never smaller than this share of the photo's shorter side, so a tiny spot keeps its surroundings. */
const MIN_SHARE = 0.25;

/** The crop around a region, kept inside the photo. */
export function cropAround(region: Region, photo: { width: number; height: number }): CropBox {
  const b = regionBounds(region);
  const side = Math.max(b.maxX - b.minX, b.maxY - b.minY);
  const margin = side * MARGIN_SHARE;
  const minSide = Math.min(photo.width, photo.height) * MIN_SHARE;
  const width = Math.min(photo.width, Math.max(b.maxX - b.minX + 2 * margin, minSide));
  const height = Math.min(photo.height, Math.max(b.maxY - b.minY + 2 * margin, minSide));
  const cx = (b.minX + b.maxX) / 2;
  const cy = (b.minY + b.maxY) / 2;
  return {
    x: clamp(cx - width / 2, 0, photo.width - width),
    y: clamp(cy - height / 2, 0, photo.height - height),
    width,
    height,
  };
}

function clamp(v: number, lo: number, hi: number): number {
  return Math.min(hi, Math.max(lo, v));
}
