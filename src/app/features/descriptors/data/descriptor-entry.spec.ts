import type { Descriptor } from '../../../../../shared/api/descriptor-answers.js';
import {
  blankEntry,
  defaultUnit,
  entryUnits,
  observationOf,
  orderForEntry,
  parseTyped,
  ratioOf,
  ratioSource,
  ratioText,
  shownIn,
  siOf,
  switchUnit,
  typeInto,
} from './descriptor-entry';

function descriptor(id: number, code: string, label: string, kind: Descriptor['kind'], parts: [string, string] | null = null): Descriptor {
  return {
    id,
    code,
    label,
    object: 'the third fully opened leaf',
    kind,
    categories: [],
    numeratorCode: parts?.[0] ?? null,
    denominatorCode: parts?.[1] ?? null,
    howToMeasure: '',
    caution: null,
    active: true,
    sortOrder: id * 10,
    characterId: null,
  };
}

const petiole = descriptor(1, 'petiole.length', 'Petiole length', 'length');
const sheath = descriptor(2, 'sheath.length', 'Sheath length', 'length');
// The figures: petiole about 40 in, sheath about 28 in, ratio 0.70 — so the 0.70 is sheath over petiole.
const ratio = descriptor(3, 'sheath.petiole.ratio', 'Sheath-to-petiole ratio', 'ratio', ['sheath.length', 'petiole.length']);

describe('descriptor entry', () => {
  it('should offer centimetres or inches for a length and kilograms or pounds for a mass', () => {
    expect(entryUnits('length')).toEqual(['cm', 'in']);
    expect(entryUnits('mass')).toEqual(['kg', 'lb']);
    expect(entryUnits('category')).toEqual([]);
  });

  it('should start a row in the person’s system', () => {
    expect(defaultUnit('length', 'imperial')).toBe('in');
    expect(defaultUnit('mass', 'metric')).toBe('kg');
    expect(defaultUnit('count', 'imperial')).toBe('count');
    expect(defaultUnit('ratio', 'metric')).toBeNull();
  });

  it('should read a decimal comma and refuse words', () => {
    expect(parseTyped('40,5')).toBe(40.5);
    expect(parseTyped('  ')).toBeNull();
    expect(parseTyped('forty')).toBeNaN();
    expect(parseTyped('-3')).toBeNaN();
  });

  it('should show 40 in as 101.6 cm (NIST SP 811 B.8: 1 in = 0.0254 m exactly)', () => {
    expect(shownIn({ value: 40, unit: 'in' }, 'cm')).toBe('101.6');
    expect(shownIn({ value: 40, unit: 'in' }, 'in')).toBe('40');
  });

  it('should show 1 kg as 2.2 lb (NIST SP 811 B.8: 1 lb = 0.45359237 kg exactly)', () => {
    expect(shownIn({ value: 1, unit: 'kg' }, 'lb')).toBe('2.2');
    expect(siOf({ value: 2, unit: 'lb' })).toBeCloseTo(0.90718474, 10);
  });

  it('should compute sheath 28 in over petiole 40 in as 0.70 (common practice, no source)', () => {
    const typed = new Map([
      ['petiole.length', { value: 40, unit: 'in' as const }],
      ['sheath.length', { value: 28, unit: 'in' as const }],
    ]);
    expect(ratioText(ratioOf(ratio, typed))).toBe('0.70');
  });

  it('should compute the ratio of parts typed in different units through SI', () => {
    // 28 in is 71.12 cm exactly.
    const typed = new Map([
      ['petiole.length', { value: 40, unit: 'in' as const }],
      ['sheath.length', { value: 71.12, unit: 'cm' as const }],
    ]);
    expect(ratioOf(ratio, typed)).toBeCloseTo(28 / 40, 10);
  });

  it('should wait for both parts and never divide by zero', () => {
    expect(ratioOf(ratio, new Map([['petiole.length', { value: 40, unit: 'in' as const }]]))).toBeNull();
    const zero = new Map([
      ['sheath.length', { value: 28, unit: 'in' as const }],
      ['petiole.length', { value: 0, unit: 'in' as const }],
    ]);
    expect(ratioOf(ratio, zero)).toBeNull();
    expect(ratioText(null)).toBe('—');
  });

  it('should say which descriptors a ratio is computed from', () => {
    expect(ratioSource(ratio, [petiole, sheath, ratio])).toBe('computed from sheath length and petiole length');
  });
});

