/**
 * Seeded pseudo-random numbers: mulberry32 (Tommy Ettinger, 2017, public domain), a 32-bit
 * generator small enough to write here. It makes the reference set, the permutation tests'
 * p-values, the demo data, practice rounds and the tests' samples reproducible; never use it for
 * anything secret.
 */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}
