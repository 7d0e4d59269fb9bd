// Plain words and icons for the drift view, so a verdict never rests on colour alone.
import type { DriftAnswer, DriftComparison, DriftGroup, GroupKey, NamedGroupKey } from '../../../../../shared/api/analysis-answers.js';
import { formatNumber } from '../../../shared/chips/chip-words';

/** What a comparison between two season groups says. */
export type DriftState = 'drift' | 'steady' | 'too-few';

/** Each state as a word and an icon. */
export const DRIFT_STATE_WORDS: Readonly<Record<DriftState, { word: string; icon: string }>> = {
  drift: { word: 'Drift', icon: 'trending_up' },
  steady: { word: 'Steady', icon: 'horizontal_rule' },
  'too-few': { word: 'Too few readings', icon: 'hourglass_empty' },
};

/** Whether two group keys name the same group. */
export function sameGroup(a: GroupKey, b: GroupKey): boolean {
  return a.season === b.season && a.seasonYear === b.seasonYear;
}

/** A group as people say it, as the server names it: "Dry 2025", "Wet 2024–25" for a season that wraps the year end. */
export function groupLabel(key: NamedGroupKey): string {
  return key.seasonLabel;
}

/** Whether a group has too few readings to be compared (the server never flags it). */
export function tooSmall(group: Pick<DriftGroup, 'n'>, minGroupSize: number): boolean {
  return group.n < minGroupSize;
}

/** The state of one comparison: drift as the server decided; otherwise too few when either group is below the minimum size. */
export function driftState(comparison: DriftComparison, answer: Pick<DriftAnswer, 'groups' | 'minGroupSize'>): DriftState {
  if (comparison.drift) return 'drift';
  const sizeOf = (key: GroupKey) => answer.groups.find((g) => sameGroup(g, key))?.n ?? 0;
  return Math.min(sizeOf(comparison.from), sizeOf(comparison.to)) < answer.minGroupSize ? 'too-few' : 'steady';
}

/** A p-value as tables print it, with its relation: "p < 0.001" below a thousandth, else "p = 0.043". */
export function pValueText(p: number): string {
  return p < 0.001 ? 'p < 0.001' : `p = ${p.toFixed(3)}`;
}

/** "consecutive seasons" or "same season, a year apart". */
export function kindWords(kind: DriftComparison['kind']): string {
  return kind === 'consecutive' ? 'consecutive seasons' : 'same season, a year apart';
}

/** A hue angle, or a dash when the chroma is too low for the hue to mean anything. */
export function hueText(chroma: number, hue: number): string {
  return chroma < 0.5 ? '—' : formatNumber(hue, 0);
}

/** Why the view cannot compare anything yet, or null when at least one comparison can be made. */
export function emptyReason(answer: DriftAnswer): 'no-readings' | 'no-groups' | 'too-small' | null {
  if (answer.points.length === 0) return 'no-readings';
  if (answer.groups.length === 0) return 'no-groups';
  const comparable = answer.groups.filter((g) => !tooSmall(g, answer.minGroupSize)).length;
  return comparable < 2 ? 'too-small' : null;
}

/** How many comparisons show drift, in words for the page's summary line. */
export function summaryWords(answer: DriftAnswer): string {
  const states = answer.comparisons.map((c) => driftState(c, answer));
  const drift = states.filter((s) => s === 'drift').length;
  const n = answer.comparisons.length;
  if (n === 0) return 'No comparisons yet: a comparison needs two season groups.';
  if (drift === 0) return `No drift in ${n} ${n === 1 ? 'comparison' : 'comparisons'}.`;
  return `Drift in ${drift} of ${n} ${n === 1 ? 'comparison' : 'comparisons'}.`;
}
