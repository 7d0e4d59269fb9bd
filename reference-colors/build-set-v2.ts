import { readFileSync } from 'node:fs';
import { chipName, pickerOrder } from '../shared/colour/chip-name.js';
import { OBSERVER_NAME, WHITE_NAME } from '../shared/colour/constants.js';
import { displayHex } from '../shared/colour/display-hex.js';
import { labFromTuple, labToLch, type Lab } from '../shared/colour/lab.js';
import { FIELD_CODE_PATTERN, type ReferenceSetFile } from '../shared/colour/reference-set.js';
import { fieldChipPositions, type FieldChipSettings } from './field-chips.js';
import { latticePoints } from './lattice-v2.js';
import { distinct, fineUnderField, numberChips, roundLab, type ChipMaker } from './set-assembly.js';
import { inTissueRegion, TISSUE_REGIONS_V2 } from '../shared/colour/tissue-regions.js';

/** Identity of set v2. A later change is a new id and file, never an edit of this one. */
export const SET_V2_IDENTITY = {
  id: 'v2',
  version: 2,
  name: 'Hueledger reference set, version 2',
  generatedBy: 'reference-colors/generate-v2.ts',
} as const;

/** The published v1 file, read only to number v2's field chips after its last (codes are never reused). */
const V1_FILE = new URL('./reference-set-v1.json', import.meta.url);

/**
 * Settings of v2 (our own). The edges are in warped units (≈ ΔE00); a BCC lattice of edge e leaves
 * no colour farther than 0.559·e from a point in the warped space, and the warp's error puts the
 * measured ΔE00 figures a little above that (reference-colors/README.md has them).
 */
export const SET_V2 = {
  /** Fine lattice in and around the tissue regions: p99 ≈ 1.13 there, under the 1.2 asked. */
  tissueEdge: 2.1,
  /** Fine lattice everywhere else in the gamut: p99 ≈ 1.38 and max ≈ 1.62, under 1.5 and 1.8. */
  otherEdge: 2.6,
  /** The second lattice starts half a step off the first so that the two never share a point. */
  otherOffset: [0.5, 0.5, 0.5] as const,
  field: { seed: 0x46494532, candidates: 40000, tissueSpacing: 7.6, otherSpacing: 9.6 } satisfies FieldChipSettings,
} as const;

function inTissue(lab: Lab): boolean {
  const lch = labToLch(lab);
  return TISSUE_REGIONS_V2.some((region) => inTissueRegion(lch, region));
}

/** The highest field number v1 published: v2's field chips are numbered after it. */
export function lastV1FieldNumber(): number {
  const v1 = JSON.parse(readFileSync(V1_FILE, 'utf8')) as ReferenceSetFile;
  return Math.max(...v1.chips.filter((c) => FIELD_CODE_PATTERN.test(c.code)).map((c) => Number(c.code.slice(2))));
}

/** The fine-chip positions of v2 (CIELAB D65, unrounded): the tissue lattice, then the other. */
export function fineChipsV2(): Lab[] {
  return [
    ...latticePoints(SET_V2.tissueEdge, inTissue),
    ...latticePoints(SET_V2.otherEdge, (lab) => !inTissue(lab), SET_V2.otherOffset),
  ];
}

/**
 * The whole of set v2. As in v1, everything after rounding is computed from the rounded CIELAB
 * the file holds: parents (nearest field chip by ΔE00, ties to the earlier code), order within a
 * parent (`pickerOrder`), names (`chipName`), hex and gamut flag.
 */
export function buildReferenceSetV2(): ReferenceSetFile {
  const field = distinct(fieldChipPositions(SET_V2.field, TISSUE_REGIONS_V2).map(roundLab)).sort(pickerOrder);
  const byParent = fineUnderField(field, fineChipsV2());
  const chip: ChipMaker = (code, parent, lab, parentLab) => {
    const shown = displayHex(labFromTuple(lab));
    return { code, parent, name: chipName(labFromTuple(lab), parentLab && labFromTuple(parentLab)), lab, hex: shown.hex, inGamut: shown.inGamut };
  };
  const chips = numberChips(field, byParent, lastV1FieldNumber() + 1, pickerOrder, chip);
  return { ...SET_V2_IDENTITY, white: WHITE_NAME, observer: OBSERVER_NAME, chips };
}
