/*
 * A plant's age at a reading, in completed months, counted on the local calendar of the site. Pure and zod-free, so the client shows what the server stores.
 */
import type { LocalDate } from './season-of.js';

/** "YYYY-MM-DD" → a date, or null when it is not one. */
export function parseIsoDate(text: string): LocalDate | null {
  const m = /^(\d{4})-(\d{2})-(\d{2})$/.exec(text);
  if (!m) return null;
  const date = { year: Number(m[1]), month: Number(m[2]), day: Number(m[3]) };
  const check = new Date(Date.UTC(date.year, date.month - 1, date.day));
  return check.getUTCFullYear() === date.year && check.getUTCMonth() === date.month - 1 && check.getUTCDate() === date.day ? date : null;
}

/**
 * Completed months from the planting date to the local observation date: a month is complete
 * when the day of the month reaches the planting day again. A month too short to hold that day
 * does not complete it, so a plant put in on 31 January is 0 months old on 28 February and
 * 2 months old on 31 March (our own convention, the plain reading of "completed months").
 * Null when the planting date is not a date or lies after the observation.
 */
export function plantAgeMonths(plantedOn: string, observed: LocalDate): number | null {
  const planted = parseIsoDate(plantedOn);
  if (!planted) return null;
  let months = (observed.year - planted.year) * 12 + (observed.month - planted.month);
  if (observed.day < planted.day) months--;
  return months < 0 ? null : months;
}
