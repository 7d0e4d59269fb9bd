// Practice targets: random colours from the plant-tissue regions the reference set is densest in,
// seeded so a round can be played again (the seed is shown and kept in the address).
import { mulberry32 } from '../../../../../shared/random/mulberry32.js';
import { sampleRegion, TISSUE_REGIONS } from '../../../../../shared/colour/tissue-regions.js';
import { displayHex } from '../../../../../shared/colour/display-hex.js';
import type { Lab } from '../../../../../shared/colour/lab.js';

/** One colour to match by eye. */
export interface PracticeTarget {
  seed: number;
  /** The tissue region it was drawn from, in words ("creams and yellows of corm flesh"). */
  region: string;
  lab: Lab;
  hex: string;
}

/** The target of a seed: a region chosen by the seed, then a colour inside it and inside sRGB. */
export function practiceTarget(seed: number): PracticeTarget {
  const random = mulberry32(seed);
  const region = TISSUE_REGIONS[Math.floor(random() * TISSUE_REGIONS.length)];
  const [lab] = sampleRegion(region, 1, Math.floor(random() * 0x1_0000_0000));
  return { seed: seed >>> 0, region: region.label, lab, hex: displayHex(lab).hex };
}

/** A fresh seed for a new practice series (not secret: a round only needs to differ from the last). */
export function newSeed(): number {
  return Math.floor(Math.random() * 1_000_000);
}
