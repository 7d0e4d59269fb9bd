import type { ChipIndex, Neighbour } from './chip-index.js';
import { differenceCiede2000 } from 'culori';
import { CIEDE2000_K } from './constants.js';
import { KBest } from './k-best.js';
import { toCulori, type Lab } from './lab.js';
import { verdictFor, type Verdict } from './verdict.js';

const ciede2000 = differenceCiede2000(CIEDE2000_K.l, CIEDE2000_K.c, CIEDE2000_K.h);

/** A chip near a reading, with its ΔE00 and the plain-words verdict. */
export interface ChipMatch<T> {
  chip: T;
  deltaE: number;
  verdict: Verdict;
}

/**
 * A full scan: every chip's ΔE00 from the query computed with culori, the k smallest kept, ties
 * by list position. The reference the chip index is tested and benchmarked against; too slow for
 * requests.
 */
export function createScan(labs: readonly Lab[]): (query: Lab, k: number) => Neighbour[] {
  const colours = labs.map(toCulori);
  return (query, k) => {
    if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a positive integer, got ${k}`);
    const probe = toCulori(query);
    const best = new KBest(Math.min(k, colours.length));
    colours.forEach((colour, index) => best.offer(ciede2000(probe, colour), index));
    return best.deltaE.map((deltaE, i) => ({ index: best.index[i], deltaE }));
  };
}

/** One-off full scan (see `createScan`). */
export function scanNearest(labs: readonly Lab[], query: Lab, k: number): Neighbour[] {
  return createScan(labs)(query, k);
}

/** The `k` chips nearest `query` by ΔE00, through the index built over `chips` (same order). */
export function nearestChips<T>(index: ChipIndex, chips: readonly T[], query: Lab, k: number): ChipMatch<T>[] {
  if (index.size !== chips.length) throw new RangeError('the index was built over a different chip list');
  return index.nearest(query, k).map(({ index: i, deltaE }) => ({ chip: chips[i], deltaE, verdict: verdictFor(deltaE) }));
}
