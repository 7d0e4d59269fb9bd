import { Column, CreateDateColumn, Entity, Index, PrimaryGeneratedColumn } from 'typeorm';

/**
 * A character or descriptor a recorder has set aside for one plant this season, with the reason
 * (no flowers this year, the corm is not lifted yet). Exactly one of `characterId` and
 * `descriptorId` is set. A reading or observation taken later counts as done and outweighs it.
 */
@Entity('plant_skip')
@Index(['plantId', 'seasonYear'])
export class PlantSkip {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('integer') plantId: number;
  @Column('integer', { nullable: true }) characterId: number | null;
  @Column('integer', { nullable: true }) descriptorId: number | null;
  /** The season of the plant's site when the skip was recorded (null: a day no season covers). */
  @Column('varchar', { length: 40, nullable: true }) season: string | null;
  /** The season-year; the local calendar year when no season covers the day. */
  @Column('integer') seasonYear: number;
  @Column('varchar', { length: 300 }) reason: string;
  @Column('integer') userId: number;
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}
