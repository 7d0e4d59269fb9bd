import { formatDateTime } from './local-date-time';

describe('formatDateTime', () => {
  // 14:05 UTC; the spec runs in the machine's zone, so compare against the same instant's local hour.
  const instant = '2026-03-01T14:05:00Z';
  const hour = new Date(instant).getHours();

  it('should use a 24-hour clock where the locale uses one (en-GB)', () => {
    expect(formatDateTime(instant, 'date-time', 'en-GB')).toContain(`${String(hour).padStart(2, '0')}:05`);
    expect(formatDateTime(instant, 'date-time', 'en-GB')).not.toMatch(/AM|PM/);
  });

  it('should use the 12-hour clock where the locale does (en-US)', () => {
    expect(formatDateTime(instant, 'date-time', 'en-US')).toMatch(/\d{1,2}:05\s?(AM|PM)/);
  });

  it("should put the day and month in the locale's order", () => {
    expect(formatDateTime('2026-03-09T12:00:00Z', 'date', 'en-GB')).toBe('9 Mar 2026');
    expect(formatDateTime('2026-03-09T12:00:00Z', 'date', 'en-US')).toBe('Mar 9, 2026');
  });

  it('should keep a calendar day (YYYY-MM-DD) on its own day in every time zone', () => {
    expect(formatDateTime('2026-03-09', 'date', 'en-GB')).toBe('9 Mar 2026');
  });

  it("should give a month and a clock time in the locale's own style", () => {
    expect(formatDateTime('2026-03-09T12:00:00Z', 'month', 'en-GB')).toBe('Mar 2026');
    expect(formatDateTime(instant, 'time', 'en-GB')).toBe(`${String(hour).padStart(2, '0')}:05`);
    expect(formatDateTime(instant, 'time', 'en-US')).toMatch(/^\d{1,2}:05\s?(AM|PM)$/);
  });

  it('should show a dash for no date or a date that is not one', () => {
    expect(formatDateTime(null)).toBe('—');
    expect(formatDateTime('soon')).toBe('—');
  });
});
