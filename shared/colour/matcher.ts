import { between, type Between } from './between.js';
import { createChipIndex, type ChipIndex } from './chip-index.js';
import { labFromTuple, type Lab } from './lab.js';
import { nearestChips, type ChipMatch } from './nearest.js';

/** A chip list indexed once and ready to answer match requests. */
export interface Matcher<T> {
  readonly chips: readonly T[];
  readonly index: ChipIndex;
  /** The `k` nearest chips by ΔE00, smallest first. */
  nearest(query: Lab, k: number): ChipMatch<T>[];
  /** The two nearest chips and the reading's position t between them. */
  between(query: Lab): Between<T> | undefined;
}

/** Indexes chips that carry CIELAB D65 as `lab: [L, a, b]` (the reference-set file's form). */
export function createMatcher<T extends { lab: readonly [number, number, number] }>(chips: readonly T[]): Matcher<T> {
  const labs = chips.map((chip) => labFromTuple(chip.lab));
  const index = createChipIndex(labs);
  const labOf = (chip: T) => labFromTuple(chip.lab);
  return {
    chips,
    index,
    nearest: (query, k) => nearestChips(index, chips, query, k),
    between: (query) => between(index, chips, labOf, query),
  };
}
