import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/** Something that happened, kept for ever: sign-ins, failures, user changes, record changes. */
@Entity('audit_event')
export class AuditEvent {
  @PrimaryGeneratedColumn('increment') id: number;
  @Index() @CreateDateColumn({ type: 'datetime' }) at: Date;
  @Column('integer', { nullable: true }) actorId: number | null;
  @Column('varchar', { length: 254, nullable: true }) actorEmail: string | null;
  @Index() @Column('varchar', { length: 60 }) action: string;
  @Column('varchar', { length: 200, nullable: true }) subject: string | null;
  @Column('simple-json', { nullable: true }) detail: Record<string, unknown> | null;
  @Column('varchar', { length: 64, nullable: true }) ip: string | null;
}
