// Words and choices of the plant sheet, kept apart from the page so they can be tested alone.
import type { PlantProgress, PlantSheet, ProgressCount, SheetRow } from '../../../../shared/api/plant-sheet-answers.js';

/** "14 of 26 colour characters, 9 of 31 descriptors" (skipped ones said apart). */
export function progressWords(p: Pick<PlantProgress, 'colour' | 'descriptors'>): string {
  const part = (c: ProgressCount, what: string) => `${c.done} of ${c.total} ${what}${c.skipped ? ` (${c.skipped} skipped)` : ''}`;
  return `${part(p.colour, 'colour characters')}, ${part(p.descriptors, 'descriptors')}`;
}

/** The share of rows done or skipped, 0–100, rounded down so 100 means nothing is left. */
export function settledPercent(p: Pick<PlantProgress, 'colour' | 'descriptors'>): number {
  const total = p.colour.total + p.descriptors.total;
  if (total === 0) return 100;
  const settled = p.colour.done + p.colour.skipped + p.descriptors.done + p.descriptors.skipped;
  return Math.floor((settled * 100) / total);
}

/** The first colour character still to do after `characterId` in walk order, wrapping round; null when none is left. */
export function nextColourTodo(sheet: PlantSheet, characterId: number | null): SheetRow | null {
  const rows = sheet.rows;
  const from = rows.findIndex((r) => r.colour?.characterId === characterId);
  for (let step = 1; step <= rows.length; step++) {
    const row = rows[(from + step + rows.length) % rows.length]!;
    if (row.colour?.status === 'todo' && row.colour.characterId !== characterId) return row;
  }
  return null;
}

/** The first row with anything still to do, in walk order; null when the plant is done. */
export function firstTodo(sheet: PlantSheet): SheetRow | null {
  return sheet.rows.find((r) => r.colour?.status === 'todo' || r.descriptor?.status === 'todo') ?? null;
}
