import { createChipIndex } from '../shared/colour/chip-index.js';
import { labFromTuple, type Lab, type LabTuple } from '../shared/colour/lab.js';
import type { ReferenceChip } from '../shared/colour/reference-set.js';

/*
 * The steps every set generator takes once its field and fine chip positions are chosen: round to
 * what the file stores, drop repeats, put each fine chip under its nearest field chip, and number
 * the chips. Each set keeps its own order and naming (passed in), so the published files stay
 * byte for byte what they were.
 */

/** Largest number of chips a three-digit code can count. */
const CODE_CAPACITY = 999;

/** Rounds to two decimals as the file stores them (−0 written as 0). */
function round2(v: number): number {
  const r = Math.round(v * 100) / 100;
  return r === 0 ? 0 : r;
}

/** A CIELAB colour rounded as the file stores it. */
export function roundLab(lab: Lab): LabTuple {
  return [round2(lab.l), round2(lab.a), round2(lab.b)];
}

/** A chip number as three digits; more than a code can count is an error, never a longer code. */
function pad3(n: number): string {
  if (n > CODE_CAPACITY) throw new Error(`more than ${CODE_CAPACITY} chips in one group`);
  return String(n).padStart(3, '0');
}

/** Removes repeats of the same rounded CIELAB, keeping the first. */
export function distinct(tuples: LabTuple[]): LabTuple[] {
  const seen = new Set<string>();
  return tuples.filter((t) => {
    const key = t.join(',');
    if (seen.has(key)) return false;
    seen.add(key);
    return true;
  });
}

/**
 * The fine chips (rounded, repeats and field chips' own positions left out) under their parents:
 * entry f holds the fine chips whose nearest field chip by ΔE00 is field[f] (ties: the earlier).
 */
export function fineUnderField(field: readonly LabTuple[], fine: readonly Lab[]): LabTuple[][] {
  const fieldKeys = new Set(field.map((t) => t.join(',')));
  const rounded = distinct(fine.map(roundLab)).filter((t) => !fieldKeys.has(t.join(',')));
  const fieldIndex = createChipIndex(field.map(labFromTuple));
  const byParent: LabTuple[][] = field.map(() => []);
  for (const t of rounded) byParent[fieldIndex.nearest(labFromTuple(t), 1)[0].index].push(t);
  return byParent;
}

/** Builds one chip from its code, its parent's code and CIELAB (null for a field chip) and its own CIELAB. */
export type ChipMaker = (code: string, parent: string | null, lab: LabTuple, parentLab: LabTuple | null) => ReferenceChip;

/**
 * The chips in code order: field chip F-nnn numbered from `firstField` in the order given, each
 * followed by its fine chips F-nnn.001, .002, … in `order`.
 */
export function numberChips(field: readonly LabTuple[], byParent: LabTuple[][], firstField: number, order: (p: LabTuple, q: LabTuple) => number, chip: ChipMaker): ReferenceChip[] {
  const chips: ReferenceChip[] = [];
  field.forEach((lab, f) => {
    const code = `F-${pad3(firstField + f)}`;
    chips.push(chip(code, null, lab, null));
    byParent[f]!.sort(order).forEach((fineLab, i) => chips.push(chip(`${code}.${pad3(i + 1)}`, code, fineLab, lab)));
  });
  return chips;
}
