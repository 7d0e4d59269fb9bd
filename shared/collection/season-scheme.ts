/*
 * The check of a site's season scheme: named month-day ranges that may wrap the year end.
 * Pure and zod-free, so the server refuses what the client's season editor already shows live:
 * which names repeat, which dates are not real, which seasons share days, which days no season
 * covers. Days are counted on a leap year (366 days) so 29 February is a real month-day.
 */

/** A season as typed: a name and an inclusive "MM-DD" range (an end before the start wraps the year end). */
export interface SeasonRange {
  name: string;
  start: string;
  end: string;
}

/** A run of consecutive days of the year, possibly across 31 December. */
export interface DayRun {
  /** First day, "MM-DD". */
  from: string;
  /** Last day, "MM-DD", inclusive. */
  to: string;
  days: number;
}

/** Something wrong with a scheme; `field` is where a form shows it (`seasons.2.start`, `seasons.1.name`, `seasons`). */
export type SchemeIssue =
  | { kind: 'date'; field: string; index: number; message: string }
  | { kind: 'name'; field: string; index: number; message: string }
  | { kind: 'overlap'; field: string; seasons: [number, number]; runs: DayRun[]; message: string }
  | { kind: 'gap'; field: string; runs: DayRun[]; message: string };

/** The verdict on a scheme: errors refuse it; warnings (uncovered days) are allowed and reported. */
export interface SchemeCheck {
  /** Whether the scheme may be saved (no errors). */
  valid: boolean;
  errors: SchemeIssue[];
  warnings: SchemeIssue[];
}

/** Days in the reference year: a leap year, so "02-29" has a place. */
export const YEAR_DAYS = 366;

const MONTH_DAYS = [31, 29, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31] as const;
const MONTH_NAMES = ['Jan', 'Feb', 'Mar', 'Apr', 'May', 'Jun', 'Jul', 'Aug', 'Sep', 'Oct', 'Nov', 'Dec'] as const;
const MONTH_START = MONTH_DAYS.reduce<number[]>((starts, _n, i) => [...starts, i === 0 ? 0 : starts[i - 1]! + MONTH_DAYS[i - 1]!], []);

/** The 0-based day of the leap reference year of an "MM-DD", or null when it is no real month-day. */
export function dayOfYear(monthDay: string): number | null {
  const m = /^(\d{2})-(\d{2})$/.exec(monthDay);
  if (!m) return null;
  const month = Number(m[1]);
  const day = Number(m[2]);
  if (month < 1 || month > 12 || day < 1 || day > MONTH_DAYS[month - 1]!) return null;
  return MONTH_START[month - 1]! + day - 1;
}

/** The "MM-DD" of a 0-based day of the reference year (taken modulo the year). */
export function monthDayOf(day: number): string {
  const d = ((day % YEAR_DAYS) + YEAR_DAYS) % YEAR_DAYS;
  let month = 11;
  while (MONTH_START[month]! > d) month--;
  return `${String(month + 1).padStart(2, '0')}-${String(d - MONTH_START[month]! + 1).padStart(2, '0')}`;
}

/** "11-01" as "1 Nov". */
export function monthDayWords(monthDay: string): string {
  return `${Number(monthDay.slice(3))} ${MONTH_NAMES[Number(monthDay.slice(0, 2)) - 1] ?? '?'}`;
}

/** Whether an inclusive season range holds a month-day; an end before the start wraps the year end. */
export function seasonHolds(range: Pick<SeasonRange, 'start' | 'end'>, monthDay: string): boolean {
  const { start, end } = range;
  return start <= end ? monthDay >= start && monthDay <= end : monthDay >= start || monthDay <= end;
}

/** The days of the reference year a valid range covers. */
function coveredDays(start: number, end: number): number[] {
  const length = ((end - start + YEAR_DAYS) % YEAR_DAYS) + 1;
  return Array.from({ length }, (_, i) => (start + i) % YEAR_DAYS);
}

