import { Column, CreateDateColumn, Entity, Index, ManyToOne, PrimaryGeneratedColumn, RelationId, UpdateDateColumn } from 'typeorm';
import type { CalibrationStatus, SpecimenSource } from '../../shared/api/calibration-answers.js';
import type { Region } from '../../shared/photo/region.js';
import { User } from '../auth/user.entity.js';
import { Photo } from '../photos/photo.entity.js';

/** A calibration session a trainer runs: specimens laid out for a group, each observer picks a chip per specimen. */
@Entity('calibration_session')
export class CalibrationSession {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 120 }) title: string;
  /** "YYYY-MM-DD". */
  @Column('varchar', { length: 10 }) heldOn: string;
  /** The reference set whose chips observers pick from (a set's chips never change). */
  @Column('varchar', { length: 20 }) referenceSetId: string;
  /** Whether only invited observers may answer. */
  @Column('boolean') restricted: boolean;
  @Column('real') kappaThreshold: number;
  @Column('real') deltaE00Threshold: number;
  @Column('varchar', { length: 8 }) status: CalibrationStatus;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) createdBy: User;
  @RelationId((s: CalibrationSession) => s.createdBy) createdById: number;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @Column('datetime', { nullable: true }) closedAt: Date | null;
  /** The group's Fleiss κ when the session closed (null while open or when κ was undefined). */
  @Column('real', { nullable: true }) kappaAtClose: number | null;
}

/** One specimen of a session with its reference colour (CIELAB D65) and where that came from. */
@Entity('calibration_specimen')
export class Specimen {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => CalibrationSession, { nullable: false, onDelete: 'RESTRICT' }) session: CalibrationSession;
  @RelationId((s: Specimen) => s.session) sessionId: number;
  @Column('varchar', { length: 80 }) label: string;
  /** 1-based order in the session. */
  @Column('integer') position: number;
  @Column('varchar', { length: 8 }) source: SpecimenSource;
  @Column('real') l: number;
  @Column('real') a: number;
  @Column('real') b: number;
  /** The field chip of the reference (the source chip's field chip, else the nearest by ΔE00), fixed at creation. */
  @Column('varchar', { length: 20 }) referenceFieldCode: string;
  /** The chip the reference came from (source `chip`). */
  @Column('varchar', { length: 20, nullable: true }) chipCode: string | null;
  @ManyToOne(() => Photo, { nullable: true, onDelete: 'RESTRICT' }) photo: Photo | null;
  @RelationId((s: Specimen) => s.photo) photoId: number | null;
  @Column('simple-json', { nullable: true }) region: Region | null;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** Someone invited to a session, or who joined an unrestricted one by answering. */
@Entity('calibration_participant')
@Index(['session', 'user'], { unique: true })
export class Participant {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => CalibrationSession, { nullable: false, onDelete: 'RESTRICT' }) session: CalibrationSession;
  @RelationId((p: Participant) => p.session) sessionId: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) user: User;
  @RelationId((p: Participant) => p.user) userId: number;
  /** Whether a trainer invited them. */
  @Column('boolean') invited: boolean;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** An observer's current pick for one specimen; a new pick while open replaces it (audited). */
@Entity('calibration_response')
@Index(['specimen', 'observer'], { unique: true })
export class CalibrationResponse {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => CalibrationSession, { nullable: false, onDelete: 'RESTRICT' }) session: CalibrationSession;
  @RelationId((r: CalibrationResponse) => r.session) sessionId: number;
  @ManyToOne(() => Specimen, { nullable: false, onDelete: 'RESTRICT' }) specimen: Specimen;
  @RelationId((r: CalibrationResponse) => r.specimen) specimenId: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) observer: User;
  @RelationId((r: CalibrationResponse) => r.observer) observerId: number;
  /** The chip picked, fine or field. */
  @Column('varchar', { length: 20 }) chipCode: string;
  /** Its field chip: the category for kappa. */
  @Column('varchar', { length: 20 }) fieldCode: string;
  /** The picked chip's CIELAB, copied from the set (whose chips never change) for cheap results. */
  @Column('real') l: number;
  @Column('real') a: number;
  @Column('real') b: number;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
  @UpdateDateColumn({ type: 'datetime' }) updatedAt: Date;
}
