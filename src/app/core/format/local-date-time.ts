import { Pipe, type PipeTransform } from '@angular/core';

/** How much of an instant to show. */
export type DateTimeStyle = 'date-time' | 'seconds' | 'date' | 'month' | 'time';

const OPTIONS: Record<DateTimeStyle, Intl.DateTimeFormatOptions> = {
  'date-time': { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit' },
  seconds: { year: 'numeric', month: 'short', day: 'numeric', hour: 'numeric', minute: '2-digit', second: '2-digit' },
  date: { year: 'numeric', month: 'short', day: 'numeric' },
  month: { year: 'numeric', month: 'short' },
  time: { hour: 'numeric', minute: '2-digit' },
};

const formatters = new Map<string, Intl.DateTimeFormat>();

/** The person's own locale: the browser's preferred language (ECMA-402 picks the best it has). */
export function userLocale(): string | undefined {
  return typeof navigator === 'undefined' ? undefined : (navigator.languages?.[0] ?? navigator.language);
}

/**
 * An instant in the one date and time style of the app: the locale's own order of day, month and
 * year, its month word, and its own clock (24-hour where the locale uses it, e.g. en-GB 14:05,
 * de 14:05; 12-hour where it does not, e.g. en-US 2:05 PM), in the device's time zone.
 */
export function formatDateTime(value: string | Date | null | undefined, style: DateTimeStyle = 'date-time', locale = userLocale()): string {
  if (value === null || value === undefined || value === '') return '—';
  // A calendar day ("2026-03-09") is that day wherever the device is, not UTC midnight.
  const day = typeof value === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(value) : null;
  const date = value instanceof Date ? value : day ? new Date(Number(day[1]), Number(day[2]) - 1, Number(day[3]), 12) : new Date(value);
  if (Number.isNaN(date.getTime())) return '—';
  const key = `${locale ?? ''}|${style}`;
  let f = formatters.get(key);
  if (!f) formatters.set(key, (f = new Intl.DateTimeFormat(locale, OPTIONS[style])));
  return f.format(date);
}

/** Today as YYYY-MM-DD in the device's own time zone (the day the person sees), for date inputs. */
export function localToday(now = new Date()): string {
  const pad = (n: number) => String(n).padStart(2, '0');
  return `${now.getFullYear()}-${pad(now.getMonth() + 1)}-${pad(now.getDate())}`;
}

/** `{{ iso | localDateTime }}`, `| localDateTime: 'seconds'`, `| localDateTime: 'date'`: see `formatDateTime`. */
@Pipe({ name: 'localDateTime' })
export class LocalDateTimePipe implements PipeTransform {
  transform(value: string | Date | null | undefined, style: DateTimeStyle = 'date-time'): string {
    return formatDateTime(value, style);
  }
}
