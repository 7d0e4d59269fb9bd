import type { DataSource, EntityManager } from 'typeorm';
import type { Accession as AccessionDto, CreatePlantBody, Plant as PlantDto, UpdateAccessionBody, UpdatePlantBody } from '../../shared/api/collection.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Accession, Plant, toAccessionDto } from './accession.entity.js';
import { Site } from './site.entity.js';

/**
 * 409 naming the field when another accession holds the number in any letter case: "hl-0001" and
 * "HL-0001" would read as one accession on a label and in a spreadsheet lookup.
 */
export async function assertAccessionNumberFree(m: EntityManager, accessionNumber: string, exceptId?: number): Promise<void> {
  const holder = await m.createQueryBuilder(Accession, 'a').where('LOWER(a.accessionNumber) = LOWER(:n)', { n: accessionNumber }).getOne();
  if (holder && holder.id !== exceptId) {
    throw new AppError(409, 'Conflict', `An accession ${holder.accessionNumber} already exists; accession numbers are compared regardless of case.`, [
      { field: 'accessionNumber', message: `is taken: an accession ${holder.accessionNumber} already exists (letter case does not count)` },
    ]);
  }
}

/** One accession with its plants; 404 when there is none. */
export async function findAccession(m: EntityManager, id: number): Promise<Accession> {
  const accession = await m.findOne(Accession, { where: { id }, relations: { site: true, plants: { site: true } } });
  if (!accession) throw AppError.notFound(`No accession ${id}.`);
  return accession;
}

/** `GET /api/accessions/:id`. */
export async function getAccession(ds: DataSource, id: number): Promise<AccessionDto> {
  return toAccessionDto(await findAccession(ds.manager, id));
}

/** A site named in a body; 400 naming the field when it does not exist. */
async function siteFor(m: EntityManager, id: number, field: string): Promise<Site> {
  const site = await m.findOneBy(Site, { id });
  if (!site) throw AppError.badRequest(`No site ${id}.`, [{ field, message: `site ${id} does not exist` }]);
  return site;
}

/** The passport fields PATCH may change; null clears an optional one. */
const PASSPORT_KEYS = [
  'accessionNumber', 'name', 'otherNames', 'instituteCode', 'genus', 'species', 'speciesAuthor', 'cropName',
  'originCountry', 'collectingSite', 'collectingLatitude', 'collectingLongitude', 'collectingElevationM', 'acquisitionDate', 'sampleStatus', 'donorName', 'remarks',
] as const;

/** Changes passport fields (and the holding site); 404 unknown, 400 unknown site, 409 for a taken number. */
export async function updateAccession(ds: DataSource, actor: Actor, id: number, body: UpdateAccessionBody): Promise<AccessionDto> {
  return ds.transaction(async (m) => {
    const accession = await findAccession(m, id);
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    if (body.accessionNumber !== undefined && body.accessionNumber !== accession.accessionNumber) await assertAccessionNumberFree(m, body.accessionNumber, id);
    for (const key of PASSPORT_KEYS) {
      const value = body[key];
      if (value === undefined) continue;
      if (JSON.stringify(value) === JSON.stringify(accession[key])) continue;
      changes[key] = { from: accession[key], to: value };
      Object.assign(accession, { [key]: value });
    }
    if (body.siteId !== undefined && body.siteId !== accession.site.id) {
      const site = await siteFor(m, body.siteId, 'siteId');
      changes['siteId'] = { from: accession.site.id, to: site.id };
      accession.site = site;
    }
    if (Object.keys(changes).length) {
      const { plants, ...own } = accession;
      await m.save(Accession, own);
      accession.plants = plants;
      await recordAudit(m, actor, 'accession.updated', `accession:${id}`, changes);
    }
    return toAccessionDto(accession);
  });
}

function toPlantDto(p: Plant, accessionId: number): PlantDto {
  return { id: p.id, accessionId, siteId: p.site.id, label: p.label, plantedOn: p.plantedOn };
}

async function assertLabelFree(m: EntityManager, accessionId: number, label: string, exceptId?: number): Promise<void> {
  const holder = await m.findOne(Plant, { where: { accession: { id: accessionId }, label } });
  if (holder && holder.id !== exceptId) throw new AppError(409, 'Conflict', `A plant ${label} already exists in this accession.`, [{ field: 'label', message: `is taken: a plant ${label} already exists in this accession` }]);
}

/** Adds a plant to an accession (at the accession's site unless another is named); 409 for a taken label. */
export async function createPlant(ds: DataSource, actor: Actor, accessionId: number, body: CreatePlantBody): Promise<PlantDto> {
  return ds.transaction(async (m) => {
    const accession = await findAccession(m, accessionId);
    const site = body.siteId === undefined ? accession.site : await siteFor(m, body.siteId, 'siteId');
    await assertLabelFree(m, accessionId, body.label);
    const plant = await m.save(m.create(Plant, { accession, site, label: body.label, plantedOn: body.plantedOn }));
    await recordAudit(m, actor, 'plant.created', `plant:${plant.id}`, { accessionId, label: plant.label, plantedOn: plant.plantedOn, siteId: site.id });
    return toPlantDto(plant, accessionId);
  });
}

/** Changes a plant's label, planting date or site; 404 unknown, 400 unknown site, 409 for a taken label. */
export async function updatePlant(ds: DataSource, actor: Actor, id: number, body: UpdatePlantBody): Promise<PlantDto> {
  return ds.transaction(async (m) => {
    const plant = await m.findOne(Plant, { where: { id }, relations: { accession: true, site: true } });
    if (!plant) throw AppError.notFound(`No plant ${id}.`);
    const changes: Record<string, { from: unknown; to: unknown }> = {};
    if (body.label !== undefined && body.label !== plant.label) {
      await assertLabelFree(m, plant.accession.id, body.label, id);
      changes['label'] = { from: plant.label, to: body.label };
      plant.label = body.label;
    }
    if (body.plantedOn !== undefined && body.plantedOn !== plant.plantedOn) {
      changes['plantedOn'] = { from: plant.plantedOn, to: body.plantedOn };
      plant.plantedOn = body.plantedOn;
    }
    if (body.siteId !== undefined && body.siteId !== plant.site.id) {
      const site = await siteFor(m, body.siteId, 'siteId');
      changes['siteId'] = { from: plant.site.id, to: site.id };
      plant.site = site;
    }
    if (Object.keys(changes).length) {
      await m.save(plant);
      await recordAudit(m, actor, 'plant.updated', `plant:${id}`, changes);
    }
    return toPlantDto(plant, plant.accession.id);
  });
}
