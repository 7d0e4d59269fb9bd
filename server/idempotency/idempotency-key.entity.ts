import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../auth/user.entity.js';

/**
 * One `Idempotency-Key` a user sent with a state-changing request, and the answer it got. A row
 * with `status` null is a request still running (or one cut short by a crash: see idempotency.ts).
 */
@Entity('idempotency_key')
@Index(['userId', 'key'], { unique: true })
export class IdempotencyKey {
  @PrimaryGeneratedColumn('increment') id: number;
  /** The client's key, 1–100 characters of [A-Za-z0-9_-]. */
  @Column('varchar', { length: 100 }) key: string;
  @ManyToOne(() => User, { nullable: false, onDelete: 'CASCADE' })
  @JoinColumn({ name: 'userId' })
  user: User;
  /** Keys are per user: two people's phones may well make the same key. */
  @Column('integer') userId: number;
  @Column('varchar', { length: 10 }) method: string;
  /** The request path the key was first used on (without the query). */
  @Column('varchar', { length: 200 }) path: string;
  /** SHA-256 (hex) of the request body in a canonical form, with the SHA-256 of each uploaded file. */
  @Column('varchar', { length: 64 }) bodyHash: string;
  /** The stored answer's status; null while the first request runs. */
  @Column('integer', { nullable: true }) status: number | null;
  /** The stored JSON answer. */
  @Column('simple-json', { nullable: true }) answer: unknown;
  /** The stored answer's Location header, if it had one. */
  @Column('varchar', { length: 200, nullable: true }) location: string | null;
  @Index()
  @CreateDateColumn({ type: 'datetime' })
  createdAt: Date;
}
