import { ACCEPTABILITY_THRESHOLD_DE00, PERCEPTIBILITY_THRESHOLD_DE00 } from './constants.js';

/** A ΔE00 in plain words. */
export type Verdict = 'indistinguishable' | 'close' | 'clearly different';

/**
 * The bands, borrowed from dental colour science (Paravina et al. 2015, J. Esthet. Restor. Dent.
 * 27:S1–S9): up to the 50:50 % perceptibility threshold most observers see no difference; up to
 * the 50:50 % acceptability threshold most accept the pair as a match. Upper ends are inclusive.
 */
export const VERDICT_BANDS: readonly { upTo: number; verdict: Verdict }[] = [
  { upTo: PERCEPTIBILITY_THRESHOLD_DE00, verdict: 'indistinguishable' },
  { upTo: ACCEPTABILITY_THRESHOLD_DE00, verdict: 'close' },
  { upTo: Infinity, verdict: 'clearly different' },
];

/** The plain-words verdict for a ΔE00 (≤ 0.8 indistinguishable, ≤ 1.8 close, else clearly different). */
export function verdictFor(deltaE: number): Verdict {
  if (!(deltaE >= 0)) throw new RangeError(`ΔE00 must be a non-negative number, got ${deltaE}`);
  return VERDICT_BANDS.find((band) => deltaE <= band.upTo)!.verdict;
}
