import { Column, CreateDateColumn, Entity, PrimaryGeneratedColumn } from 'typeorm';
import type { Role, UserRow, UserSummary } from '../../shared/api/auth.js';

/** A person who signs in; role decides what each route allows (docs/architecture.md, roles). */
@Entity('user')
export class User {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 254, unique: true }) email: string;
  @Column('varchar', { length: 120 }) name: string;
  @Column('varchar', { length: 16 }) role: Role;
  /** scrypt hash in the form produced by passwords.ts. */
  @Column('varchar', { length: 200 }) passwordHash: string;
  @Column('boolean', { default: true }) active: boolean;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @Column('datetime', { nullable: true }) lastLoginAt: Date | null;
  /** Units the person types lengths and masses in; kept on the server so every phone they use agrees. */
  @Column('varchar', { length: 8, default: 'metric' }) unitSystem: 'metric' | 'imperial';
}

/** The part of a user the client may see about itself. */
export function toSummary(u: User): UserSummary {
  return { id: u.id, email: u.email, name: u.name, role: u.role };
}

/** The admin's view of a user. */
export function toRow(u: User): UserRow {
  return { ...toSummary(u), active: u.active, createdAt: u.createdAt.toISOString(), lastLoginAt: u.lastLoginAt?.toISOString() ?? null };
}
