// The approximate reading shown while drawing: the same rules as the server, run on the display
// copy (smaller, 8-bit JPEG) in a canvas. The server's answer is the one a reading keeps.
import { displayHex } from '../../../../../shared/colour/display-hex.js';
import { labToTuple, type LabTuple } from '../../../../../shared/colour/lab.js';
import { applyMatrix, diagonal, linearToLab, tallyRegion, trimmedLinearMean, vonKriesGains } from '../../../../../shared/photo/region-stats.js';
import { rasteriseRegion, scaleRegion, type Region } from '../../../../../shared/photo/region.js';

/** RGBA pixels of the display copy (a canvas `ImageData` or the like). */
export interface Pixels {
  data: ArrayLike<number>;
  width: number;
  height: number;
}

/** What the preview shows. */
export interface Preview {
  lab: LabTuple;
  hex: string;
  /** Display-copy pixels used (fewer than the server will use on the full photo). */
  pixelCount: number;
  /** Whether a grey card was applied. */
  balanced: boolean;
}

/** The preview of a region (in upright photo pixels), balanced on a card region when given; null when nothing usable. */
export function previewRegion(pixels: Pixels, photoWidth: number, region: Region, card: Region | null = null): Preview | null {
  const tissue = linearMeanOf(pixels, photoWidth, region);
  if (!tissue) return null;
  const cardMean = card ? linearMeanOf(pixels, photoWidth, card) : null;
  const mean = cardMean ? applyMatrix(diagonal(vonKriesGains(cardMean.mean)), tissue.mean) : tissue.mean;
  const lab = linearToLab(mean);
  return { lab: labToTuple(lab), hex: displayHex(lab).hex, pixelCount: tissue.kept, balanced: cardMean !== null };
}

function linearMeanOf(pixels: Pixels, photoWidth: number, region: Region) {
  try {
    const mask = rasteriseRegion(scaleRegion(region, pixels.width / photoWidth), pixels.width, pixels.height);
    const tally = tallyRegion(mask, pixels.data, { left: 0, top: 0, width: pixels.width, rows: pixels.height, channels: 4 });
    const mean = trimmedLinearMean(tally);
    return mean ? { mean, kept: tally.kept } : null;
  } catch {
    // Too small to hold a pixel of the display copy yet, or at its edge: no preview.
    return null;
  }
}
