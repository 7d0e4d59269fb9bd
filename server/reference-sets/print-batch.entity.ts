import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { PrintKind } from '../../shared/api/print-batch-answers.js';
import { User } from '../auth/user.entity.js';
import { ReferenceSet } from './reference-set.entity.js';

/**
 * One print run of a set's field card or fine-chip booklet (one printer, paper and day). Its
 * patches are re-measured, because a print is only as good as its measured distance from the chips.
 */
@Entity('print_batch')
export class PrintBatch {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => ReferenceSet, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'setId' }) set?: ReferenceSet;
  @Column('varchar', { length: 20 }) setId: string;
  @Column('varchar', { length: 10 }) kind: PrintKind;
  /** ISO date "YYYY-MM-DD". */
  @Column('varchar', { length: 10 }) printedOn: string;
  /** Printer, paper, ink, settings. */
  @Column('varchar', { length: 500 }) note: string;
  @Column('integer', { nullable: true }) createdById: number | null;
  @ManyToOne(() => User, { nullable: true, onDelete: 'SET NULL' }) @JoinColumn({ name: 'createdById' }) createdBy?: User | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** One printed patch of a batch, measured with an instrument: CIELAB D65/2° as read. A chip once per batch. */
@Entity('print_patch')
@Index(['batchId', 'chipCode'], { unique: true })
export class PrintPatch {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('integer') batchId: number;
  @ManyToOne(() => PrintBatch, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'batchId' }) batch?: PrintBatch;
  @Column('varchar', { length: 20 }) chipCode: string;
  @Column('real') l: number;
  @Column('real') a: number;
  @Column('real') b: number;
  @Column('integer', { nullable: true }) measuredById: number | null;
  @CreateDateColumn({ type: 'datetime' }) measuredAt: Date;
}
