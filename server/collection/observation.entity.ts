import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn, RelationId } from 'typeorm';
import type { Observation as ObservationDto, Unit } from '../../shared/api/descriptor-answers.js';
import { User } from '../auth/user.entity.js';
import { Accession, Plant } from './accession.entity.js';
import { Descriptor } from './descriptor.entity.js';

/**
 * One observation of a non-colour descriptor, stored in SI with what was typed beside it.
 * Never edited in place: a correction is a new row that supersedes this one (linked both ways).
 */
@Entity('observation')
@Index(['accession', 'descriptor'])
export class Observation {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => Accession, { nullable: false, onDelete: 'RESTRICT' }) accession: Accession;
  @RelationId((o: Observation) => o.accession) accessionId: number;
  @ManyToOne(() => Plant, { nullable: true, onDelete: 'RESTRICT' }) plant: Plant | null;
  @RelationId((o: Observation) => o.plant) plantId: number | null;
  @ManyToOne(() => Descriptor, { nullable: false, onDelete: 'RESTRICT' }) descriptor: Descriptor;
  @RelationId((o: Observation) => o.descriptor) descriptorId: number;
  @Column('datetime') observedAt: Date;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) observer: User;
  @RelationId((o: Observation) => o.observer) observerId: number;
  /** Metres, kilograms or the count; null for a category. */
  @Column('real', { nullable: true }) valueSi: number | null;
  @Column('varchar', { length: 40, nullable: true }) category: string | null;
  /** What was typed, for provenance. */
  @Column('real', { nullable: true }) enteredValue: number | null;
  @Column('varchar', { length: 8, nullable: true }) enteredUnit: Unit | null;
  @Column('text', { nullable: true }) notes: string | null;
  @ManyToOne(() => Observation, { nullable: true, onDelete: 'RESTRICT' }) supersedes: Observation | null;
  @RelationId((o: Observation) => o.supersedes) supersedesId: number | null;
  @ManyToOne(() => Observation, { nullable: true, onDelete: 'RESTRICT' }) supersededBy: Observation | null;
  @RelationId((o: Observation) => o.supersededBy) supersededById: number | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** The API shape of an observation (relations `descriptor` and `observer` loaded). */
export function toObservationDto(o: Observation): ObservationDto {
  return {
    id: o.id,
    accessionId: o.accessionId,
    plantId: o.plantId ?? null,
    descriptorId: o.descriptorId,
    descriptorCode: o.descriptor.code,
    observedAt: o.observedAt.toISOString(),
    observerId: o.observerId,
    observerName: o.observer.name,
    valueSi: o.valueSi,
    category: o.category,
    enteredValue: o.enteredValue,
    enteredUnit: o.enteredUnit,
    notes: o.notes,
    supersedesId: o.supersedesId ?? null,
    supersededById: o.supersededById ?? null,
    createdAt: o.createdAt.toISOString(),
  };
}
