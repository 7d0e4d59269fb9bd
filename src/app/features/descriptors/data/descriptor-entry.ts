import type { Descriptor, DescriptorKind, Unit, UnitSystem } from '../../../../../shared/api/descriptor-answers.js';
import { KIND_QUANTITY } from '../../../../../shared/api/descriptor-answers.js';
import { implausibleValue } from '../../../../../shared/units/plausible-ranges.js';
import { formatRatio, fromSi, toSi } from '../../../../../shared/units/units.js';
import type { NewObservation } from '../../../shared/descriptors/descriptors-api';

/** A measured value as the recorder typed it: the number and the unit it was typed in. */
export interface TypedValue {
  value: number;
  unit: Unit;
}

/** The unit choices offered for a kind, metric first (the row's unit toggle). */
export function entryUnits(kind: DescriptorKind): Unit[] {
  switch (kind) {
    case 'length':
      return ['cm', 'in'];
    case 'mass':
      return ['kg', 'lb'];
    case 'count':
      return ['count'];
    default:
      return [];
  }
}

/** The unit a row starts in for the person's system. */
export function defaultUnit(kind: DescriptorKind, system: UnitSystem): Unit | null {
  const units = entryUnits(kind);
  if (units.length === 0) return null;
  return units.length === 1 || system === 'metric' ? units[0] : units[1];
}

/**
 * Reads a typed number, accepting a decimal comma ("40,5"). Null for an empty field; NaN for
 * text that is not a number, so the row can say so.
 */
export function parseTyped(text: string): number | null {
  const trimmed = text.trim().replace(',', '.');
  if (trimmed === '') return null;
  return /^\d+(\.\d*)?$|^\.\d+$/.test(trimmed) ? Number(trimmed) : Number.NaN;
}

/**
 * The typed value shown in another unit: the same number when the unit is the one it was typed in,
 * otherwise converted through SI and cut to two decimals (e.g. 40 in → "101.6" cm). What is sent to
 * the server stays the value as typed, with its unit.
 */
export function shownIn(typed: TypedValue, unit: Unit): string {
  if (typed.unit === unit) return String(typed.value);
  const converted = fromSi(toSi(typed.value, typed.unit), unit);
  return String(Math.round(converted * 100) / 100);
}

/** A typed value in SI (metres, kilograms or the count). */
export function siOf(typed: TypedValue): number {
  return toSi(typed.value, typed.unit);
}

/**
 * A ratio descriptor's value from the typed parts, or null until both are there (and the
 * denominator is not zero). Both parts are in SI first, so 40 in over 71.12 cm is 40 in over 28 in.
 */
export function ratioOf(ratio: Descriptor, typedByCode: ReadonlyMap<string, TypedValue>): number | null {
  if (ratio.kind !== 'ratio' || !ratio.numeratorCode || !ratio.denominatorCode) return null;
  const numerator = typedByCode.get(ratio.numeratorCode);
  const denominator = typedByCode.get(ratio.denominatorCode);
  if (!numerator || !denominator) return null;
  const below = siOf(denominator);
  return below === 0 ? null : siOf(numerator) / below;
}

/** A ratio to show, to two decimals ("0.70"), or a dash while its parts are missing. */
export function ratioText(ratio: number | null): string {
  return ratio === null ? '—' : formatRatio(ratio);
}

/** "computed from petiole length and sheath length", naming the parts by their labels. */
export function ratioSource(ratio: Descriptor, catalogue: readonly Descriptor[]): string {
  const name = (code: string | null) => catalogue.find((d) => d.code === code)?.label.toLowerCase() ?? code ?? '?';
  return `computed from ${name(ratio.numeratorCode)} and ${name(ratio.denominatorCode)}`;
}

/** One row of the entry form: the text in the field, the unit shown, what it means, or the category chosen. */
export interface RowEntry {
  text: string;
  /** The unit the field shows; null for categories and ratios. */
  unit: Unit | null;
  /** The value as typed, in the unit it was typed in; null while empty or not a number. */
  typed: TypedValue | null;
  /** Whether the text is not a number (the row says so). */
  invalid: boolean;
  /** Why a number cannot be sent (not a whole count, out of the plausible range), in words; null when it can. */
  problem?: string | null;
  category: string | null;
}

/** An empty row in the person's system. */
export function blankEntry(kind: DescriptorKind, system: UnitSystem): RowEntry {
  return { text: '', unit: defaultUnit(kind, system), typed: null, invalid: false, category: null };
}

/**
 * The row after the person typed into its field: the text is read in the unit shown. With the
 * descriptor, a count that is not whole or a value outside its plausible range gets a `problem`
 * (the same rules the server applies), so nothing doomed is sent.
 */
export function typeInto(entry: RowEntry, text: string, d?: Pick<Descriptor, 'code' | 'label' | 'kind'>): RowEntry {
  const value = parseTyped(text);
  const number = value !== null && !Number.isNaN(value) && entry.unit !== null;
  const typed = number ? { value: value!, unit: entry.unit! } : null;
  return { ...entry, text, typed, invalid: value !== null && Number.isNaN(value), problem: typed && d ? problemOf(d, typed) : null };
}

function problemOf(d: Pick<Descriptor, 'code' | 'label' | 'kind'>, typed: TypedValue): string | null {
  const quantity = KIND_QUANTITY[d.kind];
  if (!quantity) return null;
  if (quantity === 'count' && !Number.isInteger(typed.value)) return `${d.label} is a count: type a whole number.`;
  const implausible = implausibleValue(d, quantity, typed.value, typed.unit);
  return implausible ? `${implausible[0]!.toUpperCase()}${implausible.slice(1)}.` : null;
}

/**
 * The row in another unit. The number typed stays as it is and is read in the new unit: a recorder
 * who switches the unit after typing meant that number in that unit, so nothing is converted.
 */
export function switchUnit(entry: RowEntry, unit: Unit, d?: Pick<Descriptor, 'code' | 'label' | 'kind'>): RowEntry {
  if (entry.unit === unit) return entry;
  return typeInto({ ...entry, unit }, entry.text, d);
}

/** Descriptors in catalogue order, each ratio moved to just after the later of its two parts, so it sits under the values it is computed from. */
export function orderForEntry(descriptors: readonly Descriptor[]): Descriptor[] {
  const ordered = descriptors.filter((d) => d.kind !== 'ratio');
  for (const ratio of descriptors.filter((d) => d.kind === 'ratio')) {
    const after = Math.max(...[ratio.numeratorCode, ratio.denominatorCode].map((code) => ordered.findIndex((d) => d.code === code)));
    ordered.splice(after < 0 ? ordered.length : after + 1, 0, ratio);
  }
  return ordered;
}

/** The observation a row would save, if it holds a value (ratios never do). */
export function observationOf(d: Descriptor, entry: RowEntry | undefined, accessionId: number, plantId: number | null): NewObservation[] {
  if (!entry || d.kind === 'ratio') return [];
  const base = { accessionId, plantId, descriptorId: d.id };
  if (d.kind === 'category') return entry.category ? [{ ...base, category: entry.category }] : [];
  return entry.typed && !entry.problem ? [{ ...base, value: entry.typed.value, unit: entry.typed.unit }] : [];
}
