// The site-by-site ΔE00 table: each cell's number, and whether it reaches the character's
// threshold, marked by an icon and a word as well as by shading.
import type { SiteComparisonAnswer } from '../../../../../shared/api/analysis-answers.js';
import { deltaEText } from '../../../shared/chips/chip-words';
import { pValueText } from './drift-words';

/** One cell of the matrix. */
export interface MatrixCell {
  /** Whether this is a site against itself. */
  self: boolean;
  deltaE00: number;
  pValue: number;
  text: string;
  /** Whether the ΔE00 is at or above the threshold. */
  marked: boolean;
  /** The word shown beside the number: "differs" when marked, else "within". */
  word: string;
  icon: string;
  /** The whole cell for a screen reader. */
  label: string;
}

/** One row: a site and its cells against every site in the same order. */
export interface MatrixRow {
  siteCode: string;
  cells: MatrixCell[];
}

/** The matrix as rows of marked cells; a cell is marked when ΔE00 ≥ threshold (the diagonal never is). */
export function siteMatrix(answer: SiteComparisonAnswer): MatrixRow[] {
  return answer.sites.map((row, i) => ({
    siteCode: row.siteCode,
    cells: answer.sites.map((col, j) => {
      const self = i === j;
      const deltaE00 = answer.deltaE00[i]?.[j] ?? 0;
      const pValue = answer.pValue[i]?.[j] ?? 1;
      const marked = !self && deltaE00 >= answer.threshold;
      const word = self ? '' : marked ? 'differs' : 'within';
      return {
        self,
        deltaE00,
        pValue,
        text: self ? '—' : deltaEText(deltaE00),
        marked,
        word,
        icon: marked ? 'warning' : 'check',
        label: self ? `${row.siteCode} against itself` : `${row.siteCode} to ${col.siteCode}: ΔE00 ${deltaEText(deltaE00)}, ${marked ? 'at or above' : 'below'} the threshold ${answer.threshold}, ${pValueText(pValue)}`,
      };
    }),
  }));
}

/** How many distinct site pairs reach the threshold. */
export function markedPairs(answer: SiteComparisonAnswer): number {
  let n = 0;
  for (let i = 0; i < answer.sites.length; i++) for (let j = i + 1; j < answer.sites.length; j++) if ((answer.deltaE00[i]?.[j] ?? 0) >= answer.threshold) n++;
  return n;
}
