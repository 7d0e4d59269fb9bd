import { YEAR_DAYS, dayOfYear, monthDayWords as sharedMonthDayWords } from '../../../../../shared/collection/season-scheme.js';

export { dayOfYear };

/** Days in the reference year the season pictures use: the same leap year as the shared scheme check. */
export const REFERENCE_DAYS = YEAR_DAYS;

/** Days in each month of the reference (leap) year. */
const MONTH_DAYS = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31];

/** A run of days: the first day (0 = 1 January) and how many, possibly past the year end. */
export interface SeasonSpan {
  start: number;
  days: number;
}

/** The span of an inclusive "MM-DD" → "MM-DD" season; an end before the start wraps the year end. */
export function spanOf(start: string, end: string): SeasonSpan | null {
  const from = dayOfYear(start);
  const to = dayOfYear(end);
  if (from === null || to === null) return null;
  return { start: from, days: ((to - from + REFERENCE_DAYS) % REFERENCE_DAYS) + 1 };
}

/** The first day of each month in the reference year. */
export function monthStarts(): number[] {
  const starts: number[] = [];
  let day = 0;
  for (const length of MONTH_DAYS) {
    starts.push(day);
    day += length;
  }
  return starts;
}

/** "11-01" as "1 Nov", for hints beside the typed code; null when it is no real date. */
export function monthDayWords(monthDay: string): string | null {
  return dayOfYear(monthDay) === null ? null : sharedMonthDayWords(monthDay);
}

/** A typed month-day made canonical: "1101", "11/01", "11.1" and "11-1" all become "11-01". */
export function normaliseMonthDay(typed: string): string {
  const text = typed.trim();
  const compact = /^(\d{2})(\d{2})$/.exec(text);
  if (compact) return `${compact[1]}-${compact[2]}`;
  const parts = /^(\d{1,2})\s*[-/.\s]\s*(\d{1,2})$/.exec(text);
  if (parts) return `${parts[1].padStart(2, '0')}-${parts[2].padStart(2, '0')}`;
  return text;
}