describe('entry rows', () => {
  it('should read typed text in the unit shown', () => {
    const row = typeInto(blankEntry('length', 'imperial'), '40');
    expect(row.typed).toEqual({ value: 40, unit: 'in' });
    expect(row.invalid).toBe(false);
  });

  it('should mark text that is not a number and keep no value', () => {
    const row = typeInto(blankEntry('length', 'metric'), '12 cm');
    expect(row.typed).toBeNull();
    expect(row.invalid).toBe(true);
  });

  it('should keep the typed number when the unit is switched, reading it in the new unit', () => {
    // A recorder who typed 40 with the toggle on cm, then sees the tape was in inches, means 40 in.
    const row = switchUnit(typeInto(blankEntry('length', 'metric'), '40'), 'in');
    expect(row.text).toBe('40');
    expect(row.unit).toBe('in');
    expect(row.typed).toEqual({ value: 40, unit: 'in' });
  });

  it('should refuse a count that is not a whole number, and an implausible value, before sending', () => {
    const count = descriptor(8, 'suckers.count', 'Number of suckers', 'count');
    expect(typeInto(blankEntry('count', 'metric'), '2.5', count).problem).toBe('Number of suckers is a count: type a whole number.');
    expect(observationOf(count, typeInto(blankEntry('count', 'metric'), '2.5', count), 1, null)).toEqual([]);
    const row = typeInto({ ...blankEntry('length', 'metric'), unit: 'm' }, '127', petiole);
    expect(row.problem).toMatch(/127 m is not a plausible petiole length: expected 0.02 m to 3 m/);
    expect(observationOf(petiole, row, 1, null)).toEqual([]);
  });

  it('should take a new value in the new unit once the person types again', () => {
    const row = typeInto(switchUnit(typeInto(blankEntry('length', 'imperial'), '40'), 'cm'), '100');
    expect(row.typed).toEqual({ value: 100, unit: 'cm' });
  });
});

describe('entry order and what is saved', () => {
  const blade = descriptor(4, 'leaf.blade.length', 'Leaf blade length', 'length');
  const shape = { ...descriptor(5, 'corm.shape', 'Corm shape', 'category'), categories: [{ id: 'round', label: 'Round' }] };

  it('should put a ratio right after the later of its parts', () => {
    expect(orderForEntry([ratio, petiole, sheath, blade]).map((d) => d.code)).toEqual(['petiole.length', 'sheath.length', 'sheath.petiole.ratio', 'leaf.blade.length']);
  });

  it('should send a measured value as typed, with its unit', () => {
    const entry = typeInto(blankEntry('length', 'imperial'), '40');
    expect(observationOf(petiole, entry, 3, 9)).toEqual([{ accessionId: 3, plantId: 9, descriptorId: 1, value: 40, unit: 'in' }]);
  });

  it('should send a chosen category by its id and nothing for an empty row', () => {
    expect(observationOf(shape, { ...blankEntry('category', 'metric'), category: 'round' }, 3, null)).toEqual([
      { accessionId: 3, plantId: null, descriptorId: 5, category: 'round' },
    ]);
    expect(observationOf(petiole, blankEntry('length', 'metric'), 3, null)).toEqual([]);
  });

  it('should never send a ratio, which is computed', () => {
    expect(observationOf(ratio, typeInto(blankEntry('length', 'metric'), '1'), 3, null)).toEqual([]);
  });
});
