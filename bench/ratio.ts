/** The line prefix scripts/bench.mjs collects into its closing summary table. */
export const RATIO_MARK = '::bench-ratio::';

/**
 * Reports one headline ratio of a benchmark (the work against its floor measured in the same run)
 * for the summary `npm run bench` prints at the end. Lower is better unless `higherIsBetter`.
 */
export function reportRatio(what: string, ratio: number, floor: string, aim?: string, higherIsBetter = false): void {
  console.log(`${RATIO_MARK}${JSON.stringify({ what, ratio, floor, aim: aim ?? null, higherIsBetter })}`);
}

/**
 * Whether this is a smoke run (`BENCH_SMOKE=1`, as npm test does): tiny sizes, only to prove that
 * each benchmark still runs to its ratio. Its figures mean nothing.
 */
export const SMOKE = process.env['BENCH_SMOKE'] === '1';

/** A benchmark's size: the first command-line argument if given, else `full`, or `smoke` in a smoke run. */
export function benchSize(full: number, smoke: number): number {
  const given = process.argv[2];
  if (given !== undefined && given !== '') return Number(given);
  return SMOKE ? smoke : full;
}
