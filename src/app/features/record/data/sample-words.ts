// Plain words for a sample's numbers, shared by the result panel and its spec.
import type { PhotoSample } from '../../../../../shared/api/photo-answers.js';
import type { MatchBetween } from '../../../../../shared/api/reference-set-answers.js';
import type { Verdict } from '../../../../../shared/colour/verdict.js';

/** Icon beside each verdict, so the verdict never rests on colour alone. */
export const VERDICT_ICONS: Record<Verdict, string> = {
  indistinguishable: 'done_all',
  close: 'check',
  'clearly different': 'close',
};

/** Which end a reading is nearer: the code, or null for about halfway (t within 0.4–0.6, our own band). */
export function nearerEnd(between: MatchBetween): string | null {
  return between.t < 0.4 ? between.a : between.t > 0.6 ? between.b : null;
}

/** "Between F-012.003 and F-012.004, nearer F-012.003." */
export function betweenWords(between: MatchBetween): string {
  const nearer = nearerEnd(between);
  return `Between ${between.a} and ${between.b}, ${nearer ? `nearer ${nearer}` : 'about halfway'}.`;
}

/** What the correction did, in words. */
export function correctionWords(sample: PhotoSample): string {
  const c = sample.correction;
  if (c.kind === 'neutral') return `Balanced on the grey card (gains ${c.gains.map((g) => g.toFixed(2)).join(' · ')}).`;
  if (c.kind === 'patches') return `Corrected with ${c.residuals.length} target patches (worst patch ΔE00 ${c.maxResidualDeltaE00.toFixed(1)}).`;
  return 'No correction: colours as the camera saw the light.';
}

/** One decimal, with a true minus sign. */
export function signed(v: number, digits = 1): string {
  const text = Math.abs(v).toFixed(digits);
  return v < 0 && Number(text) !== 0 ? `−${text}` : text;
}
