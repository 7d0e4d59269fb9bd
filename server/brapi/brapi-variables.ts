// Observation variables: each colour character as four variables — L*, a*, b* (CIELAB, D65 white,
// 2° observer) and the nearest reference chip's code — and each measured descriptor with its SI
// unit. Ratios are left out: Hueledger computes them from two stored values and stores none.
import type { DataSource } from 'typeorm';
import { Character } from '../collection/character.entity.js';
import { Descriptor } from '../collection/descriptor.entity.js';

/** The four variables of a colour character, in the order observations list them. */
export const COLOUR_PARTS = ['L', 'a', 'b', 'chip'] as const;
export type ColourPart = (typeof COLOUR_PARTS)[number];

/** Which stored row a variable reads. */
export type VariableKey = { kind: 'colour'; characterId: number; part: ColourPart } | { kind: 'descriptor'; descriptorId: number };

/** A variable's DbId: "c12-L", "c12-chip", "d5". */
export function variableDbId(key: VariableKey): string {
  return key.kind === 'colour' ? `c${key.characterId}-${key.part}` : `d${key.descriptorId}`;
}

/** Parses a variable DbId; null when it is not one of ours. */
export function parseVariableDbId(dbId: string): VariableKey | null {
  let m = /^c([1-9]\d{0,11})-(L|a|b|chip)$/.exec(dbId);
  if (m) return { kind: 'colour', characterId: Number(m[1]), part: m[2] as ColourPart };
  m = /^d([1-9]\d{0,11})$/.exec(dbId);
  return m ? { kind: 'descriptor', descriptorId: Number(m[1]) } : null;
}

/** A colour variable's name: the character code and the coordinate. */
export function colourVariableName(code: string, part: ColourPart): string {
  return part === 'chip' ? `${code} chip` : `${code} ${part}*`;
}

/** One method for every colour reading; how each reading was taken travels in its additionalInfo. */
const CIELAB_METHOD = {
  methodDbId: 'cielab-d65-2',
  methodName: 'CIELAB reading, D65 white, 2° observer',
  methodClass: 'Measurement',
  description:
    'A photo region (averaged in linear light, optionally corrected by a neutral card or target), an instrument reading, a chip picked by eye or an on-screen swatch, expressed in CIELAB with the D65 white point and the CIE 1931 2° standard observer, and matched by CIEDE2000 to the nearest chip of the reference set current at the time.',
};

/** The scales of the coordinates. L* runs 0 (black) to 100 (the reference white) by its definition in CIE 15:2004 (from memory); a* and b* have no fixed bounds. */
const COLOUR_SCALES: Record<ColourPart, Record<string, unknown>> = {
  L: { scaleDbId: 'cielab-L', scaleName: 'CIELAB L* (D65, 2°)', dataType: 'Numerical', decimalPlaces: 2, validValues: { min: 0, max: 100 } },
  a: { scaleDbId: 'cielab-a', scaleName: 'CIELAB a* (D65, 2°)', dataType: 'Numerical', decimalPlaces: 2 },
  b: { scaleDbId: 'cielab-b', scaleName: 'CIELAB b* (D65, 2°)', dataType: 'Numerical', decimalPlaces: 2 },
  chip: { scaleDbId: 'reference-chip', scaleName: 'Hueledger reference chip code (codes are never reused across set versions)', dataType: 'Nominal' },
};

const PART_WORDS: Record<ColourPart, string> = { L: 'lightness L*', a: 'green–red a*', b: 'blue–yellow b*', chip: 'nearest reference chip' };

function colourVariable(c: Character, part: ColourPart): Record<string, unknown> {
  return {
    observationVariableDbId: variableDbId({ kind: 'colour', characterId: c.id, part }),
    observationVariableName: colourVariableName(c.code, part),
    ...(c.active ? {} : { status: 'obsolete' }),
    trait: {
      traitDbId: `c${c.id}`,
      traitName: `${c.label} colour`,
      traitClass: 'morphological',
      entity: c.label,
      attribute: 'colour',
      traitDescription: c.howToRead,
      mainAbbreviation: c.code,
    },
    method: CIELAB_METHOD,
    scale: COLOUR_SCALES[part],
    additionalInfo: { characterCode: c.code, organ: c.organ, coordinate: PART_WORDS[part] },
  };
}

/** SI unit and scale of each measured kind (values are stored in SI, see shared/units/units.ts). */
const KIND_SCALES: Record<'length' | 'mass' | 'count', Record<string, unknown>> = {
  length: { scaleDbId: 'si-metre', scaleName: 'metre', dataType: 'Numerical', units: 'm' },
  mass: { scaleDbId: 'si-kilogram', scaleName: 'kilogram', dataType: 'Numerical', units: 'kg' },
  count: { scaleDbId: 'count', scaleName: 'count', dataType: 'Numerical', decimalPlaces: 0, units: 'count' },
};

function descriptorVariable(d: Descriptor): Record<string, unknown> {
  const scale =
    d.kind === 'category'
      ? { scaleDbId: `d${d.id}-categories`, scaleName: `${d.label} categories`, dataType: 'Nominal', validValues: { categories: d.categories.map((c) => ({ value: c.id, label: c.label })) } }
      : KIND_SCALES[d.kind as 'length' | 'mass' | 'count'];
  return {
    observationVariableDbId: variableDbId({ kind: 'descriptor', descriptorId: d.id }),
    observationVariableName: d.code,
    ...(d.active ? {} : { status: 'obsolete' }),
    trait: { traitDbId: `d${d.id}`, traitName: d.label, entity: d.object, traitClass: 'morphological', mainAbbreviation: d.code },
    method: { methodDbId: `d${d.id}`, methodName: d.label, methodClass: d.kind === 'count' ? 'Counting' : d.kind === 'category' ? 'Estimation' : 'Measurement', description: d.howToMeasure },
    scale,
    additionalInfo: { descriptorKind: d.kind },
  };
}

/** Every variable (colour characters first, in catalogue order, then descriptors), optionally filtered. */
export async function findVariables(ds: DataSource, f: { observationVariableDbId?: string; observationVariableName?: string }): Promise<Record<string, unknown>[]> {
  const characters = await ds.getRepository(Character).find({ where: { colour: true }, order: { sortOrder: 'ASC', id: 'ASC' } });
  const descriptors = await ds.getRepository(Descriptor).find({ order: { sortOrder: 'ASC', id: 'ASC' } });
  const all = [
    ...characters.flatMap((c) => COLOUR_PARTS.map((part) => colourVariable(c, part))),
    ...descriptors.filter((d) => d.kind !== 'ratio').map(descriptorVariable),
  ];
  return all.filter(
    (v) =>
      (f.observationVariableDbId === undefined || v['observationVariableDbId'] === f.observationVariableDbId) &&
      (f.observationVariableName === undefined || v['observationVariableName'] === f.observationVariableName),
  );
}