/** Consecutive runs of the marked days, a run across 31 December kept whole. */
function runsOf(marked: readonly boolean[]): DayRun[] {
  if (marked.every(Boolean)) return [{ from: '01-01', to: '12-31', days: YEAR_DAYS }];
  // Start the walk just after an unmarked day, so no run is cut at the year end.
  const origin = (marked.indexOf(false) + 1) % YEAR_DAYS;
  const runs: DayRun[] = [];
  let first: number | null = null;
  for (let i = 0; i <= YEAR_DAYS; i++) {
    const day = (origin + i) % YEAR_DAYS;
    const on = i < YEAR_DAYS && marked[day]!;
    if (on && first === null) first = origin + i;
    if (!on && first !== null) {
      runs.push({ from: monthDayOf(first), to: monthDayOf(origin + i - 1), days: origin + i - first });
      first = null;
    }
  }
  return runs.sort((a, b) => a.from.localeCompare(b.from));
}

function runWords(runs: readonly DayRun[]): string {
  return runs.map((r) => (r.days === 1 ? monthDayWords(r.from) : `${monthDayWords(r.from)}–${monthDayWords(r.to)}`)).join(', ');
}

/**
 * Checks a scheme: names present and unique (ignoring case and outer spaces), dates real
 * month-days, no two seasons sharing a day. Days no season covers are a warning, not an error:
 * a reading on such a day simply has no season.
 */
export function checkSeasonScheme(seasons: readonly SeasonRange[]): SchemeCheck {
  const errors: SchemeIssue[] = [];
  const seen = new Map<string, number>();
  const spans: { index: number; days: number[] }[] = [];
  seasons.forEach((s, index) => {
    const name = s.name.trim().toLowerCase();
    if (!name) errors.push({ kind: 'name', field: `seasons.${index}.name`, index, message: 'is required' });
    else if (seen.has(name)) errors.push({ kind: 'name', field: `seasons.${index}.name`, index, message: `repeats the name of season ${seen.get(name)! + 1}` });
    else seen.set(name, index);
    const start = dayOfYear(s.start);
    const end = dayOfYear(s.end);
    if (start === null) errors.push({ kind: 'date', field: `seasons.${index}.start`, index, message: 'must be a real month-day "MM-DD"' });
    if (end === null) errors.push({ kind: 'date', field: `seasons.${index}.end`, index, message: 'must be a real month-day "MM-DD"' });
    if (start !== null && end !== null) spans.push({ index, days: coveredDays(start, end) });
  });
  for (let i = 0; i < spans.length; i++) {
    for (let j = i + 1; j < spans.length; j++) {
      const a = spans[i]!;
      const b = spans[j]!;
      const inA = new Set(a.days);
      const shared = Array.from({ length: YEAR_DAYS }, (_, d) => inA.has(d) && b.days.includes(d));
      if (!shared.some(Boolean)) continue;
      const runs = runsOf(shared);
      const names = `${label(seasons[a.index]!, a.index)} and ${label(seasons[b.index]!, b.index)}`;
      errors.push({ kind: 'overlap', field: `seasons.${b.index}`, seasons: [a.index, b.index], runs, message: `${names} both cover ${runWords(runs)}` });
    }
  }
  const warnings: SchemeIssue[] = [];
  const covered = Array.from({ length: YEAR_DAYS }, () => false);
  for (const s of spans) for (const d of s.days) covered[d] = true;
  const gaps = runsOf(covered.map((c) => !c));
  if (covered.some((c) => !c)) warnings.push({ kind: 'gap', field: 'seasons', runs: gaps, message: `no season covers ${runWords(gaps)}` });
  return { valid: errors.length === 0, errors, warnings };
}

function label(s: SeasonRange, index: number): string {
  return s.name.trim() ? `“${s.name.trim()}”` : `season ${index + 1}`;
}
