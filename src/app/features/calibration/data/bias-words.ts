// An observer's bias (mean picked chip minus reference, [ΔL*, Δa*, Δb*]) in plain words.
import type { LabTuple } from '../../../../../shared/colour/lab.js';
import { formatNumber } from '../../../shared/chips/chip-words';

/**
 * A shift smaller than this (CIELAB units on one axis) is not called a bias. Our own choice: about
 * one unit is commonly taken as a just-noticeable step ("ΔE ≈ 1", common practice, no source).
 */
export const BIAS_NOTICE = 1;
/** From this size on a shift is plain ("lighter"), below it "slightly lighter"; from MARKED_BIAS it is "much lighter" (our own). */
export const PLAIN_BIAS = 3;
export const MARKED_BIAS = 6;

/** The words for each sign of each axis: CIELAB's opponent axes (CIE 15:2004 § 8.2.1). */
const AXIS_WORDS: readonly { positive: string; negative: string }[] = [
  { positive: 'lighter', negative: 'darker' },
  { positive: 'redder', negative: 'greener' },
  { positive: 'yellower', negative: 'bluer' },
];

/** One axis's shift in words ("slightly bluer"), or null when it is below the notice level. */
export function shiftWords(axis: 0 | 1 | 2, shift: number): string | null {
  const size = Math.abs(shift);
  if (!(size >= BIAS_NOTICE)) return null;
  const word = shift > 0 ? AXIS_WORDS[axis].positive : AXIS_WORDS[axis].negative;
  if (size >= MARKED_BIAS) return `much ${word}`;
  return size >= PLAIN_BIAS ? word : `slightly ${word}`;
}

/**
 * The bias as a sentence: "reads lighter and slightly bluer than the reference", the largest shift
 * first; "no clear bias …" when every shift is below BIAS_NOTICE; "no answers yet" for null.
 */
export function biasWords(bias: LabTuple | null): string {
  if (!bias) return 'no answers yet';
  const parts = ([0, 1, 2] as const)
    .map((axis) => ({ size: Math.abs(bias[axis]), words: shiftWords(axis, bias[axis]) }))
    .filter((p): p is { size: number; words: string } => p.words !== null)
    .sort((x, y) => y.size - x.size)
    .map((p) => p.words);
  if (!parts.length) return `no clear bias: every shift is under ${BIAS_NOTICE} CIELAB unit`;
  return `reads ${joinWords(parts)} than the reference`;
}

/** "ΔL* +2.30, Δa* −0.40, Δb* −3.10": the same bias as signed numbers. */
export function biasNumbers(bias: LabTuple): string {
  const signed = (v: number) => (v > 0 && Number(v.toFixed(2)) !== 0 ? `+${formatNumber(v, 2)}` : formatNumber(v, 2));
  return `ΔL* ${signed(bias[0])}, Δa* ${signed(bias[1])}, Δb* ${signed(bias[2])}`;
}

function joinWords(parts: string[]): string {
  if (parts.length === 1) return parts[0];
  return `${parts.slice(0, -1).join(', ')} and ${parts.at(-1)}`;
}
