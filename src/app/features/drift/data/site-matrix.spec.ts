import type { SiteComparisonAnswer } from '../../../../../shared/api/analysis-answers.js';
import { markedPairs, siteMatrix } from './site-matrix';

function site(siteId: number, siteCode: string) {
  return { siteId, siteCode, siteName: siteCode, n: 5, meanLab: [40, 30, -10] as [number, number, number], meanHex: '#7b3f6e', spreadDeltaE00: 0.7 };
}

const answer: SiteComparisonAnswer = {
  accessionId: 1,
  characterId: 1,
  season: null,
  seasonYear: null,
  seasonLabel: null,
  sites: [site(1, 'NORTH'), site(2, 'RIVER'), site(3, 'HILL')],
  deltaE00: [
    [0, 1.8, 0.6],
    [1.8, 0, 2.4],
    [0.6, 2.4, 0],
  ],
  pValue: [
    [1, 0.02, 0.5],
    [0.02, 1, 0.0001],
    [0.5, 0.0001, 1],
  ],
  threshold: 1.8,
};

describe('site matrix', () => {
  it('should mark a cell exactly at the threshold, and above it, with an icon and a word', () => {
    const rows = siteMatrix(answer);
    expect(rows[0].cells[1]).toMatchObject({ marked: true, word: 'differs', icon: 'warning', text: '1.80' });
    expect(rows[1].cells[2]).toMatchObject({ marked: true, word: 'differs', text: '2.40' });
  });

  it('should not mark a cell below the threshold', () => {
    expect(siteMatrix(answer)[0].cells[2]).toMatchObject({ marked: false, word: 'within', icon: 'check', text: '0.60' });
  });

  it('should never mark the diagonal', () => {
    const rows = siteMatrix({ ...answer, threshold: 0 });
    for (let i = 0; i < 3; i++) expect(rows[i].cells[i]).toMatchObject({ self: true, marked: false, text: '—' });
  });

  it('should describe each cell in full for a screen reader', () => {
    expect(siteMatrix(answer)[1].cells[2].label).toBe('RIVER to HILL: ΔE00 2.40, at or above the threshold 1.8, p < 0.001');
  });

  it('should count each marked pair once', () => {
    expect(markedPairs(answer)).toBe(2);
    expect(markedPairs({ ...answer, threshold: 5 })).toBe(0);
  });
});
