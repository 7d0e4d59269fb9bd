import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from '../auth/user.entity.js';

/**
 * A personal API token for the read-only BrAPI interface, issued by an admin to one user. Only the
 * SHA-256 of the token is kept: a copied database cannot be used to sign in. Never deleted, so the
 * audit trail keeps its target; revoking sets `revokedAt`.
 */
@Entity('api_token')
export class ApiToken {
  @PrimaryGeneratedColumn('increment') id: number;
  /** Whose data rights the token carries. */
  @Column('integer') userId: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'CASCADE' }) @JoinColumn({ name: 'userId' }) user?: User;
  /** What the admin called it, e.g. the client it was made for. */
  @Column('varchar', { length: 80 }) label: string;
  /** SHA-256 (hex) of the whole token string. */
  @Index({ unique: true })
  @Column('varchar', { length: 64 })
  tokenHash: string;
  /** The first characters of the token, shown so a person can tell their tokens apart. */
  @Column('varchar', { length: 16 }) prefix: string;
  @Column('integer') createdById: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'CASCADE' }) @JoinColumn({ name: 'createdById' }) createdBy?: User;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @Column('datetime', { nullable: true }) lastUsedAt: Date | null;
  @Column('datetime', { nullable: true }) revokedAt: Date | null;
}
