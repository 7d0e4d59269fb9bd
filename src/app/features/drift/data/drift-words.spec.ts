import type { DriftAnswer, DriftComparison, DriftGroup } from '../../../../../shared/api/analysis-answers.js';
import { driftState, emptyReason, groupLabel, hueText, pValueText, summaryWords } from './drift-words';

function group(season: string, seasonYear: number, n: number): DriftGroup {
  return { season, seasonYear, seasonLabel: `${season} ${seasonYear}`, n, meanLab: [40, 30, -10], meanLch: [40, 31.6, 341.6], meanHex: '#7b3f6e', spreadDeltaE00: 0.8, firstObservedAt: '2025-01-01T00:00:00Z', lastObservedAt: '2025-02-01T00:00:00Z' };
}

function comparison(drift: boolean, from = { season: 'wet', seasonYear: 2025, seasonLabel: 'wet 2025' }, to = { season: 'dry', seasonYear: 2025, seasonLabel: 'dry 2025' }): DriftComparison {
  return { from, to, kind: 'consecutive', deltaE00: 3.2, pValue: 0.01, test: 'exact', permutations: 20, drift, reason: '' };
}

function answer(groups: DriftGroup[], comparisons: DriftComparison[], points = 10): DriftAnswer {
  return {
    accessionId: 1,
    characterId: 1,
    siteId: null,
    groups,
    comparisons,
    points: Array.from({ length: points }, (_, i) => ({ readingId: i, season: 'wet', seasonYear: 2025, observedAt: '2025-01-01T00:00:00Z', lab: [40, 30, -10], lch: [40, 31.6, 341.6], hex: '#7b3f6e' })),
    unseasoned: 0,
    threshold: 1.8,
    alpha: 0.05,
    minGroupSize: 3,
  };
}

describe('drift words', () => {
  it('should say drift when the server flagged drift', () => {
    const a = answer([group('wet', 2025, 5), group('dry', 2025, 5)], [comparison(true)]);
    expect(driftState(a.comparisons[0], a)).toBe('drift');
    expect(summaryWords(a)).toBe('Drift in 1 of 1 comparison.');
  });

  it('should say steady when both groups are big enough and there is no drift', () => {
    const a = answer([group('wet', 2025, 3), group('dry', 2025, 4)], [comparison(false)]);
    expect(driftState(a.comparisons[0], a)).toBe('steady');
    expect(summaryWords(a)).toBe('No drift in 1 comparison.');
  });

  it('should say too few when either group is below the minimum size', () => {
    const a = answer([group('wet', 2025, 5), group('dry', 2025, 2)], [comparison(false)]);
    expect(driftState(a.comparisons[0], a)).toBe('too-few');
  });

  it('should print p-values to three decimals and tiny ones as below a thousandth', () => {
    expect(pValueText(0.04321)).toBe('p = 0.043');
    expect(pValueText(0.0004)).toBe('p < 0.001');
    expect(pValueText(1)).toBe('p = 1.000');
  });

  it('should name a group by season and year, and hide the hue of a near-grey', () => {
    expect(groupLabel({ season: 'wet', seasonYear: 2024, seasonLabel: 'wet 2024–25' })).toBe('wet 2024–25');
    expect(hueText(0.2, 123)).toBe('—');
    expect(hueText(12, 341.6)).toBe('342');
  });

  it('should tell no readings, no season groups and groups too small apart', () => {
    expect(emptyReason(answer([], [], 0))).toBe('no-readings');
    expect(emptyReason(answer([], [], 4))).toBe('no-groups');
    expect(emptyReason(answer([group('wet', 2025, 5), group('dry', 2025, 2)], [comparison(false)]))).toBe('too-small');
    expect(emptyReason(answer([group('wet', 2025, 5), group('dry', 2025, 3)], [comparison(false)]))).toBeNull();
  });
});
