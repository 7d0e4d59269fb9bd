import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn, RelationId } from 'typeorm';
import type { ScreeningMethod, ScreeningResult } from '../../shared/api/calibration-answers.js';
import { User } from '../auth/user.entity.js';
import { CalibrationSession } from './calibration-session.entity.js';

/** An observer certified for a reference set by one closed session, with the numbers that earned it. */
@Entity('certification')
@Index(['session', 'user'], { unique: true })
export class Certification {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) user: User;
  @RelationId((c: Certification) => c.user) userId: number;
  @ManyToOne(() => CalibrationSession, { nullable: false, onDelete: 'RESTRICT' }) session: CalibrationSession;
  @RelationId((c: Certification) => c.session) sessionId: number;
  @Column('varchar', { length: 20 }) referenceSetId: string;
  /** "YYYY-MM-DD", the day the session closed (UTC). */
  @Column('varchar', { length: 10 }) certifiedOn: string;
  @Column('real') kappa: number;
  @Column('real') meanDeltaE00: number;
  @Column('integer') n: number;
  @Column('real') kappaThreshold: number;
  @Column('real') deltaE00Threshold: number;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** A self-reported colour-vision screening (ASTM D1729 asks for observers with normal colour vision). */
@Entity('colour_vision_screening')
export class ColourVisionScreening {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) user: User;
  @RelationId((s: ColourVisionScreening) => s.user) userId: number;
  /** "YYYY-MM-DD". */
  @Column('varchar', { length: 10 }) screenedOn: string;
  @Column('varchar', { length: 32 }) method: ScreeningMethod;
  @Column('varchar', { length: 12 }) result: ScreeningResult;
  @Column('text', { nullable: true }) notes: string | null;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) recordedBy: User;
  @RelationId((s: ColourVisionScreening) => s.recordedBy) recordedById: number;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
