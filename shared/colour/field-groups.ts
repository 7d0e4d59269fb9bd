import { hueFamily, HUE_FAMILY_ORDER, type HueFamily } from './colour-name.js';
import { labFromTuple } from './lab.js';

/** Field chips of one hue family, as the card and the browse page show them. */
export interface HueFamilyGroup<T> {
  family: HueFamily;
  chips: T[];
}

/**
 * The field chips (those without a parent) grouped by hue family in card order (`HUE_FAMILY_ORDER`,
 * greys last), each group in list order; families without a chip are left out.
 */
export function fieldChipsByFamily<T extends { parent: string | null; lab: readonly [number, number, number] }>(chips: readonly T[]): HueFamilyGroup<T>[] {
  const groups = new Map<HueFamily, T[]>(HUE_FAMILY_ORDER.map((family) => [family, []]));
  for (const chip of chips) if (chip.parent === null) groups.get(hueFamily(labFromTuple(chip.lab)))!.push(chip);
  return [...groups].filter(([, list]) => list.length > 0).map(([family, list]) => ({ family, chips: list }));
}
