/*
 * A reading's season and season-year: from the instant it was observed, the site's
 * IANA time zone and its season scheme. Pure and zod-free, so the client shows what the server
 * stores. The local date comes from `Intl.DateTimeFormat` (ECMA-402), no time-zone library.
 */
import { seasonHolds, type SeasonRange } from './season-scheme.js';

/** A calendar date in some time zone. */
export interface LocalDate {
  year: number;
  /** 1–12. */
  month: number;
  /** 1–31. */
  day: number;
}

/** The season a reading falls in, or nulls when no season of the scheme covers its local date. */
export interface SeasonOf {
  season: string | null;
  /** The local calendar year in which this occurrence of the season started (wet 11-01…04-30 read on 2026-02-10 → 2025). */
  seasonYear: number | null;
}

/** Formatters are costly to build and are reused per zone. */
const formatters = new Map<string, Intl.DateTimeFormat>();

function formatterFor(timeZone: string): Intl.DateTimeFormat {
  let f = formatters.get(timeZone);
  if (!f) {
    // Throws RangeError for a zone the runtime does not know, which a caller should not hide.
    f = new Intl.DateTimeFormat('en-US', { timeZone, year: 'numeric', month: 'numeric', day: 'numeric', calendar: 'gregory', numberingSystem: 'latn' });
    formatters.set(timeZone, f);
  }
  return f;
}

/** The calendar date of an instant in an IANA time zone. */
export function localDateOf(instant: Date, timeZone: string): LocalDate {
  const parts = formatterFor(timeZone).formatToParts(instant);
  const part = (type: Intl.DateTimeFormatPartTypes) => Number(parts.find((p) => p.type === type)?.value);
  return { year: part('year'), month: part('month'), day: part('day') };
}

/** "MM-DD" of a local date. */
export function monthDayOfDate(d: LocalDate): string {
  return `${String(d.month).padStart(2, '0')}-${String(d.day).padStart(2, '0')}`;
}

/** "YYYY-MM-DD" of a local date. */
export function isoOfDate(d: LocalDate): string {
  return `${String(d.year).padStart(4, '0')}-${monthDayOfDate(d)}`;
}

/**
 * The season of a local date. Month-day ranges are inclusive and an end before the start wraps
 * the year end; the season-year of a wrapping season is the year of its start, so a date on or
 * after the start keeps its year and a date up to the end belongs to the season begun the year
 * before.
 *
 * 29 February: in a leap year it is its own month-day, so a season that names "02-29" (or spans
 * it) holds it. A scheme typed without leap days (one season ending "02-28", the next starting
 * "03-01") would otherwise leave it out, so when no season holds "02-29" the day counts as 28
 * February (our own rule: a leap day belongs to the season of the day before it). In a common
 * year "02-29" never occurs; a range that starts on it begins in effect on 1 March and one that
 * ends on it ends on 28 February, which plain month-day order gives by itself.
 */
export function seasonOfDate(date: LocalDate, seasons: readonly SeasonRange[]): SeasonOf {
  let monthDay = monthDayOfDate(date);
  let found = seasons.find((s) => seasonHolds(s, monthDay));
  if (!found && monthDay === '02-29') {
    monthDay = '02-28';
    found = seasons.find((s) => seasonHolds(s, monthDay));
  }
  if (!found) return { season: null, seasonYear: null };
  const wraps = found.end < found.start;
  return { season: found.name, seasonYear: wraps && monthDay <= found.end ? date.year - 1 : date.year };
}

/** The season and season-year of an instant at a site: its local date in the site's zone, then `seasonOfDate`. */
export function seasonOf(instant: Date, timeZone: string, seasons: readonly SeasonRange[]): SeasonOf {
  return seasonOfDate(localDateOf(instant, timeZone), seasons);
}

/**
 * A season as people say it: "Dry 2025" for a season inside one calendar year, "Wet 2024–25" for
 * one that wraps the year end (it began in 2024 and ends in 2025), so a reading of 15 April 2025
 * in a November–April season is not read as a 2024 reading. Null without a season.
 */
export function seasonLabel(season: string | null, seasonYear: number | null, wraps: boolean): string | null {
  if (season === null || seasonYear === null) return null;
  if (!wraps) return `${season} ${seasonYear}`;
  const next = seasonYear + 1;
  const tail = Math.floor(next / 100) === Math.floor(seasonYear / 100) ? String(next % 100).padStart(2, '0') : String(next);
  return `${season} ${seasonYear}–${tail}`;
}
