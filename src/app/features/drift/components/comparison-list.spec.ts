import { TestBed } from '@angular/core/testing';

import type { DriftAnswer, DriftGroup } from '../../../../../shared/api/analysis-answers.js';
import { ComparisonList } from './comparison-list';

function group(season: string, seasonYear: number, n: number): DriftGroup {
  return { season, seasonYear, seasonLabel: `${season} ${seasonYear}`, n, meanLab: [40, 25, -10], meanLch: [40, 26.9, 338], meanHex: '#7b3f6e', spreadDeltaE00: 0.3, firstObservedAt: '2025-01-01T00:00:00Z', lastObservedAt: '2025-02-01T00:00:00Z' };
}

const answer = {
  groups: [group('Dry', 2025, 8), group('Wet', 2025, 8), group('Dry', 2026, 2), group('Wet', 2026, 6)],
  comparisons: [
    { from: { season: 'Dry', seasonYear: 2025, seasonLabel: 'Dry 2025' }, to: { season: 'Wet', seasonYear: 2025, seasonLabel: 'Wet 2025' }, kind: 'consecutive', deltaE00: 6.05, pValue: 0.0002, test: 'exact', permutations: 12870, drift: true, reason: 'ΔE00 6.05 is at least 1.8 and unlikely by chance' },
    { from: { season: 'Wet', seasonYear: 2025, seasonLabel: 'Wet 2025' }, to: { season: 'Dry', seasonYear: 2026, seasonLabel: 'Dry 2026' }, kind: 'consecutive', deltaE00: 5.1, pValue: 0.04, test: 'exact', permutations: 45, drift: false, reason: 'Dry 2026 has fewer than 3 readings' },
    { from: { season: 'Wet', seasonYear: 2025, seasonLabel: 'Wet 2025' }, to: { season: 'Wet', seasonYear: 2026, seasonLabel: 'Wet 2026' }, kind: 'same-season', deltaE00: 0.13, pValue: 0.47, test: 'exact', permutations: 45, drift: false, reason: 'ΔE00 0.13 is below 1.8' },
  ],
  minGroupSize: 3,
} as unknown as DriftAnswer;

describe('ComparisonList', () => {
  it('should say each verdict in a word beside an icon, with the numbers and the reason', async () => {
    const fixture = TestBed.createComponent(ComparisonList);
    fixture.componentRef.setInput('answer', answer);
    await fixture.whenStable();
    const items = Array.from((fixture.nativeElement as HTMLElement).querySelectorAll('li'));
    expect(items.map((li) => li.getAttribute('data-state'))).toEqual(['drift', 'too-few', 'steady']);
    expect(items.map((li) => li.querySelector('.verdict strong')!.textContent!.trim())).toEqual(['Drift', 'Too few readings', 'Steady']);
    expect(items.map((li) => li.querySelector('.verdict mat-icon')!.textContent!.trim())).toEqual(['trending_up', 'hourglass_empty', 'horizontal_rule']);
    expect(items[0].textContent).toContain('Dry 2025 → Wet 2025');
    expect(items[0].textContent).toContain('ΔE00 6.05 · p < 0.001');
    expect(items[2].textContent).toContain('same season, a year apart');
    expect(items[1].textContent).toContain('Dry 2026 has fewer than 3 readings');
  });
});
