import { Column, Entity, Index, JoinColumn, ManyToOne, PrimaryColumn, PrimaryGeneratedColumn } from 'typeorm';

/**
 * One loaded reference-set file. Rows are written once, when a file's id is first seen, and never
 * rewritten: a reading's chip code must keep the meaning it had when the reading was taken.
 */
@Entity('reference_set')
export class ReferenceSet {
  /** The file's `id`, e.g. "v1". */
  @PrimaryColumn('varchar', { length: 20 }) id: string;
  @Column('varchar', { length: 120 }) name: string;
  /** The newest version is the current set. */
  @Column('integer', { unique: true }) version: number;
  /** Reference white of the CIELAB values ("D65"). */
  @Column('varchar', { length: 10 }) white: string;
  /** Standard observer ("2°"). */
  @Column('varchar', { length: 10 }) observer: string;
  @Column('datetime') loadedAt: Date;
  /** SHA-256 (hex) of the file as loaded, to notice a file that was changed after publication. */
  @Column('varchar', { length: 64 }) fileSha256: string;
}

/** Whether a chip is on the printed field card or refines one. */
export type ChipKind = 'field' | 'fine';

/** One chip of a reference set; its code is unique within the set and keeps its CIELAB for good. */
@Entity('chip')
@Index(['set', 'code'], { unique: true })
export class Chip {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => ReferenceSet, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'setId' })
  set: ReferenceSet;
  @Column('varchar', { length: 20 }) setId: string;
  /** `F-001` or `F-001.001`. */
  @Column('varchar', { length: 20 }) code: string;
  /** The field chip a fine chip refines; null for a field chip. */
  @Column('varchar', { length: 20, nullable: true }) parent: string | null;
  @Column('varchar', { length: 80 }) name: string;
  /** CIELAB D65, 2° observer. */
  @Column('real') l: number;
  @Column('real') a: number;
  @Column('real') b: number;
  /** Display hex, gamut-mapped when out of sRGB. */
  @Column('varchar', { length: 7 }) hex: string;
  @Column('boolean') inGamut: boolean;
  @Column('varchar', { length: 5 }) kind: ChipKind;
}

/**
 * One admin's choice of the set new readings are matched against. Choices are only added, never
 * changed: the latest is the current set, and the rows are the history of which set was current
 * when. With no choice made, the first set loaded stays current, so a new set file never changes
 * matching under recorders' feet.
 */
@Entity('reference_set_choice')
export class ReferenceSetChoice {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => ReferenceSet, { nullable: false, onDelete: 'RESTRICT' })
  @JoinColumn({ name: 'setId' })
  set: ReferenceSet;
  @Column('varchar', { length: 20 }) setId: string;
  @Column('datetime') chosenAt: Date;
  /** The admin who chose it. */
  @Column('integer', { nullable: true }) chosenById: number | null;
}
