import type { ChipIndex } from '../shared/colour/chip-index.js';
import { isInSrgbGamut } from '../shared/colour/display-hex.js';
import type { Lab } from '../shared/colour/lab.js';
import { mulberry32 } from '../shared/random/mulberry32.js';
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

/**
 * The CIELAB box that holds the whole sRGB gamut (D65): L* 0–100, a* −90…100, b* −110…100 (sRGB
 * reaches about a* −86…98, b* −108…95; computed with culori from the cube's corners and edges).
 */
const GAMUT_BOX = { a: [-90, 100], b: [-110, 100] } as const;

/**
 * A seeded sample uniform in CIELAB volume over the whole sRGB gamut: points drawn uniformly in
 * the box around the gamut, kept when inside sRGB.
 */
export function sampleGamut(count: number, seed: number): Lab[] {
  const random = mulberry32(seed);
  const samples: Lab[] = [];
  const [a0, a1] = GAMUT_BOX.a;
  const [b0, b1] = GAMUT_BOX.b;
  while (samples.length < count) {
    const lab = { l: 100 * random(), a: a0 + random() * (a1 - a0), b: b0 + random() * (b1 - b0) };
    if (isInSrgbGamut(lab)) samples.push(lab);
  }
  return samples;
}

/** Nearest-chip ΔE00 over any sample, summarised under `id`. */
export function coverageOfSample(index: ChipIndex, id: string, samples: readonly Lab[]): CoverageStats {
  const distances = samples.map((lab) => index.nearest(lab, 1)[0].deltaE).sort((x, y) => x - y);
  return { regionId: id, samples: distances.length, p50: percentile(distances, 0.5), p99: percentile(distances, 0.99), max: distances[distances.length - 1] };
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
