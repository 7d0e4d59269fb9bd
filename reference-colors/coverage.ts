import type { ChipIndex } from '../shared/colour/chip-index.js';
import type { Lab } from '../shared/colour/lab.js';
import type { TissueRegion } from '../shared/colour/tissue-regions.js';

/** How the coverage of a region is measured (our own sample size and seed). */
export const COVERAGE_SAMPLE = {
  /** Colours drawn per region, all inside the region and the sRGB gamut. */
  perRegion: 20000,
  seed: 0x434f5652,
} as const;

/** Nearest-chip ΔE00 over a region's sample. */
export interface CoverageStats {
  regionId: string;
  samples: number;
  p50: number;
  p99: number;
  max: number;
}

/** Nearest-rank percentile of sorted values: the ⌈p·n⌉-th smallest. */
export function percentile(sorted: readonly number[], p: number): number {
  return sorted[Math.max(0, Math.ceil(p * sorted.length) - 1)];
}

/** Distance from each sample to its nearest chip, summarised. */
export function coverageOf(index: ChipIndex, region: TissueRegion, samples: readonly Lab[]): CoverageStats {
  const distances = samples.map((lab) => index.nearest(lab, 1)[0].deltaE).sort((x, y) => x - y);
  return {
    regionId: region.id,
    samples: distances.length,
    p50: percentile(distances, 0.5),
    p99: percentile(distances, 0.99),
    max: distances[distances.length - 1],
  };
}

/** Moved to shared/colour/tissue-regions.ts; re-exported for the match benchmark's import. */
export { sampleRegion } from '../shared/colour/tissue-regions.js';
