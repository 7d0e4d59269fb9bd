import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import { User } from './user.entity.js';

/** A password-reset request; single use, expires, token stored hashed. */
@Entity('password_reset')
export class PasswordReset {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'CASCADE' }) user: User;
  @Index({ unique: true }) @Column('varchar', { length: 64 }) tokenHash: string;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @Column('datetime') expiresAt: Date;
  @Column('datetime', { nullable: true }) usedAt: Date | null;
}
