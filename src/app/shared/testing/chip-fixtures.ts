import type { ChipDto, ReferenceSetSummary } from '../../../../shared/api/reference-set-answers.js';
import { displayHex } from '../../../../shared/colour/display-hex.js';
import { chipName } from '../../../../shared/colour/chip-name.js';
import { labFromTuple } from '../../../../shared/colour/lab.js';

/** An invented chip whose hex and name are its own CIELAB's (and its parent's), as in a real set. */
function chip(code: string, parent: string | null, lab: [number, number, number], parentLab: [number, number, number] | null = null): ChipDto {
  const shown = displayHex(labFromTuple(lab));
  return { code, parent, name: chipName(labFromTuple(lab), parentLab && labFromTuple(parentLab)), lab, hex: shown.hex, inGamut: shown.inGamut };
}

/** A tiny invented set for specs: two field chips, three fine chips. */
export const TEST_CHIPS: ChipDto[] = [
  chip('F-001', null, [45, 40, 20]),
  chip('F-001.001', 'F-001', [46, 41, 21], [45, 40, 20]),
  chip('F-001.002', 'F-001', [44, 38, 18], [45, 40, 20]),
  chip('F-002', null, [50, -40, 30]),
  chip('F-002.001', 'F-002', [51, -41, 31], [50, -40, 30]),
];

/** Two sets, the newer current. */
export const TEST_SETS: ReferenceSetSummary[] = [
  { id: 'v2', name: 'Set 2', version: 2, white: 'D65', observer: '2°', fieldChips: 2, fineChips: 3, current: true },
  { id: 'v1', name: 'Set 1', version: 1, white: 'D65', observer: '2°', fieldChips: 1, fineChips: 0, current: false },
];
