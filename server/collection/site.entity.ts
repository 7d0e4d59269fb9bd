import { Column, Entity, Index, ManyToOne, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Season as SeasonDto, Site as SiteDto } from '../../shared/api/collection.js';

/** A plot or garden, with its season scheme. */
@Entity('site')
/** Unique on LOWER(code): codes differing only in case are refused (migration 1765030000000). */
@Index('IDX_site_code_lower', { synchronize: false })
export class Site {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 20, unique: true }) code: string;
  @Column('varchar', { length: 120 }) name: string;
  /** IANA time zone; a reading's season is derived in this zone. */
  @Column('varchar', { length: 64 }) timezone: string;
  @Column('real', { nullable: true }) latitude: number | null;
  @Column('real', { nullable: true }) longitude: number | null;
  @Column('real', { nullable: true }) elevationM: number | null;
  @OneToMany(() => Season, (s) => s.site, { cascade: ['insert'] }) seasons: Season[];
}

/** A named month-day range of a site's year (inclusive; may wrap the year end). */
@Entity('season')
export class Season {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => Site, (s) => s.seasons, { nullable: false, onDelete: 'CASCADE' }) site: Site;
  @Column('varchar', { length: 40 }) name: string;
  /** "MM-DD" */
  @Column('varchar', { length: 5 }) start: string;
  /** "MM-DD" */
  @Column('varchar', { length: 5 }) end: string;
}

/** The API shape of a site, seasons in calendar order of their start. */
export function toSiteDto(s: Site): SiteDto {
  const seasons: SeasonDto[] = [...(s.seasons ?? [])]
    .sort((a, b) => a.start.localeCompare(b.start))
    .map((x) => ({ id: x.id, name: x.name, start: x.start, end: x.end }));
  return { id: s.id, code: s.code, name: s.name, timezone: s.timezone, latitude: s.latitude, longitude: s.longitude, elevationM: s.elevationM, seasons };
}
