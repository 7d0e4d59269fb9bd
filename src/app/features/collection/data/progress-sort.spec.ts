import type { PlantProgress } from '../../../../../shared/api/plant-sheet-answers.js';
import { sortProgress } from './progress-sort';

const row = (accessionNumber: string, plantLabel: string, done: number, state: PlantProgress['state']): PlantProgress => ({
  plantId: 1,
  plantLabel,
  accessionId: 1,
  accessionNumber,
  accessionName: 'Test',
  siteId: 1,
  siteCode: 'T',
  season: 'Wet',
  seasonYear: 2026,
  seasonLabel: 'Wet 2026–27',
  colour: { done, skipped: 0, total: 10 },
  descriptors: { done: 0, skipped: 0, total: 5 },
  state,
});

describe('progress table sort', () => {
  const rows = [row('HL-0010', 'P1', 3, 'partial'), row('HL-0002', 'P2', 10, 'complete'), row('HL-0002', 'P10', 0, 'not-started')];

  it('should sort accession numbers and plant labels as numbers read', () => {
    expect(sortProgress(rows, 'accession', 'asc').map((r) => `${r.accessionNumber} ${r.plantLabel}`)).toEqual(['HL-0002 P2', 'HL-0002 P10', 'HL-0010 P1']);
  });

  it('should put the least done first when sorting by colour characters ascending, the most done first descending', () => {
    expect(sortProgress(rows, 'colour', 'asc').map((r) => r.colour.done)).toEqual([0, 3, 10]);
    expect(sortProgress(rows, 'colour', 'desc').map((r) => r.colour.done)).toEqual([10, 3, 0]);
  });

  it('should order states fully, partly, not started', () => {
    expect(sortProgress(rows, 'state', 'asc').map((r) => r.state)).toEqual(['complete', 'partial', 'not-started']);
  });
});
