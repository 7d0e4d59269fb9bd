import { Column, CreateDateColumn, Entity, Index, ManyToOne, OneToMany, PrimaryGeneratedColumn } from 'typeorm';
import type { Accession as AccessionDto } from '../../shared/api/collection.js';
import { Site } from './site.entity.js';

/**
 * A variety held in the collection. Passport fields follow FAO/Bioversity MCPD V.2.1
 * (Alercia, Diulgheroff & Mackay 2015); see shared/api/collection.ts for the tag of each.
 */
@Entity('accession')
/** Unique on LOWER(accessionNumber): numbers differing only in case are refused (migration 1765030000000). */
@Index('IDX_accession_number_lower', { synchronize: false })
export class Accession {
  @PrimaryGeneratedColumn('increment') id: number;
  @Column('varchar', { length: 40, unique: true }) accessionNumber: string;
  @Column('varchar', { length: 120 }) name: string;
  @Column('simple-json') otherNames: string[];
  @Column('varchar', { length: 20, nullable: true }) instituteCode: string | null;
  @Column('varchar', { length: 40, default: 'Colocasia' }) genus: string;
  @Column('varchar', { length: 40, default: 'esculenta' }) species: string;
  @Column('varchar', { length: 40, default: '(L.) Schott' }) speciesAuthor: string;
  @Column('varchar', { length: 40, default: 'taro' }) cropName: string;
  @Column('varchar', { length: 3, nullable: true }) originCountry: string | null;
  @Column('varchar', { length: 200, nullable: true }) collectingSite: string | null;
  /** Where the sample was collected (MCPD DECLATITUDE, DECLONGITUDE, ELEVATION), not where it is held: decimal degrees WGS 84, metres. */
  @Column('real', { nullable: true }) collectingLatitude: number | null;
  @Column('real', { nullable: true }) collectingLongitude: number | null;
  @Column('real', { nullable: true }) collectingElevationM: number | null;
  @Column('varchar', { length: 8, nullable: true }) acquisitionDate: string | null;
  @Column('integer', { nullable: true }) sampleStatus: number | null;
  @Column('varchar', { length: 200, nullable: true }) donorName: string | null;
  @Column('text', { nullable: true }) remarks: string | null;
  @ManyToOne(() => Site, { nullable: false, onDelete: 'RESTRICT' }) site: Site;
  @OneToMany(() => Plant, (p) => p.accession, { cascade: ['insert'] }) plants: Plant[];
  @CreateDateColumn({ type: 'datetime' }) createdAt: Date;
}

/** One plant of an accession at a site, with its planting date (for plant age at a reading). */
@Entity('plant')
@Index(['accession', 'label'], { unique: true })
export class Plant {
  @PrimaryGeneratedColumn('increment') id: number;
  @ManyToOne(() => Accession, (a) => a.plants, { nullable: false, onDelete: 'RESTRICT' }) accession: Accession;
  @ManyToOne(() => Site, { nullable: false, onDelete: 'RESTRICT' }) site: Site;
  @Column('varchar', { length: 40 }) label: string;
  /** ISO date "YYYY-MM-DD" */
  @Column('varchar', { length: 10 }) plantedOn: string;
}

/** The API shape of an accession with its plants (relations `site`, `plants.site` loaded). */
export function toAccessionDto(a: Accession): AccessionDto {
  return {
    id: a.id,
    accessionNumber: a.accessionNumber,
    name: a.name,
    otherNames: a.otherNames,
    instituteCode: a.instituteCode,
    genus: a.genus,
    species: a.species,
    speciesAuthor: a.speciesAuthor,
    cropName: a.cropName,
    originCountry: a.originCountry,
    collectingSite: a.collectingSite,
    collectingLatitude: a.collectingLatitude ?? null,
    collectingLongitude: a.collectingLongitude ?? null,
    collectingElevationM: a.collectingElevationM ?? null,
    acquisitionDate: a.acquisitionDate,
    sampleStatus: a.sampleStatus,
    donorName: a.donorName,
    remarks: a.remarks,
    siteId: a.site.id,
    plants: [...(a.plants ?? [])]
      .sort((x, y) => x.label.localeCompare(y.label, 'en', { numeric: true }))
      .map((p) => ({ id: p.id, accessionId: a.id, siteId: p.site?.id ?? a.site.id, label: p.label, plantedOn: p.plantedOn })),
  };
}
