import { formatDateTime } from './local-date-time';

/**
 * Why a From–To pair of calendar days (YYYY-MM-DD) is refused, or null when it is fine: From after
 * To is refused with both days written in the app's one date style. Either end may be missing.
 */
export function dateRangeRefusal(from: string | null | undefined, to: string | null | undefined, locale?: string): string | null {
  if (!from || !to || from <= to) return null;
  const day = (value: string) => (locale === undefined ? formatDateTime(value, 'date') : formatDateTime(value, 'date', locale));
  return `From ${day(from)} is after To ${day(to)}: choose a From on or before To.`;
}
