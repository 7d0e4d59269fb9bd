/*
 * Units of the non-colour descriptors: what a recorder may type, how it becomes SI, and how an SI
 * value is shown in the person's chosen system. No zod and no Node/DOM imports: the client uses it.
 *
 * Factors: NIST Special Publication 811 (2008 edition), "Guide for the Use of the International
 * System of Units (SI)", Appendix B.8 (factors for units listed alphabetically), where the inch
 * and the avoirdupois pound are defined exactly in metres and kilograms.
 */

/** Units a value may be typed in. */
export const UNITS = ['mm', 'cm', 'm', 'in', 'g', 'kg', 'lb', 'count'] as const;
export type Unit = (typeof UNITS)[number];

/** What a unit measures. */
export type Quantity = 'length' | 'mass' | 'count';

/** How values are shown: centimetres and kilograms, or inches and pounds. */
export type UnitSystem = 'metric' | 'imperial';

/** NIST SP 811 (2008) Appendix B.8: inch (in) = 2.54 E−02 m, exactly. */
export const METRES_PER_INCH = 0.0254;

/** NIST SP 811 (2008) Appendix B.8: pound (avoirdupois) (lb) = 4.535 923 7 E−01 kg, exactly. */
export const KILOGRAMS_PER_POUND = 0.45359237;

/** Each unit's quantity and its size in the SI unit of that quantity (m, kg, or 1 for a count). */
export const UNIT_FACTORS: Readonly<Record<Unit, { quantity: Quantity; toSi: number }>> = {
  mm: { quantity: 'length', toSi: 0.001 },
  cm: { quantity: 'length', toSi: 0.01 },
  m: { quantity: 'length', toSi: 1 },
  in: { quantity: 'length', toSi: METRES_PER_INCH },
  g: { quantity: 'mass', toSi: 0.001 },
  kg: { quantity: 'mass', toSi: 1 },
  lb: { quantity: 'mass', toSi: KILOGRAMS_PER_POUND },
  count: { quantity: 'count', toSi: 1 },
};

/** The SI unit each quantity is stored in. */
export const SI_UNIT: Readonly<Record<Quantity, Unit>> = { length: 'm', mass: 'kg', count: 'count' };

/** The units that measure a quantity, in the order a form offers them. */
export function unitsOf(quantity: Quantity): Unit[] {
  return UNITS.filter((u) => UNIT_FACTORS[u].quantity === quantity);
}

/** What a unit measures. */
export function quantityOf(unit: Unit): Quantity {
  return UNIT_FACTORS[unit].quantity;
}

/**
 * Trims binary floating-point noise (28 × 0.0254 is 0.7111999999999999 in doubles) to 12
 * significant digits, far finer than any tape or balance reads, so 28 in is stored as 0.7112 m.
 */
export function tidy(value: number): number {
  return value === 0 ? 0 : Number(value.toPrecision(12));
}

/** A typed value in its unit as SI (metres, kilograms, or the count itself). */
export function toSi(value: number, unit: Unit): number {
  return tidy(value * UNIT_FACTORS[unit].toSi);
}

/** An SI value expressed in another unit of the same quantity. */
export function fromSi(valueSi: number, unit: Unit): number {
  return tidy(valueSi / UNIT_FACTORS[unit].toSi);
}

/**
 * The unit an SI value is shown in for a system: sensible for taro, where petioles, blades and
 * whole plants are measured with a tape in centimetres up to a few metres (our own choice).
 */
export function displayUnit(valueSi: number, quantity: Quantity, system: UnitSystem): Unit {
  const size = Math.abs(valueSi);
  if (quantity === 'count') return 'count';
  if (quantity === 'length') {
    if (system === 'imperial') return 'in';
    return size > 0 && size < 0.01 ? 'mm' : size < 3 ? 'cm' : 'm';
  }
  if (system === 'imperial') return 'lb';
  return size < 1 ? 'g' : 'kg';
}

/** Decimal places shown per unit (our own choice: about the resolution of a tape, ruler or field balance). */
const DECIMALS: Readonly<Record<Unit, number>> = { mm: 1, cm: 1, m: 2, in: 1, g: 0, kg: 2, lb: 2, count: 0 };

/** An SI value as text in the chosen system, e.g. 1.016 m → "101.6 cm" (metric) or "40.0 in" (imperial). */
export function formatSi(valueSi: number, quantity: Quantity, system: UnitSystem): string {
  const unit = displayUnit(valueSi, quantity, system);
  const shown = fromSi(valueSi, unit).toFixed(DECIMALS[unit]);
  return unit === 'count' ? shown : `${shown} ${unit}`;
}

/** A ratio of two measurements (no unit) as text, to two decimals. */
export function formatRatio(ratio: number): string {
  return ratio.toFixed(2);
}
