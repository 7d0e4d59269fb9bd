import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { Role } from '../../shared/api/auth.js';
import { User } from './user.entity.js';

/** An admin's invitation; the token travels only in the mail, the database keeps its SHA-256. */
@Entity('invitation')
export class Invitation {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 254 }) email: string;
  @Column('varchar', { length: 120 }) name: string;
  @Column('varchar', { length: 16 }) role: Role;
  @Index({ unique: true }) @Column('varchar', { length: 64 }) tokenHash: string;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) invitedBy: User;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @Column('datetime') expiresAt: Date;
  @Column('datetime', { nullable: true }) acceptedAt: Date | null;
}
