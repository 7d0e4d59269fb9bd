import sharp from 'sharp';
import { RegionAccumulator, type RegionTally } from '../../shared/photo/region-stats.js';
import type { RegionMask } from '../../shared/photo/region.js';

/** Bytes of raw pixels read at once (our own): bounds memory whatever the region's size. */
const BAND_BYTES = 16 * 1024 * 1024;

/**
 * Tallies a region's pixels from the upright derivative (tiled TIFF): each band of rows is one
 * `extract().raw()` of the region's bounding box, so only the tiles under the region are decoded.
 * (sharp's `stats()` would describe the whole image, not the extract.)
 */
export async function tallyFromFile(file: string, mask: RegionMask): Promise<RegionTally> {
  const acc = new RegionAccumulator(mask.count);
  const bandRows = Math.max(1, Math.floor(BAND_BYTES / (3 * mask.width)));
  const bottom = mask.top + mask.height;
  for (let top = mask.top; top < bottom; top += bandRows) {
    const rows = Math.min(bandRows, bottom - top);
    const { data, info } = await sharp(file, { limitInputPixels: false })
      .extract({ left: mask.left, top, width: mask.width, height: rows })
      .raw()
      .toBuffer({ resolveWithObject: true });
    acc.addFrom(mask, data, { left: mask.left, top, width: mask.width, rows, channels: info.channels });
  }
  return acc.tally();
}
