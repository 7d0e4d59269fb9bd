import type { Descriptor, DescriptorKind } from '../../../../../shared/api/descriptor-answers.js';

/** Each kind in words, with the units it is entered in and stored as. */
export const KIND_WORDS: Readonly<Record<DescriptorKind, { kind: string; units: string }>> = {
  length: { kind: 'Length', units: 'cm or in; stored in metres' },
  mass: { kind: 'Mass', units: 'kg or lb; stored in kilograms' },
  count: { kind: 'Count', units: 'a whole number' },
  category: { kind: 'Category', units: 'one of its categories' },
  ratio: { kind: 'Ratio', units: 'no unit; computed, never typed' },
};

/** A ratio's parts as "Petiole length ÷ Sheath length", naming them by label. */
export function ratioParts(descriptor: Descriptor, catalogue: readonly Descriptor[]): string | null {
  if (descriptor.kind !== 'ratio') return null;
  const label = (code: string | null) => catalogue.find((d) => d.code === code)?.label ?? code ?? '?';
  return `${label(descriptor.numeratorCode)} ÷ ${label(descriptor.denominatorCode)}`;
}

/** A category id made from its label: lowercase words joined by hyphens ("Long oval" → "long-oval"). */
export function categoryIdOf(label: string): string {
  return label
    .normalize('NFKD')
    .replace(/[\u0300-\u036f]/g, '')
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, '-')
    .replace(/^-+|-+$/g, '')
    .slice(0, 40)
    .replace(/-+$/, '');
}
