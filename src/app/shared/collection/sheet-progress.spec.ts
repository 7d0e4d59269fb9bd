import type { PlantSheet, SheetRow } from '../../../../shared/api/plant-sheet-answers.js';
import { firstTodo, nextColourTodo, progressWords, settledPercent } from './sheet-progress';

const colourRow = (id: number, status: 'done' | 'todo' | 'skipped'): SheetRow => ({
  key: `c${id}`,
  sortOrder: id * 10,
  colour: { characterId: id, code: `test.${id}`, label: `Test ${id}`, organ: 'leaf', caution: null, status, reading: null, skip: null },
  descriptor: null,
});

const sheetOf = (rows: SheetRow[]): PlantSheet => ({
  plant: { id: 1, label: 'P1', plantedOn: '2025-01-01' },
  accession: { id: 1, accessionNumber: 'HL-T', name: 'Test' },
  site: { id: 1, code: 'T', name: 'Test plot' },
  rows,
  progress: {} as PlantSheet['progress'],
});

describe('sheet progress', () => {
  it('should say progress as the sheet shows it', () => {
    expect(progressWords({ colour: { done: 14, skipped: 0, total: 26 }, descriptors: { done: 9, skipped: 0, total: 31 } })).toBe('14 of 26 colour characters, 9 of 31 descriptors');
    expect(progressWords({ colour: { done: 1, skipped: 2, total: 3 }, descriptors: { done: 0, skipped: 0, total: 1 } })).toBe('1 of 3 colour characters (2 skipped), 0 of 1 descriptors');
  });

  it('should reach 100 only when every row is done or skipped', () => {
    expect(settledPercent({ colour: { done: 25, skipped: 0, total: 26 }, descriptors: { done: 31, skipped: 0, total: 31 } })).toBe(98);
    expect(settledPercent({ colour: { done: 25, skipped: 1, total: 26 }, descriptors: { done: 31, skipped: 0, total: 31 } })).toBe(100);
  });

  it('should offer the next colour character still to do, after the one just read, wrapping round', () => {
    const sheet = sheetOf([colourRow(1, 'todo'), colourRow(2, 'done'), colourRow(3, 'skipped'), colourRow(4, 'todo'), colourRow(5, 'todo')]);
    expect(nextColourTodo(sheet, 1)?.colour?.characterId).toBe(4);
    expect(nextColourTodo(sheet, 5)?.colour?.characterId).toBe(1);
    expect(nextColourTodo(sheetOf([colourRow(1, 'todo')]), 1)).toBeNull();
    expect(firstTodo(sheet)?.key).toBe('c1');
  });
});
