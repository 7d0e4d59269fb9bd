// The collection as BrAPI sees it: crops, germplasm (accessions), locations (sites), seasons and
// observation units (plants). Plain domain functions: no req/res; ids are database keys, so they
// stay the same across restarts.
import type { DataSource } from 'typeorm';
import { Accession, Plant } from '../collection/accession.entity.js';
import { Site } from '../collection/site.entity.js';
import { BrapiError } from './brapi-envelope.js';

/** MCPD V.2.1 SAMPSTAT codes BrAPI's `biologicalStatusOfAccessionCode` accepts (its enum). */
const SAMPSTAT_CODES = new Set(['100', '110', '120', '130', '200', '300', '400', '410', '411', '412', '413', '414', '415', '416', '420', '421', '422', '423', '500', '600', '999']);

/** A BrAPI `additionalInfo`: string values only, nulls left out. */
function info(fields: Record<string, string | number | null | undefined>): Record<string, string> {
  const out: Record<string, string> = {};
  for (const [k, v] of Object.entries(fields)) if (v !== null && v !== undefined && v !== '') out[k] = String(v);
  return out;
}

/** Our numeric id from a BrAPI DbId; null when it cannot be one of ours (a filter on it then matches nothing). */
export function numericId(dbId: string | undefined): number | null | undefined {
  if (dbId === undefined) return undefined;
  return /^[1-9]\d{0,11}$/.test(dbId) ? Number(dbId) : null;
}

/** The crop names of the accessions held (`commoncropnames`). */
export async function commonCropNames(ds: DataSource): Promise<string[]> {
  const rows: { cropName: string }[] = await ds.query(`SELECT DISTINCT "cropName" FROM "accession" ORDER BY "cropName"`);
  return rows.map((r) => r.cropName);
}

/** MCPD ACQDATE (YYYYMMDD, "--" for an unknown month or day) as an ISO date, when it is complete. */
function acquisitionDate(mcpd: string | null): string | undefined {
  const m = mcpd ? /^(\d{4})(\d{2})(\d{2})$/.exec(mcpd) : null;
  return m ? `${m[1]}-${m[2]}-${m[3]}` : undefined;
}

/** A permanent identifier of our own for an accession (MCPD PUID is not recorded): stable for this server. */
export function germplasmPui(id: number): string {
  return `urn:hueledger:germplasm:${id}`;
}

/** One accession as BrAPI germplasm, MCPD passport fields under the names BrAPI gives them. */
export function toGermplasm(a: Accession): Record<string, unknown> {
  const status = a.sampleStatus === null ? undefined : String(a.sampleStatus);
  const acq = acquisitionDate(a.acquisitionDate);
  return {
    germplasmDbId: String(a.id),
    germplasmPUI: germplasmPui(a.id),
    germplasmName: a.name,
    accessionNumber: a.accessionNumber,
    defaultDisplayName: `${a.accessionNumber} ${a.name}`,
    commonCropName: a.cropName,
    germplasmGenus: a.genus,
    germplasmSpecies: a.species,
    speciesAuthority: a.speciesAuthor,
    synonyms: a.otherNames,
    ...(a.instituteCode ? { instituteCode: a.instituteCode } : {}),
    ...(a.originCountry ? { countryOfOriginCode: a.originCountry } : {}),
    ...(acq ? { acquisitionDate: acq } : {}),
    ...(status && SAMPSTAT_CODES.has(status) ? { biologicalStatusOfAccessionCode: status } : {}),
    additionalInfo: info({ ACQDATE: a.acquisitionDate, COLLSITE: a.collectingSite, DONORNAME: a.donorName, REMARKS: a.remarks, siteDbId: a.site.id, siteCode: a.site.code }),
  };
}

/** Germplasm filters of `GET /germplasm` that we honour. */
export interface GermplasmFilter {
  germplasmDbId?: string;
  germplasmName?: string;
  accessionNumber?: string;
  commonCropName?: string;
  germplasmPUI?: string;
}

/** Accessions matching the filter, by accession number. */
export async function findGermplasm(ds: DataSource, f: GermplasmFilter): Promise<Record<string, unknown>[]> {
  const qb = ds.getRepository(Accession).createQueryBuilder('a').innerJoinAndSelect('a.site', 'site').orderBy('a.accessionNumber', 'ASC').addOrderBy('a.id', 'ASC');
  const byId = numericId(f.germplasmDbId);
  const byPui = f.germplasmPUI === undefined ? undefined : puiId(f.germplasmPUI);
  if (byId === null || byPui === null) return [];
  if (byId !== undefined) qb.andWhere('a.id = :byId', { byId });
  if (byPui !== undefined) qb.andWhere('a.id = :byPui', { byPui });
  if (f.germplasmName !== undefined) qb.andWhere('a.name = :name', { name: f.germplasmName });
  if (f.accessionNumber !== undefined) qb.andWhere('LOWER(a.accessionNumber) = LOWER(:number)', { number: f.accessionNumber });
  if (f.commonCropName !== undefined) qb.andWhere('LOWER(a.cropName) = LOWER(:crop)', { crop: f.commonCropName });
  return (await qb.getMany()).map(toGermplasm);
}

