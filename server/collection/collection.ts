import type { DataSource } from 'typeorm';
import type { Accession as AccessionDto, CreateAccessionBody, Character as CharacterDto, Site as SiteDto } from '../../shared/api/collection.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Accession, Plant, toAccessionDto } from './accession.entity.js';
import { assertAccessionNumberFree } from './accessions.js';
import { Character, toCharacterDto } from './character.entity.js';
import { Site, toSiteDto } from './site.entity.js';

/** Every site with its seasons, by code. */
export async function listSites(ds: DataSource): Promise<SiteDto[]> {
  const sites = await ds.getRepository(Site).find({ relations: { seasons: true }, order: { code: 'ASC' } });
  return sites.map(toSiteDto);
}

/** The character catalogue in catalogue order. */
export async function listCharacters(ds: DataSource): Promise<CharacterDto[]> {
  const rows = await ds.getRepository(Character).find({ order: { sortOrder: 'ASC', id: 'ASC' } });
  return rows.map(toCharacterDto);
}

/** Every accession with its plants, by accession number. */
export async function listAccessions(ds: DataSource): Promise<AccessionDto[]> {
  const rows = await ds.getRepository(Accession).find({ relations: { site: true, plants: { site: true } }, order: { accessionNumber: 'ASC' } });
  return rows.map(toAccessionDto);
}

/** Creates an accession and its plants in one transaction; 400 for an unknown site, 409 for a taken number. */
export async function createAccession(ds: DataSource, actor: Actor, body: CreateAccessionBody): Promise<AccessionDto> {
  return ds.transaction(async (m) => {
    const siteIds = new Set([body.siteId, ...(body.plants ?? []).map((p) => p.siteId ?? body.siteId)]);
    const sites = new Map<number, Site>();
    for (const id of siteIds) {
      const site = await m.findOneBy(Site, { id });
      if (!site) throw AppError.badRequest(`No site ${id}.`, [{ field: id === body.siteId ? 'siteId' : 'plants.siteId', message: `site ${id} does not exist` }]);
      sites.set(id, site);
    }
    await assertAccessionNumberFree(m, body.accessionNumber);
    const labels = (body.plants ?? []).map((p) => p.label);
    if (new Set(labels).size !== labels.length) throw AppError.badRequest('Plant labels must be unique within an accession.', [{ field: 'plants', message: 'labels repeat' }]);
    const site = sites.get(body.siteId)!;
    const accession = await m.save(
      m.create(Accession, {
        accessionNumber: body.accessionNumber,
        name: body.name,
        otherNames: body.otherNames ?? [],
        instituteCode: body.instituteCode ?? null,
        originCountry: body.originCountry ?? null,
        collectingSite: body.collectingSite ?? null,
        collectingLatitude: body.collectingLatitude ?? null,
        collectingLongitude: body.collectingLongitude ?? null,
        collectingElevationM: body.collectingElevationM ?? null,
        acquisitionDate: body.acquisitionDate ?? null,
        sampleStatus: body.sampleStatus ?? null,
        donorName: body.donorName ?? null,
        remarks: body.remarks ?? null,
        site,
      }),
    );
    accession.plants = [];
    for (const p of body.plants ?? []) {
      accession.plants.push(await m.save(m.create(Plant, { accession, site: sites.get(p.siteId ?? body.siteId)!, label: p.label, plantedOn: p.plantedOn })));
    }
    await recordAudit(m, actor, 'accession.created', `accession:${accession.id}`, { accessionNumber: accession.accessionNumber, plants: labels });
    return toAccessionDto(accession);
  });
}
