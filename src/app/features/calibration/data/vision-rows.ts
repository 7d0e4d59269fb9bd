// The rows of the colour-vision preview: a centre colour and its nearest chips, as each kind of
// observer sees them, with the ΔE00 between the centre and each neighbour once simulated.
import type { ChipDto } from '../../../../../shared/api/reference-set-answers.js';
import { ACCEPTABILITY_THRESHOLD_DE00 } from '../../../../../shared/colour/constants.js';
import { deltaE00 } from '../../../../../shared/colour/delta-e.js';
import { displayHex } from '../../../../../shared/colour/display-hex.js';
import { labFromTuple, type Lab } from '../../../../../shared/colour/lab.js';
import { formatNumber } from '../../../shared/chips/chip-words';
import { simulate, VISION_KINDS, VISION_LABELS, type VisionKind } from './vision-simulation';

/** One neighbour as seen by one kind of observer. */
export interface SeenNeighbour {
  code: string;
  hex: string;
  /** ΔE00 from the centre with normal vision (display colours) and as simulated. */
  normalDeltaE00: number;
  seenDeltaE00: number;
  /** Whether a pair a normal eye tells apart (ΔE00 above the acceptability threshold) falls within it. */
  merges: boolean;
}

/** One kind of observer's row. */
export interface VisionRow {
  kind: VisionKind;
  centreHex: string;
  neighbours: SeenNeighbour[];
  /** What the row means for matching, in one sentence. */
  sentence: string;
}

/** The centre of the preview: a chip or a specimen's reference colour. */
export interface VisionCentre {
  label: string;
  lab: Lab;
}

/** The four rows for a centre and its neighbour chips at a severity 0…1. */
export function visionRows(centre: VisionCentre, neighbours: readonly ChipDto[], severity: number): VisionRow[] {
  const centreHex = displayHex(centre.lab).hex;
  const normalCentre = simulate(centreHex, 'normal').lab;
  return VISION_KINDS.map((kind) => {
    const seenCentre = simulate(centreHex, kind, severity);
    const seen = neighbours.map((chip): SeenNeighbour => {
      const normalDeltaE00 = deltaE00(normalCentre, simulate(chip.hex, 'normal').lab);
      const other = simulate(chip.hex, kind, severity);
      const seenDeltaE00 = deltaE00(seenCentre.lab, other.lab);
      return { code: chip.code, hex: other.hex, normalDeltaE00, seenDeltaE00, merges: normalDeltaE00 > ACCEPTABILITY_THRESHOLD_DE00 && seenDeltaE00 <= ACCEPTABILITY_THRESHOLD_DE00 };
    });
    return { kind, centreHex: seenCentre.hex, neighbours: seen, sentence: sentenceFor(kind, centre.label, seen) };
  });
}

function sentenceFor(kind: VisionKind, label: string, seen: SeenNeighbour[]): string {
  if (kind === 'normal') return `With normal vision these are the display colours of ${label} and its ${seen.length} nearest chips.`;
  const merged = seen.filter((n) => n.merges);
  const name = VISION_LABELS[kind].name.toLowerCase();
  if (!merged.length) return `With ${name} no neighbour falls within ΔE00 ${ACCEPTABILITY_THRESHOLD_DE00} of ${label} that did not already: matching here should hold up.`;
  const worst = merged.reduce((a, b) => (b.seenDeltaE00 < a.seenDeltaE00 ? b : a));
  return (
    `With ${name}, ${merged.length} of ${seen.length} neighbours that a normal eye tells apart look nearly the same as ${label} ` +
    `(${worst.code}: ΔE00 ${formatNumber(worst.normalDeltaE00, 1)} becomes ${formatNumber(worst.seenDeltaE00, 1)}), so an observer with it may pick any of them.`
  );
}

/** The chip's own CIELAB as a centre. */
export function chipCentre(chip: ChipDto): VisionCentre {
  return { label: chip.code, lab: labFromTuple(chip.lab) };
}