function puiId(pui: string): number | null {
  const m = /^urn:hueledger:germplasm:([1-9]\d{0,11})$/.exec(pui);
  return m ? Number(m[1]) : null;
}

/** One germplasm by its DbId; 404 in BrAPI's form when there is none. */
export async function getGermplasm(ds: DataSource, dbId: string): Promise<Record<string, unknown>> {
  const id = numericId(dbId);
  const a = id ? await ds.getRepository(Accession).findOne({ where: { id }, relations: { site: true } }) : null;
  if (!a) throw new BrapiError(404, `The requested object germplasmDbId ${dbId.slice(0, 40)} is not found`);
  return toGermplasm(a);
}

/** Sites as BrAPI locations, with a GeoJSON point when the site has coordinates. */
export async function findLocations(ds: DataSource, f: { locationDbId?: string; locationName?: string }): Promise<Record<string, unknown>[]> {
  const id = numericId(f.locationDbId);
  if (id === null) return [];
  const sites = await ds.getRepository(Site).find({ where: { ...(id ? { id } : {}), ...(f.locationName !== undefined ? { name: f.locationName } : {}) }, order: { code: 'ASC' } });
  return sites.map((s) => ({
    locationDbId: String(s.id),
    locationName: s.name,
    abbreviation: s.code,
    ...(s.latitude !== null && s.longitude !== null
      ? { coordinates: { type: 'Feature', geometry: { type: 'Point', coordinates: s.elevationM === null ? [s.longitude, s.latitude] : [s.longitude, s.latitude, s.elevationM] } } }
      : {}),
    additionalInfo: info({ timezone: s.timezone, elevationM: s.elevationM }),
  }));
}

/**
 * A season as BrAPI has it — a named part of one year — from the season names and years readings
 * fall in. Site schemes may share a name ("Wet"), and BrAPI seasons are not per site, so the
 * DbId is the year and the name: "2025-Wet".
 */
export function seasonDbId(year: number, name: string): string {
  return `${year}-${name}`;
}

/** Parses a season DbId back into year and name; null when it is not one of ours. */
export function parseSeasonDbId(dbId: string): { year: number; name: string } | null {
  const m = /^(\d{4})-(.{1,40})$/.exec(dbId);
  return m ? { year: Number(m[1]), name: m[2]! } : null;
}

/** Every season of a current reading, by year then name. */
export async function findSeasons(ds: DataSource, f: { seasonDbId?: string; seasonName?: string; year?: number }): Promise<Record<string, unknown>[]> {
  const rows: { season: string; seasonYear: number }[] = await ds.query(
    `SELECT DISTINCT "season", "seasonYear" FROM "reading" WHERE "supersededById" IS NULL AND "season" IS NOT NULL AND "seasonYear" IS NOT NULL ORDER BY "seasonYear", "season"`,
  );
  const wanted = f.seasonDbId === undefined ? undefined : parseSeasonDbId(f.seasonDbId);
  if (wanted === null) return [];
  return rows
    .filter((r) => (!wanted || (r.seasonYear === wanted.year && r.season === wanted.name)) && (f.seasonName === undefined || r.season === f.seasonName) && (f.year === undefined || r.seasonYear === f.year))
    .map((r) => ({ seasonDbId: seasonDbId(r.seasonYear, r.season), seasonName: r.season, year: r.seasonYear }));
}

/** The name a plant goes by outside Hueledger: its accession number and label. */
export function unitName(accessionNumber: string, label: string): string {
  return `${accessionNumber} ${label}`;
}

/** Plants as BrAPI observation units (level "plant"). */
export async function findObservationUnits(ds: DataSource, f: { observationUnitDbId?: string; germplasmDbId?: string; locationDbId?: string }): Promise<Record<string, unknown>[]> {
  const qb = ds.getRepository(Plant).createQueryBuilder('p').innerJoinAndSelect('p.accession', 'a').innerJoinAndSelect('p.site', 's').orderBy('a.accessionNumber', 'ASC').addOrderBy('p.label', 'ASC').addOrderBy('p.id', 'ASC');
  const filters = [
    [numericId(f.observationUnitDbId), 'p.id'],
    [numericId(f.germplasmDbId), 'a.id'],
    [numericId(f.locationDbId), 's.id'],
  ] as const;
  for (const [i, [wanted, column]] of filters.entries()) {
    if (wanted === null) return [];
    if (wanted !== undefined) qb.andWhere(`${column} = :v${i}`, { [`v${i}`]: wanted });
  }
  return (await qb.getMany()).map((p) => ({
    observationUnitDbId: String(p.id),
    observationUnitName: unitName(p.accession.accessionNumber, p.label),
    observationUnitPUI: `urn:hueledger:plant:${p.id}`,
    germplasmDbId: String(p.accession.id),
    germplasmName: p.accession.name,
    locationDbId: String(p.site.id),
    locationName: p.site.name,
    additionalInfo: info({ observationLevel: 'plant', plantLabel: p.label, plantedOn: p.plantedOn }),
  }));
}
