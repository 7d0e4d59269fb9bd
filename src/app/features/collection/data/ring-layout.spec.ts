import { arcPath, drawRing, RING, spansOverlap, uncoveredRuns } from './ring-layout';
import { dayOfYear, monthDayWords, normaliseMonthDay, spanOf } from './season-days';

describe('season days', () => {
  it('should count days from 1 January in a leap year', () => {
    expect(dayOfYear('01-01')).toBe(0);
    expect(dayOfYear('02-29')).toBe(59);
    expect(dayOfYear('03-01')).toBe(60);
    expect(dayOfYear('12-31')).toBe(365);
  });

  it('should refuse dates that do not exist', () => {
    expect(dayOfYear('02-30')).toBeNull();
    expect(dayOfYear('13-01')).toBeNull();
    expect(dayOfYear('4-30')).toBeNull();
  });

  it('should span a season that wraps the year end across it', () => {
    // Wet 1 Nov – 30 Apr: 61 days of Nov–Dec, 121 of Jan–Apr (with 29 Feb).
    expect(spanOf('11-01', '04-30')).toEqual({ start: 305, days: 182 });
  });

  it('should span a one-day season and a whole year', () => {
    expect(spanOf('06-15', '06-15')?.days).toBe(1);
    expect(spanOf('01-01', '12-31')?.days).toBe(366);
  });

  it('should read typed month-days in several forms', () => {
    expect(['1101', '11/01', '11-1', ' 11.1 '].map(normaliseMonthDay)).toEqual(['11-01', '11-01', '11-01', '11-01']);
    expect(normaliseMonthDay('soon')).toBe('soon');
  });

  it('should say a month-day in words', () => {
    expect(monthDayWords('11-01')).toBe('1 Nov');
    expect(monthDayWords('02-31')).toBeNull();
  });
});

describe('year ring', () => {
  const wetDry = [
    { name: 'Wet', start: '11-01', end: '04-30' },
    { name: 'Dry', start: '05-01', end: '10-31' },
  ];

  it('should draw a season wrapping the year end as one arc through the top', () => {
    const ring = drawRing(wetDry);
    const wet = ring.arcs[0];
    expect(wet.track).toBe(0);
    // One move and one arc: continuous, not split at 1 January.
    expect(wet.path.match(/A /g)?.length).toBe(1);
    expect(wet.path).toMatch(/^M \S+ \S+ A \d+ \d+ 0 0 1 /);
    // Its middle lies just past the top of the ring (mid-January), so the badge is near twelve o'clock.
    expect(wet.badge.y).toBeLessThan(RING.centre - 80);
    expect(ring.gaps).toEqual([]);
    expect(ring.tracks).toBe(1);
  });

  it('should use the large-arc flag for a season longer than half the year', () => {
    expect(arcPath(0, 200, 50)).toContain(' 0 1 1 ');
    expect(arcPath(0, 100, 50)).toContain(' 0 0 1 ');
  });

  it('should draw a whole-year season as two half arcs', () => {
    expect(arcPath(0, 366, 50).match(/A /g)?.length).toBe(2);
  });

  it('should push an overlapping season to an inner track', () => {
    const ring = drawRing([...wetDry, { name: 'Planting', start: '04-15', end: '05-15' }]);
    expect(ring.arcs.map((arc) => arc.track)).toEqual([0, 0, 1]);
    expect(ring.tracks).toBe(2);
  });

  it('should find an uncovered run across the year end as one gap', () => {
    const runs = uncoveredRuns([spanOf('01-11', '11-30')!]);
    // 1 Dec – 10 Jan: 31 + 10 days, starting at day 335.
    expect(runs).toEqual([{ start: 335, days: 41 }]);
    expect(drawRing([{ name: 'Long', start: '01-11', end: '11-30' }]).gaps.length).toBe(1);
  });

  it('should treat 29 February as a day to cover', () => {
    expect(uncoveredRuns([spanOf('03-01', '02-28')!])).toEqual([{ start: 59, days: 1 }]);
  });

  it('should find the whole year uncovered when there are no seasons', () => {
    expect(uncoveredRuns([])).toEqual([{ start: 0, days: 366 }]);
  });

  it('should see overlap between two wrapping seasons', () => {
    expect(spansOverlap(spanOf('12-01', '01-31')!, spanOf('01-15', '02-15')!)).toBe(true);
    expect(spansOverlap(spanOf('12-01', '01-31')!, spanOf('02-01', '11-30')!)).toBe(false);
  });

  it('should skip a season whose dates are not yet valid', () => {
    expect(drawRing([{ name: 'Half-typed', start: '11-0', end: '04-30' }]).arcs).toEqual([]);
  });

  it('should mark twelve months with their letters', () => {
    expect(drawRing([]).months.map((m) => m.label.text).join('')).toBe('JFMAMJJASOND');
  });
});
