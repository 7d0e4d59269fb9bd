// Sorting the collection progress table, kept apart from the page so it is tested alone.
import type { PlantProgress, ProgressState } from '../../../../../shared/api/plant-sheet-answers.js';
import { settledPercent } from '../../../shared/collection/sheet-progress';

/** The columns the table sorts by. */
export type ProgressColumn = 'accession' | 'plant' | 'site' | 'state' | 'colour' | 'descriptors' | 'percent';

/** Fully characterised first when ascending, then partly, then not started. */
const STATE_ORDER: Record<ProgressState, number> = { complete: 0, partial: 1, 'not-started': 2 };

const byText = (a: string, b: string) => a.localeCompare(b, 'en', { numeric: true });

function compare(column: ProgressColumn, a: PlantProgress, b: PlantProgress): number {
  switch (column) {
    case 'accession':
      return byText(a.accessionNumber, b.accessionNumber) || byText(a.plantLabel, b.plantLabel);
    case 'plant':
      return byText(a.plantLabel, b.plantLabel) || byText(a.accessionNumber, b.accessionNumber);
    case 'site':
      return byText(a.siteCode, b.siteCode);
    case 'state':
      return STATE_ORDER[a.state] - STATE_ORDER[b.state];
    case 'colour':
      return a.colour.done - b.colour.done;
    case 'descriptors':
      return a.descriptors.done - b.descriptors.done;
    case 'percent':
      return settledPercent(a) - settledPercent(b);
  }
}

/** The rows sorted by a column (ties by accession number and plant label), ascending or descending. */
export function sortProgress(rows: readonly PlantProgress[], column: ProgressColumn, direction: 'asc' | 'desc' | ''): PlantProgress[] {
  const sign = direction === 'desc' ? -1 : 1;
  return [...rows].sort((a, b) => sign * compare(column, a, b) || compare('accession', a, b));
}
