import { dateRangeRefusal } from './date-range';

describe('dateRangeRefusal', () => {
  it('should refuse From after To, naming both days in the locale’s style', () => {
    expect(dateRangeRefusal('2026-05-02', '2026-05-01', 'en-GB')).toBe('From 2 May 2026 is after To 1 May 2026: choose a From on or before To.');
  });

  it('should accept the same day, From before To, and a range open at either end', () => {
    expect(dateRangeRefusal('2026-05-01', '2026-05-01')).toBeNull();
    expect(dateRangeRefusal('2026-04-30', '2026-05-01')).toBeNull();
    expect(dateRangeRefusal(undefined, '2026-05-01')).toBeNull();
    expect(dateRangeRefusal('2026-05-01', null)).toBeNull();
  });
});
