// What a trainer should tell each observer, and when a session's answers are too few to judge the
// group by. Plain words built from the numbers computeResults already has; pure.
import type { FailedRule } from '../../shared/api/calibration-answers.js';
import type { LabTuple } from '../../shared/colour/lab.js';
import type { KappaInterval } from '../../shared/stats/kappa-interval.js';

/**
 * Fewest specimens answered by two or more observers before κ is worth judging. Our own rule of
 * thumb: with fewer, one changed pick moves κ by a band or more (common practice, no source).
 */
export const MIN_KAPPA_SPECIMENS = 10;
/** Fewest observers before the group's κ says something about a group (our own). */
export const MIN_OBSERVERS = 3;
/** A same-field-chip share from which an observer "finds the right field chip" (our own: 4 in 5). */
export const GOOD_FIELD_HIT_RATE = 0.8;
/** A mean shift on one CIELAB axis from which it is named as a bias (about one just-noticeable unit; common practice, no source). */
const BIAS_NOTICE = 1;

const fmt = (v: number, d = 2) => v.toFixed(d).replace('-', '−');

/** What the observer's numbers are, for the rules. */
export interface AdviceInput {
  n: number;
  specimens: number;
  meanDeltaE00: number | null;
  fieldHitRate: number | null;
  bias: LabTuple | null;
  kappa: number | null;
  thresholds: { kappa: number; deltaE00: number };
  /** Labels of the specimens whose field chip they missed. */
  missedLabels: string[];
}

/** Each certification rule the observer does not meet, in words. */
export function failedRules(x: AdviceInput): FailedRule[] {
  const out: FailedRule[] = [];
  if (x.specimens === 0 || x.n < x.specimens) out.push({ rule: 'complete', text: `answered ${x.n} of ${x.specimens} specimens; every specimen must be answered` });
  if (x.kappa === null) out.push({ rule: 'kappa', text: `the group's Fleiss' κ is not defined yet; it must be at least ${x.thresholds.kappa}` });
  else if (x.kappa < x.thresholds.kappa) out.push({ rule: 'kappa', text: `the group's Fleiss' κ ${fmt(x.kappa)} is below the rule ${x.thresholds.kappa}` });
  if (x.meanDeltaE00 !== null && x.meanDeltaE00 > x.thresholds.deltaE00) out.push({ rule: 'deltaE00', text: `mean ΔE00 ${fmt(x.meanDeltaE00)} is above the limit ${x.thresholds.deltaE00}` });
  return out;
}

/** The axis words of the largest shift ("lighter"), or null when no shift reaches BIAS_NOTICE. */
function biasWord(bias: LabTuple | null): string | null {
  if (!bias) return null;
  const words = [['lighter', 'darker'], ['redder', 'greener'], ['yellower', 'bluer']] as const;
  const axis = [0, 1, 2].reduce((best, k) => (Math.abs(bias[k]!) > Math.abs(bias[best]!) ? k : best), 0);
  if (Math.abs(bias[axis]!) < BIAS_NOTICE) return null;
  return words[axis]![bias[axis]! > 0 ? 0 : 1];
}

/**
 * One or two sentences a trainer can say to the observer. When the observer finds the right field
 * chip yet their mean ΔE00 is high, both figures are true at once and the sentence says why: a
 * field chip is a coarse cell (neighbours about ΔE00 6–10 apart), so a pick can sit in the right
 * cell and still be several ΔE00 from the reference.
 */
export function observerAdvice(x: AdviceInput): string {
  if (x.n === 0) return 'No answers yet: ask them to answer every specimen.';
  const parts: string[] = [];
  const hit = x.fieldHitRate ?? 0;
  const mean = x.meanDeltaE00;
  const bias = biasWord(x.bias);
  const biasText = bias ? ` Their picks read ${bias} than the references on average: ask them to look for that.` : '';
  if (mean !== null && mean > x.thresholds.deltaE00 && hit >= GOOD_FIELD_HIT_RATE) {
    parts.push(
      `They picked the reference's field chip on ${Math.round(hit * 100)} % of specimens, but the chips they picked sit on average ${fmt(mean)} ΔE00 from the references (limit ${x.thresholds.deltaE00}): a field chip is a coarse cell, so practise choosing the nearest fine chip within it (Calibration → Practice).${biasText}`,
    );
  } else if (mean !== null && mean > x.thresholds.deltaE00) {
    const missed = x.missedLabels.length ? ` (${x.missedLabels.join('; ')})` : '';
    parts.push(`They missed the reference's field chip on ${Math.round((1 - hit) * 100)} % of specimens${missed}, and their mean ΔE00 is ${fmt(mean)} (limit ${x.thresholds.deltaE00}): practise the field card first, then the fine chips (Calibration → Practice).${biasText}`);
  } else if (mean !== null) {
    parts.push(`Their picks are close to the references (mean ΔE00 ${fmt(mean)}, limit ${x.thresholds.deltaE00}) and ${Math.round(hit * 100)} % were in the reference's field chip.${biasText}`);
  }
  if (x.n < x.specimens) parts.push(`They answered ${x.n} of ${x.specimens} specimens: every specimen must be answered to be certified.`);
  if (x.kappa !== null && x.kappa < x.thresholds.kappa) parts.push(`The group as a whole agrees too little (κ ${fmt(x.kappa)}, rule ${x.thresholds.kappa}): go through the specimens the group split on together.`);
  return parts.join(' ');
}

/** Why the session's answers are too few to judge the group by; empty when they are enough. */
export function sampleWarnings(kappaSpecimens: number, observers: number, interval: KappaInterval | null, kappaThreshold: number): string[] {
  const out: string[] = [];
  if (kappaSpecimens < MIN_KAPPA_SPECIMENS) out.push(`Sample too small to judge: κ rests on ${kappaSpecimens} ${kappaSpecimens === 1 ? 'specimen' : 'specimens'} answered by two or more observers; we ask for at least ${MIN_KAPPA_SPECIMENS} (our own rule of thumb), because with fewer one changed pick moves κ a lot.`);
  if (observers < MIN_OBSERVERS) out.push(`Sample too small to judge: ${observers} ${observers === 1 ? 'observer' : 'observers'}; a group's κ needs at least ${MIN_OBSERVERS} (our own rule of thumb).`);
  if (interval && interval.lower < kappaThreshold && interval.upper >= kappaThreshold) out.push(`The 95 % interval of κ, ${fmt(interval.lower)} to ${fmt(interval.upper)}, spans the threshold ${kappaThreshold}: these answers cannot tell whether the group meets it.`);
  return out;
}
