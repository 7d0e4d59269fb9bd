import type { ChipIndex } from '../shared/colour/chip-index.js';
import { isInSrgbGamut } from '../shared/colour/display-hex.js';
import { labToLch, type Lab } from '../shared/colour/lab.js';
import { mulberry32 } from './prng.js';
import { inTissueRegion, type TissueRegion } from './tissue-regions.js';

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
 * A seeded sample uniform in CIELAB volume over the part of `region` inside the sRGB gamut:
 * L* uniform on the region's range, (a*, b*) uniform on the square around its largest chroma, kept
 * when the colour is in the region and in gamut.
 */
export function sampleRegion(region: TissueRegion, count: number, seed: number): Lab[] {
  const random = mulberry32(seed);
  const samples: Lab[] = [];
  const [l0, l1] = region.l;
  const cMax = region.c[1];
  for (let tries = 0; samples.length < count; tries++) {
    if (tries > count * 1000) throw new Error(`region ${region.id} barely meets the sRGB gamut`);
    const lab = { l: l0 + random() * (l1 - l0), a: (2 * random() - 1) * cMax, b: (2 * random() - 1) * cMax };
    if (inTissueRegion(labToLch(lab), region) && isInSrgbGamut(lab)) samples.push(lab);
  }
  return samples;
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
