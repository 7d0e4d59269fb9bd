import type { DriftAnswer, DriftGroup, DriftPoint } from '../../../../../shared/api/analysis-answers.js';
import { GROUP_COLOURS, GROUP_MARKERS, groupSeries, squareRange } from './drift-series';

function group(season: string, seasonYear: number, first: string, last: string): DriftGroup {
  return { season, seasonYear, seasonLabel: `${season} ${seasonYear}`, n: 3, meanLab: [40, 1, 0], meanLch: [40, 1, 0], meanHex: '#777777', spreadDeltaE00: 1, firstObservedAt: first, lastObservedAt: last };
}

function point(id: number, season: string | null, a: number, b: number): DriftPoint {
  return { readingId: id, season, seasonYear: season ? 2025 : null, observedAt: '2025-01-01T00:00:00Z', lab: [40, a, b], lch: [40, Math.hypot(a, b), 0], hex: '#777777' };
}

const answer = {
  groups: [group('wet', 2025, '2025-01-01T00:00:00Z', '2025-01-03T00:00:00Z'), group('dry', 2025, '2025-06-01T00:00:00Z', '2025-06-01T00:00:00Z')],
  points: [point(1, 'wet', 0, 0), point(2, 'wet', 2, 0), point(3, 'wet', 1, 1), point(4, 'dry', 5, 5), point(5, null, 9, 9)],
} as DriftAnswer;

describe('drift series', () => {
  it('should give each group its own colour and marker, in order', () => {
    const series = groupSeries(answer);
    expect(series.map((s) => [s.style.label, s.style.colour, s.style.marker])).toEqual([
      ['wet 2025', GROUP_COLOURS[0], GROUP_MARKERS[0]],
      ['dry 2025', GROUP_COLOURS[1], GROUP_MARKERS[1]],
    ]);
  });

  it('should put each reading in its own group and leave unseasoned readings out', () => {
    const series = groupSeries(answer);
    expect(series[0].points.map((p) => p.readingId)).toEqual([1, 2, 3]);
    expect(series[1].points.map((p) => p.readingId)).toEqual([4]);
  });

  it('should draw an ellipse only for a group of three or more', () => {
    const series = groupSeries(answer);
    expect(series[0].ellipse).not.toBeNull();
    expect(series[0].outline.length).toBeGreaterThan(10);
    expect(series[1].ellipse).toBeNull();
  });

  it('should place a group’s mean half-way through its time span', () => {
    expect(groupSeries(answer)[0].midTime).toBe(Date.parse('2025-01-02T00:00:00Z'));
  });

  it('should give a* and b* ranges of equal length around everything drawn', () => {
    const range = squareRange(groupSeries(answer));
    expect(range.a[1] - range.a[0]).toBeCloseTo(range.b[1] - range.b[0], 9);
    expect(Number.isInteger(range.a[0]) && Number.isInteger(range.b[1])).toBe(true);
    expect(range.a[0]).toBeLessThan(0);
    expect(range.b[1]).toBeGreaterThan(5);
  });
});
