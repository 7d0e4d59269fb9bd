import type { MatchBetween } from '../../../../shared/api/reference-set-answers.js';
import { sectorLabel, type HueSector } from '../../../../shared/colour/chip-name.js';
import { ACCEPTABILITY_THRESHOLD_DE00, PERCEPTIBILITY_THRESHOLD_DE00 } from '../../../../shared/colour/constants.js';
import type { Verdict } from '../../../../shared/colour/verdict.js';

/** An icon beside each verdict's words, so the verdict never rests on colour alone. */
export const VERDICT_ICONS: Record<Verdict, string> = {
  indistinguishable: 'done_all',
  close: 'check',
  'clearly different': 'close',
};

/** What each verdict means, for a tooltip or a screen reader (bands of Paravina et al. 2015). */
export const VERDICT_MEANINGS: Record<Verdict, string> = {
  indistinguishable: `most observers see no difference (ΔE00 ≤ ${PERCEPTIBILITY_THRESHOLD_DE00})`,
  close: `a visible but acceptable difference (ΔE00 ≤ ${ACCEPTABILITY_THRESHOLD_DE00})`,
  'clearly different': `most observers would not accept it as a match (ΔE00 > ${ACCEPTABILITY_THRESHOLD_DE00})`,
};

/** A number with a true minus sign and fixed decimals, as tables of CIELAB print them. */
export function formatNumber(value: number, decimals: number): string {
  const text = Math.abs(value).toFixed(decimals);
  return value < 0 && Number(text) !== 0 ? `−${text}` : text;
}

/** "L* 35.78, a* 32.85, b* −15.81" */
export function labText(lab: readonly [number, number, number]): string {
  return `L* ${formatNumber(lab[0], 2)}, a* ${formatNumber(lab[1], 2)}, b* ${formatNumber(lab[2], 2)}`;
}

/** "L* 35.78, C* 36.46, h° 334.3" */
export function lchText(lch: readonly [number, number, number]): string {
  return `L* ${formatNumber(lch[0], 2)}, C* ${formatNumber(lch[1], 2)}, h° ${formatNumber(lch[2], 1)}`;
}

/** "C* 36.46, h° 334.3": chroma and hue, to write after labText without giving L* twice. */
export function chromaHueText(lch: readonly [number, number, number]): string {
  return `C* ${formatNumber(lch[1], 2)}, h° ${formatNumber(lch[2], 1)}`;
}

/** ΔE00 to two decimals: the figure a recorder writes down. */
export function deltaEText(deltaE: number): string {
  return formatNumber(deltaE, 2);
}

/** Within this distance of ½, t reads "about half-way" rather than nearer one end (our own). */
const HALF_WAY_BAND = 0.1;

/** Whether a position t between two chips reads "about half-way". */
export function isHalfWay(t: number): boolean {
  return Math.abs(t - 0.5) < HALF_WAY_BAND;
}

/** "between F-087.014 and F-087.015, nearer F-087.014", or "about half-way between …". */
export function betweenWords(between: MatchBetween): string {
  if (isHalfWay(between.t)) return `about half-way between ${between.a} and ${between.b}`;
  return `between ${between.a} and ${between.b}, nearer ${between.t < 0.5 ? between.a : between.b}`;
}

/** The heading of a hue sector on the browse page and pickers, with its range: "leaf h° 130–160". */
export function familyLabel(sector: HueSector): string {
  return sectorLabel(sector);
}

/**
 * A code as typed ("F-087", "f087", "87", "F-87.14", "087.014") in the set's form ("F-087",
 * "F-087.014"), or null when it cannot be one.
 */
export function normaliseCode(text: string): string | null {
  const match = /^\s*(?:f\s*-?\s*)?(\d{1,3})(?:\s*\.\s*(\d{1,3}))?\s*$/i.exec(text);
  if (!match) return null;
  const field = `F-${match[1].padStart(3, '0')}`;
  return match[2] === undefined ? field : `${field}.${match[2].padStart(3, '0')}`;
}
