// What a chip looks like to observers with the common colour-vision deficiencies, through culori's
// filters: Machado, Oliveira & Fernandes (2009), "A physiologically-based model for simulation of
// color vision deficiency", IEEE TVCG 15(6):1291–1298 (culori applies their matrices to sRGB).
import { clampRgb, converter, filterDeficiencyDeuter, filterDeficiencyProt, filterDeficiencyTrit, formatHex, type Color } from 'culori';

import { LAB_MODE } from '../../../../../shared/colour/constants.js';
import { deltaE00 } from '../../../../../shared/colour/delta-e.js';
import { fromCulori, type Lab } from '../../../../../shared/colour/lab.js';

/** Normal vision and the three dichromacies the filters model. */
export const VISION_KINDS = ['normal', 'protanopia', 'deuteranopia', 'tritanopia'] as const;
export type VisionKind = (typeof VISION_KINDS)[number];

/** Plain words for each kind, naming the cone type that is missing (or weak, below full severity). */
export const VISION_LABELS: Readonly<Record<VisionKind, { name: string; cones: string }>> = {
  normal: { name: 'Normal colour vision', cones: 'all three cone types' },
  protanopia: { name: 'Protanopia', cones: 'long-wave ("red") cones missing or weak' },
  deuteranopia: { name: 'Deuteranopia', cones: 'medium-wave ("green") cones missing or weak' },
  tritanopia: { name: 'Tritanopia', cones: 'short-wave ("blue") cones missing or weak' },
};

const toLab = converter(LAB_MODE);

/** A filter for one kind at a severity 0…1 (culori snaps it to steps of 0.1). */
function filterFor(kind: VisionKind, severity: number): (colour: Color) => Color {
  switch (kind) {
    case 'protanopia':
      return filterDeficiencyProt(severity) as (colour: Color) => Color;
    case 'deuteranopia':
      return filterDeficiencyDeuter(severity) as (colour: Color) => Color;
    case 'tritanopia':
      return filterDeficiencyTrit(severity) as (colour: Color) => Color;
    default:
      return (colour) => colour;
  }
}

/** A display colour as simulated: its hex, and its CIELAB for ΔE00 between simulated colours. */
export interface SimulatedColour {
  hex: string;
  lab: Lab;
}

/** The display hex `hex` as an observer of `kind` would see it, clamped into sRGB. */
export function simulate(hex: string, kind: VisionKind, severity = 1): SimulatedColour {
  const seen = clampRgb(filterFor(kind, severity)(hex as unknown as Color));
  return { hex: formatHex(seen), lab: fromCulori(toLab(seen)) };
}

/** How far apart two display colours are (ΔE00) once both pass through the same filter. */
export function simulatedDistance(hexA: string, hexB: string, kind: VisionKind, severity = 1): number {
  return deltaE00(simulate(hexA, kind, severity).lab, simulate(hexB, kind, severity).lab);
}
