import { differenceCiede2000, type Lab65 } from 'culori';
import { CHIP_INDEX_BOUND_SLACK, CHIP_INDEX_LEAF_SIZE, CIEDE2000_K, LAB_MODE } from './constants.js';
import { lowerBoundRaw } from './delta-e-bound.js';
import { KBest } from './k-best.js';
import type { Lab } from './lab.js';

/** One answer of a nearest-chip search: the chip's position in the indexed list and its ΔE00. */
export interface Neighbour {
  index: number;
  deltaE: number;
}

/** Counters a search fills in, for the benchmark. */
export interface SearchStats {
  /** Tree cells whose contents were looked at. */
  cellsOpened: number;
  /** ΔE00 values computed with culori. */
  differencesComputed: number;
}

/** Exact nearest-chip search by ΔE00 over a fixed list of CIELAB colours. */
export interface ChipIndex {
  readonly size: number;
  /**
   * The `k` chips with the smallest ΔE00 from `query` (fewer if the list is shorter), smallest
   * first; equal differences are ordered by list position, exactly as a full scan sorts them.
   */
  nearest(query: Lab, k: number, stats?: SearchStats): Neighbour[];
}

/*
 * A k-d tree over the chips in CIELAB. Each node keeps the tight bounding box of its chips; a
 * search walks the tree nearer child first and skips any node whose ΔE00 lower bound
 * (delta-e-bound.ts) is larger than the k-th best ΔE00 found so far. Because the bound never
 * exceeds the true ΔE00 of any chip in the box, a skipped node cannot hold a chip that belongs in
 * the answer: the result equals a brute-force scan, ties included. Leaves check the same bound per
 * chip before paying for culori's ΔE00.
 */

const ciede2000 = differenceCiede2000(CIEDE2000_K.l, CIEDE2000_K.c, CIEDE2000_K.h);

/**
 * Split-axis weights: a unit of L* moves ΔE00 far more than a unit of a* or b* (S_C grows with
 * chroma while S_L stays near 1), so lightness splits prune best. A speed setting only.
 */
const AXIS_WEIGHT = [1, 0.35, 0.35] as const;

interface Tree {
  /** Chip positions in tree order. */
  order: Int32Array;
  /** L, a, b, C per chip in tree order. */
  coords: Float64Array;
  colours: Lab65[];
  /** Per node: lMin, lMax, aMin, aMax, bMin, bMax. */
  boxes: Float64Array;
  /** Per node: first chip, one past the last chip (tree order). */
  ranges: Int32Array;
  /** Per node: left and right child, −1 for a leaf. */
  children: Int32Array;
}

function buildTree(labs: readonly Lab[], leafSize: number): Tree {
  const n = labs.length;
  const order = Int32Array.from({ length: n }, (_, i) => i);
  const boxes: number[] = [];
  const ranges: number[] = [];
  const children: number[] = [];
  const axisValue = (i: number, axis: number) => (axis === 0 ? labs[i].l : axis === 1 ? labs[i].a : labs[i].b);

  const build = (start: number, end: number): number => {
    const node = ranges.length / 2;
    const box = [Infinity, -Infinity, Infinity, -Infinity, Infinity, -Infinity];
    for (let p = start; p < end; p++) {
      for (let axis = 0; axis < 3; axis++) {
        const v = axisValue(order[p], axis);
        if (v < box[2 * axis]) box[2 * axis] = v;
        if (v > box[2 * axis + 1]) box[2 * axis + 1] = v;
      }
    }
    boxes.push(...box);
    ranges.push(start, end);
    children.push(-1, -1);
    if (end - start <= leafSize) return node;
    let axis = 0;
    for (let a = 1; a < 3; a++) {
      if ((box[2 * a + 1] - box[2 * a]) * AXIS_WEIGHT[a] > (box[2 * axis + 1] - box[2 * axis]) * AXIS_WEIGHT[axis]) axis = a;
    }
    const slice = Array.from(order.subarray(start, end)).sort((i, j) => axisValue(i, axis) - axisValue(j, axis) || i - j);
    order.set(slice, start);
    const mid = start + ((end - start) >> 1);
    children[node * 2] = build(start, mid);
    children[node * 2 + 1] = build(mid, end);
    return node;
  };
  if (n > 0) build(0, n);

  const coords = new Float64Array(n * 4);
  const colours: Lab65[] = [];
  order.forEach((i, p) => {
    const { l, a, b } = labs[i];
    coords.set([l, a, b, Math.sqrt(a * a + b * b)], p * 4);
    colours.push({ mode: LAB_MODE, l, a, b });
  });
  return { order, coords, colours, boxes: Float64Array.from(boxes), ranges: Int32Array.from(ranges), children: Int32Array.from(children) };
}

/** Builds the index over `labs` (CIELAB D65); positions in answers refer to this list. */
export function createChipIndex(labs: readonly Lab[], leafSize: number = CHIP_INDEX_LEAF_SIZE): ChipIndex {
  if (!Number.isInteger(leafSize) || leafSize < 1) throw new RangeError(`leafSize must be a positive integer, got ${leafSize}`);
  const tree = buildTree(labs, leafSize);
  const { order, coords, colours, boxes, ranges, children } = tree;
  const keep = 1 - CHIP_INDEX_BOUND_SLACK;

  const nodeBound = (node: number, ql: number, qa: number, qb: number, qc: number) => {
    const o = node * 6;
    return lowerBoundRaw(ql, qa, qb, qc, boxes[o], boxes[o + 1], boxes[o + 2], boxes[o + 3], boxes[o + 4], boxes[o + 5]);
  };

  const nearest = (query: Lab, k: number, stats?: SearchStats): Neighbour[] => {
    if (!Number.isInteger(k) || k < 1) throw new RangeError(`k must be a positive integer, got ${k}`);
    if (labs.length === 0) return [];
    const { l: ql, a: qa, b: qb } = query;
    const qc = Math.sqrt(qa * qa + qb * qb);
    const probe: Lab65 = { mode: LAB_MODE, l: ql, a: qa, b: qb };
    const best = new KBest(Math.min(k, labs.length));
    const stack: number[] = [0];
    const stackBound: number[] = [nodeBound(0, ql, qa, qb, qc)];
    while (stack.length > 0) {
      const node = stack.pop()!;
      const bound = stackBound.pop()!;
      if (bound * keep > best.worst) continue;
      const left = children[node * 2];
      if (left < 0) {
        if (stats) stats.cellsOpened++;
        for (let p = ranges[node * 2]; p < ranges[node * 2 + 1]; p++) {
          const o = p * 4;
          const c = coords;
          const pointBound = lowerBoundRaw(ql, qa, qb, qc, c[o], c[o], c[o + 1], c[o + 1], c[o + 2], c[o + 2]);
          if (pointBound * keep > best.worst) continue;
          if (stats) stats.differencesComputed++;
          best.offer(ciede2000(probe, colours[p]), order[p]);
        }
        continue;
      }
      const right = children[node * 2 + 1];
      const leftBound = nodeBound(left, ql, qa, qb, qc);
      const rightBound = nodeBound(right, ql, qa, qb, qc);
      // Push the farther child first so the nearer one is opened next.
      if (leftBound <= rightBound) {
        stack.push(right, left);
        stackBound.push(rightBound, leftBound);
      } else {
        stack.push(left, right);
        stackBound.push(leftBound, rightBound);
      }
    }
    return best.deltaE.map((deltaE, i) => ({ index: best.index[i], deltaE }));
  };

  return { size: labs.length, nearest };
}
