import { Column, Entity, PrimaryGeneratedColumn } from 'typeorm';
import { DEFAULT_DRIFT_THRESHOLD, type Character as CharacterDto, type Organ } from '../../shared/api/collection-answers.js';

/** What is read: an organ and its exact part, with how to read it and any caution. */
@Entity('character')
export class Character {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 60, unique: true }) code: string;
  @Column('varchar', { length: 20 }) organ: Organ;
  @Column('varchar', { length: 120 }) label: string;
  @Column('text') howToRead: string;
  @Column('text', { nullable: true }) caution: string | null;
  @Column('boolean', { default: true }) colour: boolean;
  @Column('boolean', { default: true }) active: boolean;
  /** Place in the walk of a plant, shared with the descriptor catalogue (walk-order.ts). */
  @Column('integer', { default: 0 }) sortOrder: number;
  /** ΔE00 above which a season-to-season difference counts as drift (Paravina et al. 2015 acceptability threshold by default). */
  @Column('real', { default: DEFAULT_DRIFT_THRESHOLD }) driftThreshold: number;
}

/** The API shape of a character. */
export function toCharacterDto(c: Character): CharacterDto {
  return { id: c.id, code: c.code, organ: c.organ, label: c.label, howToRead: c.howToRead, caution: c.caution, colour: c.colour, active: c.active, driftThreshold: c.driftThreshold, sortOrder: c.sortOrder };
}
