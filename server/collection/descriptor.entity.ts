import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { Descriptor as DescriptorDto, DescriptorCategory, DescriptorKind } from '../../shared/api/descriptor-answers.js';

/** A non-colour descriptor: a length, mass, count, category or ratio, with how to measure it. */
@Entity('descriptor')
export class Descriptor {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 60, unique: true }) code: string;
  @Column('varchar', { length: 120 }) label: string;
  /** Which part is measured (Bioversity TB 13: the object). */
  @Column('varchar', { length: 200 }) object: string;
  @Column('varchar', { length: 10 }) kind: DescriptorKind;
  /** For kind "category": its categories; ids are never removed. */
  @Column('simple-json') categories: DescriptorCategory[];
  /** For kind "ratio": the codes of its parts. */
  @Column('varchar', { length: 60, nullable: true }) numeratorCode: string | null;
  @Column('varchar', { length: 60, nullable: true }) denominatorCode: string | null;
  @Column('text') howToMeasure: string;
  @Column('text', { nullable: true }) caution: string | null;
  @Column('boolean', { default: true }) active: boolean;
  /** Place in the walk of a plant, shared with the character catalogue (walk-order.ts). */
  @Column('integer', { default: 0 }) sortOrder: number;
  /** The colour character read on the same part (a length and a colour of one thing), or null. */
  @Column('integer', { nullable: true }) characterId: number | null;
}

/** The API shape of a descriptor. */
export function toDescriptorDto(d: Descriptor): DescriptorDto {
  return {
    id: d.id,
    code: d.code,
    label: d.label,
    object: d.object,
    kind: d.kind,
    categories: d.categories,
    numeratorCode: d.numeratorCode,
    denominatorCode: d.denominatorCode,
    howToMeasure: d.howToMeasure,
    caution: d.caution,
    active: d.active,
    sortOrder: d.sortOrder,
    characterId: d.characterId ?? null,
  };
}
