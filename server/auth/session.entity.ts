import { Column, Entity, Index, PrimaryColumn } from 'typeorm';

/** One express-session record, kept in SQLite so sessions survive a restart. */
@Entity('session')
export class SessionRecord {
  @PrimaryColumn('varchar', { length: 128 }) sid: string;
  @Column('text') data: string;
  /** The signed-in user, copied out of the data so their sessions can be ended together. */
  @Index() @Column('integer', { nullable: true }) userId: number | null;
  /** Milliseconds since the epoch. */
  @Index() @Column('integer') expiresAt: number;
}
