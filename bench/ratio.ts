/** The line prefix scripts/bench.mjs collects into its closing summary table. */
export const RATIO_MARK = '::bench-ratio::';

/**
 * Reports one headline ratio of a benchmark (the work against its floor measured in the same run)
 * for the summary `npm run bench` prints at the end. Lower is better unless `higherIsBetter`.
 */
export function reportRatio(what: string, ratio: number, floor: string, aim?: string, higherIsBetter = false): void {
  console.log(`${RATIO_MARK}${JSON.stringify({ what, ratio, floor, aim: aim ?? null, higherIsBetter })}`);
}
