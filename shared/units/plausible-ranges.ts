// How large a descriptor's value can plausibly be, in SI, so a slip of the unit or a stray digit
// (a 127 m petiole) is caught before it is stored. These bounds are our own, from memory of what
// taro plants measure, set wide on purpose: they catch mistakes, they do not judge unusual plants.
import { fromSi, toSi, type Quantity, type Unit } from './units.js';

/** An inclusive range in SI (metres, kilograms, a count). */
export interface PlausibleRange {
  min: number;
  max: number;
}

/** Ranges of the seeded descriptors, by code (our own, from memory; see above). */
export const PLAUSIBLE_BY_CODE: Readonly<Record<string, PlausibleRange>> = {
  'plant.height': { min: 0.05, max: 4 },
  'petiole.length': { min: 0.02, max: 3 },
  'petiole.ring.basal.reach': { min: 0, max: 0.5 },
  'sheath.length': { min: 0.01, max: 2 },
  'leaf.blade.length': { min: 0.02, max: 2 },
  'leaf.blade.width': { min: 0.02, max: 1.5 },
  'suckers.count': { min: 0, max: 100 },
  'stolons.count': { min: 0, max: 100 },
  'corm.mass': { min: 0.005, max: 15 },
  'corm.length': { min: 0.01, max: 0.8 },
  'cormels.count': { min: 0, max: 300 },
  'cormels.mass': { min: 0, max: 30 },
};

/** Ranges for descriptors an admin adds, by what they measure (our own, wider still). */
export const PLAUSIBLE_BY_QUANTITY: Readonly<Record<Quantity, PlausibleRange>> = {
  length: { min: 0, max: 5 },
  mass: { min: 0, max: 50 },
  count: { min: 0, max: 1000 },
};

/** The plausible range of a descriptor's SI value. */
export function plausibleRange(code: string, quantity: Quantity): PlausibleRange {
  return PLAUSIBLE_BY_CODE[code] ?? PLAUSIBLE_BY_QUANTITY[quantity];
}

function inUnit(valueSi: number, unit: Unit): string {
  const v = fromSi(valueSi, unit);
  const shown = Number.isInteger(v) ? String(v) : String(Math.round(v * 100) / 100);
  return unit === 'count' ? shown : `${shown} ${unit}`;
}

/**
 * Why a typed value is not plausible for a descriptor, naming the descriptor, the value and the
 * range in the unit it was typed in; null when it is plausible.
 */
export function implausibleValue(d: { code: string; label: string }, quantity: Quantity, value: number, unit: Unit): string | null {
  const range = plausibleRange(d.code, quantity);
  const si = toSi(value, unit);
  if (si >= range.min - 1e-12 && si <= range.max + 1e-12) return null;
  return `${inUnit(si, unit)} is not a plausible ${d.label.toLowerCase()}: expected ${inUnit(range.min, unit)} to ${inUnit(range.max, unit)}`;
}
