import { OBSERVER_NAME, WHITE_NAME } from '../shared/colour/constants.js';
import { displayHex } from '../shared/colour/display-hex.js';
import { labFromTuple, labToLch, type LabTuple } from '../shared/colour/lab.js';
import type { ReferenceChip, ReferenceSetFile } from '../shared/colour/reference-set.js';
import { fieldChipPositions } from './field-chips.js';
import { fineLatticeChips } from './fine-lattice.js';
import { distinct, fineUnderField, numberChips, roundLab } from './set-assembly.js';
import { v1HueFamilyOfLch, V1_HUE_FAMILY_ORDER, v1StoredName } from './v1-names.js';

/** Identity of the set this generator writes. A new version is a new id and file, never an edit. */
export const SET_IDENTITY = {
  id: 'v1',
  version: 1,
  name: 'Hueledger reference set, version 1',
  generatedBy: 'reference-colors/generate.ts',
} as const;

/**
 * Card order: v1's hue family (V1_HUE_FAMILY_ORDER), then lightness from light to dark, then chroma from
 * vivid to grey, then hue angle, then the raw numbers so that no two chips tie.
 */
function cardOrder(p: LabTuple, q: LabTuple): number {
  const lp = labToLch(labFromTuple(p));
  const lq = labToLch(labFromTuple(q));
  return (
    V1_HUE_FAMILY_ORDER.indexOf(v1HueFamilyOfLch(lp)) - V1_HUE_FAMILY_ORDER.indexOf(v1HueFamilyOfLch(lq)) ||
    q[0] - p[0] ||
    lq.c - lp.c ||
    lp.h - lq.h ||
    p[1] - q[1] ||
    p[2] - q[2]
  );
}

function chip(code: string, parent: string | null, lab: LabTuple): ReferenceChip {
  const display = displayHex(labFromTuple(lab));
  return { code, parent, name: v1StoredName(labFromTuple(lab)), lab, hex: display.hex, inGamut: display.inGamut };
}

/**
 * The whole reference set. Everything after rounding is computed from the rounded CIELAB the file
 * holds, so each chip's parent, name, hex and gamut flag agree with its stored numbers.
 */
export function buildReferenceSet(): ReferenceSetFile {
  const field = distinct(fieldChipPositions().map(roundLab)).sort(cardOrder);
  const byParent = fineUnderField(field, fineLatticeChips());
  const chips = numberChips(field, byParent, 1, cardOrder, chip);
  return { ...SET_IDENTITY, white: WHITE_NAME, observer: OBSERVER_NAME, chips };
}

/**
 * The file's text: fixed key order, every CIELAB number with two decimals, one chip per line,
 * chips in code order (each field chip followed by its fine chips), a final newline.
 */
export function formatReferenceSet(set: ReferenceSetFile): string {
  const fixed = (v: number) => {
    const s = v.toFixed(2);
    return s === '-0.00' ? '0.00' : s;
  };
  const chipLine = (c: ReferenceChip) =>
    `    {"code":${JSON.stringify(c.code)},"parent":${JSON.stringify(c.parent)},"name":${JSON.stringify(c.name)},` +
    `"lab":[${c.lab.map(fixed).join(',')}],"hex":${JSON.stringify(c.hex)},"inGamut":${c.inGamut}}`;
  const head = [
    `  "id": ${JSON.stringify(set.id)}`,
    `  "version": ${set.version}`,
    `  "name": ${JSON.stringify(set.name)}`,
    `  "white": ${JSON.stringify(set.white)}`,
    `  "observer": ${JSON.stringify(set.observer)}`,
    `  "generatedBy": ${JSON.stringify(set.generatedBy)}`,
  ];
  return `{\n${head.join(',\n')},\n  "chips": [\n${set.chips.map(chipLine).join(',\n')}\n  ]\n}\n`;
}
