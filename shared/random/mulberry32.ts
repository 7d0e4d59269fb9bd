/** The step mulberry32 adds to its state before each number. */
export const MULBERRY32_STEP = 0x6d2b79f5;

/**
 * Seeded pseudo-random numbers: mulberry32 (Tommy Ettinger, 2017, public domain), a 32-bit
 * generator small enough to write here. It makes the reference set, the permutation tests'
 * p-values, the demo data, practice rounds and the tests' samples reproducible; never use it for
 * anything secret.
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + MULBERRY32_STEP) >>> 0;
    return mulberry32Output(state);
  };
}

/**
 * mulberry32's number in [0, 1) for a state already advanced by `MULBERRY32_STEP`. A hot loop keeps
 * the state in a local variable and calls this (small enough to be inlined), which the permutation
 * test does: the same numbers as `mulberry32`, without a closure's state on every draw.
 */
export function mulberry32Output(state: number): number {
  let t = state;
  t = Math.imul(t ^ (t >>> 15), t | 1);
  t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
  return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
}
