import { hueSector, HUE_SECTOR_ORDER, pickerOrder, type HueSector } from './chip-name.js';
import { labFromTuple } from './lab.js';

/** Field chips of one hue sector, as the card and the pickers show them. */
export interface HueSectorGroup<T> {
  /** The sector (`family` is kept as the property name the pickers bind to). */
  family: HueSector;
  chips: T[];
}

/**
 * The field chips (those without a parent) grouped by hue sector in card order
 * (`HUE_SECTOR_ORDER`, ash last), each group in picker order (light to dark, then strongest to
 * greyest); sectors without a chip are left out.
 */
export function fieldChipsBySector<T extends { parent: string | null; lab: readonly [number, number, number] }>(chips: readonly T[]): HueSectorGroup<T>[] {
  const groups = new Map<HueSector, T[]>(HUE_SECTOR_ORDER.map((sector) => [sector, []]));
  for (const chip of chips) if (chip.parent === null) groups.get(hueSector(labFromTuple(chip.lab)))!.push(chip);
  return [...groups]
    .filter(([, list]) => list.length > 0)
    .map(([family, list]) => ({ family, chips: list.sort((p, q) => pickerOrder(p.lab, q.lab)) }));
}
