import type { DescriptorValue, PlantDescriptors, UnitSystem } from '../../../../shared/api/descriptor-answers.js';

/** One descriptor across plants: its label, whether it is derived, and each plant's value as text (null: none yet). */
export interface ValueRow {
  descriptorId: number;
  label: string;
  derived: boolean;
  cells: (string | null)[];
}

/**
 * The latest values as a table for a desk: one row per descriptor (in the order first met), one
 * column per plant, each value in the person's system as the server formatted it.
 */
export function valueTable(plants: readonly PlantDescriptors[], system: UnitSystem): ValueRow[] {
  const rows = new Map<number, ValueRow>();
  plants.forEach((plant, column) => {
    for (const value of plant.values) {
      const row = rows.get(value.descriptorId) ?? { descriptorId: value.descriptorId, label: value.label, derived: value.derived, cells: plants.map(() => null) };
      row.cells[column] = shownValue(value, system);
      rows.set(value.descriptorId, row);
    }
  });
  return [...rows.values()];
}

/** A value in the person's system. */
export function shownValue(value: DescriptorValue, system: UnitSystem): string {
  return value.formatted[system];
}
