import { Column, CreateDateColumn, Entity, Index, JoinColumn, ManyToOne, OneToOne, PrimaryGeneratedColumn } from 'typeorm';
import type { InstrumentIlluminant, Light, ReadingCluster, ReadingMethod, ReadingStatus } from '../../shared/api/reading-answers.js';
import type { LabTuple } from '../../shared/colour/lab.js';
import type { SampleCorrection } from '../../shared/api/photo-answers.js';
import type { Region } from '../../shared/photo/region.js';
import { User } from '../auth/user.entity.js';
import { Accession, Plant } from '../collection/accession.entity.js';
import { Character } from '../collection/character.entity.js';
import { Site } from '../collection/site.entity.js';
import { Photo } from '../photos/photo.entity.js';

/**
 * One colour observation: CIELAB D65 with its display hex, the best chip of the set
 * current when it was taken (with that set's id), the eye-picked chip, conditions, provenance,
 * derived season and plant age. Never edited in place: a correction is a new row that supersedes
 * this one (linked both ways), and `status` is the only column a later step (review) may change.
 * Foreign keys are plain columns beside their relations, so filters and sorts stay in SQL.
 */
@Entity('reading')
@Index(['accessionId', 'characterId'])
@Index(['siteId'])
@Index(['observerId'])
@Index(['observedAt'])
@Index(['status'])
export class Reading {
  @PrimaryGeneratedColumn('increment') id: number;

  @Column('integer') accessionId: number;
  @ManyToOne(() => Accession, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'accessionId' }) accession?: Accession;
  @Column('integer', { nullable: true }) plantId: number | null;
  @ManyToOne(() => Plant, { nullable: true, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'plantId' }) plant?: Plant | null;
  @Column('integer') characterId: number;
  @ManyToOne(() => Character, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'characterId' }) character?: Character;
  @Column('integer') siteId: number;
  @ManyToOne(() => Site, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'siteId' }) site?: Site;
  @Column('integer') observerId: number;
  @ManyToOne(() => User, { nullable: false, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'observerId' }) observer?: User;

  @Column('datetime') observedAt: Date;
  @Column('varchar', { length: 12 }) method: ReadingMethod;

  /** CIELAB D65, 2° observer. */
  @Column('real') l: number;
  @Column('real') a: number;
  @Column('real') b: number;
  /** Display hex, gamut-mapped when out of sRGB. */
  @Column('varchar', { length: 7 }) hex: string;
  @Column('boolean') inGamut: boolean;

  /** The reference set matched against (the current one at the time) and its nearest chip. */
  @Column('varchar', { length: 20 }) setId: string;
  @Column('varchar', { length: 12 }) bestChipCode: string;
  @Column('varchar', { length: 120 }) bestChipName: string;
  @Column('varchar', { length: 7 }) bestChipHex: string;
  @Column('real') deltaE00: number;
  /** photo and instrument: the chip also picked by eye, and its ΔE00 from the reading. */
  @Column('varchar', { length: 12, nullable: true }) eyeChipCode: string | null;
  @Column('real', { nullable: true }) eyeDeltaE00: number | null;

  /** Provenance of a photo reading: the photo, the regions sampled, what the sampling reported. */
  @Column('integer', { nullable: true }) photoId: number | null;
  @ManyToOne(() => Photo, { nullable: true, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'photoId' }) photo?: Photo | null;
  @Column('simple-json', { nullable: true }) region: Region | null;
  @Column('simple-json', { nullable: true }) neutralRegion: Region | null;
  @Column('integer', { nullable: true }) pixelCount: number | null;
  @Column('integer', { nullable: true }) pixelsDropped: number | null;
  @Column('real', { nullable: true }) spreadDeltaE00: number | null;
  @Column('boolean', { nullable: true }) uniform: boolean | null;
  @Column('simple-json', { nullable: true }) correction: SampleCorrection | null;
  /** Sampling rules version of a photo reading. */
  @Column('varchar', { length: 40, nullable: true }) pipeline: string | null;
  /** A photo reading of one colour of a region that held several (a stripe, the ground); null for the whole region's mean. */
  @Column('simple-json', { nullable: true }) cluster: ReadingCluster | null;
  /** instrument: its make or name. */
  @Column('varchar', { length: 80, nullable: true }) instrument: string | null;
  /** instrument: the illuminant/observer it reported (`D65/10`, `D65/2`, `D50/2`, `other`). */
  @Column('varchar', { length: 8, nullable: true }) illuminant: InstrumentIlluminant | null;
  /** instrument: L*a*b* as reported, when they were adapted to D65/2° before storing (D50/2°). */
  @Column('simple-json', { nullable: true }) reportedLab: LabTuple | null;
  /** chip: the code picked; swatch: the hex tapped. */
  @Column('varchar', { length: 20, nullable: true }) source: string | null;

  /** Ambient light; null for an instrument reading (the instrument lights the sample itself). */
  @Column('varchar', { length: 20, nullable: true }) light: Light | null;
  @Column('integer', { nullable: true }) secondsSinceCut: number | null;
  @Column('varchar', { length: 80, nullable: true }) leafPosition: string | null;
  @Column('text', { nullable: true }) notes: string | null;

  /** Derived from the site's season scheme in the site's time zone. */
  @Column('varchar', { length: 40, nullable: true }) season: string | null;
  @Column('integer', { nullable: true }) seasonYear: number | null;
  @Column('integer', { nullable: true }) plantAgeMonths: number | null;

  @Column('varchar', { length: 20, default: 'submitted' }) status: ReadingStatus;

  /** The reading this one corrects, and the one that corrected it; each link is unique, so a chain never forks. */
  @Column('integer', { nullable: true }) supersedesId: number | null;
  @OneToOne(() => Reading, { nullable: true, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'supersedesId' }) supersedes?: Reading | null;
  @Column('integer', { nullable: true }) supersededById: number | null;
  @OneToOne(() => Reading, { nullable: true, onDelete: 'RESTRICT' }) @JoinColumn({ name: 'supersededById' }) supersededBy?: Reading | null;
  /** Why this reading replaced the one it supersedes. */
  @Column('varchar', { length: 500, nullable: true }) supersedeReason: string | null;

  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
