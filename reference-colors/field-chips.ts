import { converter } from 'culori';
import { LAB_MODE } from '../shared/colour/constants.js';
import { lowerBoundRaw } from '../shared/colour/delta-e-bound.js';
import { deltaE00 } from '../shared/colour/delta-e.js';
import { fromCulori, labToLch, type Lab } from '../shared/colour/lab.js';
import { mulberry32 } from '../shared/random/mulberry32.js';
import { inTissueRegion, TISSUE_REGIONS, type TissueRegion } from '../shared/colour/tissue-regions.js';

/*
 * Field chips by seeded dart throwing (Poisson-disk sampling, Cook 1986): candidates are random
 * sRGB colours in a seeded order, and each is kept when it is at least r away by ΔE00 from every
 * chip kept before it, r smaller inside the tissue regions. Once the candidates are exhausted no
 * colour of the gamut is farther than about r from a field chip, and no two chips are closer than
 * r, so neighbours fall between r and about 1.5·r.
 */

/** Settings of the field chips (our own: the largest density that keeps the card under 200 chips — the whole sRGB gamut is too large in ΔE00 for 200 chips 6 apart). */
export const FIELD_CHIPS = {
  seed: 0x46494531,
  candidates: 40000,
  /** Minimum ΔE00 between field chips when the candidate is a tissue colour. */
  tissueSpacing: 8.3,
  /** Minimum ΔE00 between field chips elsewhere. */
  otherSpacing: 10.2,
} as const;

/** Settings of a dart-throwing run: seed, candidate count and the two spacings. */
export interface FieldChipSettings {
  seed: number;
  candidates: number;
  tissueSpacing: number;
  otherSpacing: number;
}

const toLab65 = converter(LAB_MODE);

/** Field-chip positions (CIELAB D65, unrounded), all inside the sRGB gamut, in acceptance order. */
export function fieldChipPositions(settings: FieldChipSettings = FIELD_CHIPS, regions: readonly TissueRegion[] = TISSUE_REGIONS): Lab[] {
  const random = mulberry32(settings.seed);
  const kept: { lab: Lab; c: number }[] = [];
  for (let n = 0; n < settings.candidates; n++) {
    // Three draws per candidate, in a fixed order, keep the sequence reproducible.
    const lab = fromCulori(toLab65({ mode: 'rgb', r: random(), g: random(), b: random() }));
    const tissue = regions.some((region) => inTissueRegion(labToLch(lab), region));
    const spacing = tissue ? settings.tissueSpacing : settings.otherSpacing;
    const c = Math.hypot(lab.a, lab.b);
    const clear = kept.every(
      (k) =>
        lowerBoundRaw(lab.l, lab.a, lab.b, c, k.lab.l, k.lab.l, k.lab.a, k.lab.a, k.lab.b, k.lab.b) >= spacing ||
        deltaE00(lab, k.lab) >= spacing,
    );
    if (clear) kept.push({ lab, c });
  }
  return kept.map((k) => k.lab);
}
