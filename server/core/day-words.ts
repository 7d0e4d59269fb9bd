// Calendar days in words, for what the server writes for people: audit sentences, refusals, mails
// and PDFs. Screens write dates in the browser's own style; the server, where it has no reader's
// language (mails, PDFs, refusals), writes en-GB's day, short month, year: never an ISO date.

const str = (v: unknown) => (typeof v === 'string' ? v : v === null || v === undefined ? '' : JSON.stringify(v));

/**
 * A calendar day ("2026-04-02") in the reader's language, in the app's date style (day, short
 * month, year; "2 Apr 2026" in en-GB, "Apr 2, 2026" in en-US), as the screens write every date;
 * anything else as it is. A language Intl does not know falls back to the runtime's own.
 */
export function dayWords(v: unknown, locale?: string): string {
  const m = typeof v === 'string' ? /^(\d{4})-(\d{2})-(\d{2})$/.exec(v) : null;
  if (!m) return str(v);
  const known = locale && Intl.DateTimeFormat.supportedLocalesOf([locale]).length ? locale : undefined;
  return new Intl.DateTimeFormat(known, { year: 'numeric', month: 'short', day: 'numeric', timeZone: 'UTC' }).format(Date.UTC(Number(m[1]), Number(m[2]) - 1, Number(m[3])));
}

/** The language the server writes days in when it has no reader's own. */
export const SERVER_DAY_LOCALE = 'en-GB';

/** A calendar day ("2026-04-02") as the server writes it for people: "2 Apr 2026". */
export function serverDay(iso: string): string {
  return dayWords(iso, SERVER_DAY_LOCALE);
}

/** An instant as a day and a 24-hour UTC time in words ("3 Dec 2026, 06:05 UTC"). */
export function instantWords(at: Date): string {
  return `${serverDay(at.toISOString().slice(0, 10))}, ${at.toISOString().slice(11, 16)} UTC`;
}
