import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { NotificationKind, ReviewDecision } from '../../shared/api/review-answers.js';
import { User } from '../auth/user.entity.js';
import { CalibrationSession } from '../calibration/calibration-session.entity.js';
import { Reading } from '../readings/reading.entity.js';

/**
 * One reviewer's decision on a reading Reviews are only ever added: a reading's
 * reviews, oldest first, are its review history; the reading's `status` follows the latest.
 */
@Entity('review')
@Index(['readingId'])
export class Review {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('integer') readingId: number;
  @ManyToOne(() => Reading, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'readingId' }) reading?: Reading;
  @Column('varchar', { length: 12 }) decision: ReviewDecision;
  /** Required for flag and re-read (what the recorder is told); optional for approve. */
  @Column('text', { nullable: true }) comment: string | null;
  @Column('integer') reviewerId: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'reviewerId' }) reviewer?: User;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** An in-app notice to one user about one reading (a flag or a re-read request) or one calibration session (an invitation, results out). */
@Entity('notification')
@Index(['userId', 'readAt'])
export class Notification {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('integer') userId: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'CASCADE' }) @JoinColumn({ name: 'userId' }) user?: User;
  @Column('varchar', { length: 24 }) kind: NotificationKind;
  @Column('integer', { nullable: true }) readingId: number | null;
  @ManyToOne(() => Reading, { nullable: true, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'readingId' }) reading?: Reading;
  @Column('integer', { nullable: true }) sessionId: number | null;
  @ManyToOne(() => CalibrationSession, { nullable: true, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'sessionId' }) session?: CalibrationSession;
  @Column('text') message: string;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  /** When the user marked it read; null while unread. */
  @Column('datetime', { nullable: true }) readAt: Date | null;
}
