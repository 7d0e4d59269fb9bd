/*
 * What every body-centred cubic (BCC) lattice of the generators shares, counted in half-edges: the
 * points whose three integer coordinates are all even or all odd. With cube edge e every point of
 * space is within e·√5/4 ≈ 0.559·e of a lattice point (Bambah 1954; Conway & Sloane, "Sphere
 * Packings, Lattices and Groups", ch. 2 — both cited from memory). Used by v1's fine-lattice.ts and
 * v2's lattice-v2.ts alike.
 */

/** Covering radius of the BCC lattice as a fraction of its cube edge, √5/4. */
export const COVERING_FRACTION = Math.sqrt(5) / 4;

/** Largest |y|, |z| in warped units: beyond the chroma of any sRGB colour. */
export const CHROMA_REACH = 48;

/** The 14 nearest-neighbour directions of the BCC lattice, in half-edge steps: (±1, ±1, ±1) and (±2, 0, 0) and permutations. */
export const BCC_STEPS: readonly (readonly [number, number, number])[] = [
  ...[-1, 1].flatMap((i) => [-1, 1].flatMap((j) => [-1, 1].map((k) => [i, j, k] as const))),
  [2, 0, 0],
  [-2, 0, 0],
  [0, 2, 0],
  [0, -2, 0],
  [0, 0, 2],
  [0, 0, -2],
];
