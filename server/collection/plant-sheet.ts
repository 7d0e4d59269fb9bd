import type { DataSource, EntityManager } from 'typeorm';
import type { CollectionProgress, CreateSkipBody, PlantProgress, PlantSheet, ProgressQuery, SheetColour, SheetDescriptor, SheetRow, SheetSkip } from '../../shared/api/plant-sheet.js';
import { KIND_QUANTITY } from '../../shared/api/descriptor-answers.js';
import { formatSi } from '../../shared/units/units.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import type { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import { Accession, Plant } from './accession.entity.js';
import { Character } from './character.entity.js';
import { Descriptor } from './descriptor.entity.js';
import type { Observation } from './observation.entity.js';
import { PlantSkip } from './plant-skip.entity.js';
import { plantStates, progressOf, seasonWindowOf, sheetCatalogue, type PlantState } from './plant-progress.js';

const PLANT_RELATIONS = { accession: true, site: { seasons: true } } as const;

async function findPlant(m: EntityManager, id: number): Promise<Plant> {
  const plant = await m.findOne(Plant, { where: { id }, relations: PLANT_RELATIONS });
  if (!plant) throw AppError.notFound(`No plant ${id}.`);
  return plant;
}

function skipDto(s: PlantSkip): SheetSkip {
  return { id: s.id, reason: s.reason, at: s.createdAt.toISOString() };
}

/**
 * What a colour row and a descriptor row share: done when this season has an entry (a reading or a
 * value), else skipped when a skip is recorded, else to do; the skip is shown only when not done.
 */
function entryState<E, V>(entry: E | undefined, skip: PlantSkip | undefined, show: (entry: E) => V): { status: SheetColour['status']; value: V | null; skip: SheetSkip | null } {
  if (entry) return { status: 'done', value: show(entry), skip: null };
  return { status: skip ? 'skipped' : 'todo', value: null, skip: skip ? skipDto(skip) : null };
}

function colourRow(c: Character, state: PlantState): SheetColour {
  const { status, value, skip } = entryState(state.readings.get(c.id), state.characterSkips.get(c.id), (r) => ({
    id: r.id, method: r.method, hex: r.hex, bestChipCode: r.bestChipCode, bestChipName: r.bestChipName, bestChipHex: r.bestChipHex, deltaE00: r.deltaE00, observedAt: r.observedAt.toISOString(),
  }));
  return { characterId: c.id, code: c.code, label: c.label, organ: c.organ, caution: c.caution, status, reading: value, skip };
}

function formattedValue(d: Descriptor, o: Observation) {
  if (d.kind === 'category') {
    const label = d.categories.find((c) => c.id === o.category)?.label ?? o.category ?? '';
    return { metric: label, imperial: label };
  }
  const quantity = KIND_QUANTITY[d.kind]!;
  return { metric: formatSi(o.valueSi!, quantity, 'metric'), imperial: formatSi(o.valueSi!, quantity, 'imperial') };
}

function descriptorRow(d: Descriptor, state: PlantState): SheetDescriptor {
  const { status, value, skip } = entryState(state.observations.get(d.id), state.descriptorSkips.get(d.id), (o) => ({
    observationId: o.id, formatted: formattedValue(d, o), observedAt: o.observedAt.toISOString(),
  }));
  return { descriptorId: d.id, code: d.code, label: d.label, kind: d.kind, caution: d.caution, status, value, skip };
}

/**
 * `GET /api/plants/:id/sheet`: every active colour character and typed descriptor in walk order,
 * each done (latest this season), skipped or to do. A descriptor linked to a colour character
 * shares its row, placed where the character is.
 */
export async function plantSheet(ds: DataSource, plantId: number, at = new Date()): Promise<PlantSheet> {
  const plant = await findPlant(ds.manager, plantId);
  const catalogue = await sheetCatalogue(ds);
  const [state] = await plantStates(ds, [plant], at);
  const paired = new Map<number, Descriptor>();
  for (const d of catalogue.descriptors) {
    if (d.characterId !== null && catalogue.characters.some((c) => c.id === d.characterId) && !paired.has(d.characterId)) paired.set(d.characterId, d);
  }
  const pairedIds = new Set([...paired.values()].map((d) => d.id));
  const rows: SheetRow[] = [
    ...catalogue.characters.map((c) => {
      const d = paired.get(c.id);
      return { key: d ? `c${c.id}+d${d.id}` : `c${c.id}`, sortOrder: c.sortOrder, colour: colourRow(c, state!), descriptor: d ? descriptorRow(d, state!) : null };
    }),
    ...catalogue.descriptors.filter((d) => !pairedIds.has(d.id)).map((d) => ({ key: `d${d.id}`, sortOrder: d.sortOrder, colour: null, descriptor: descriptorRow(d, state!) })),
  ];
  // Stable: characters before descriptors at an equal place, each in its catalogue order.
  rows.sort((a, b) => a.sortOrder - b.sortOrder);
  return {
    plant: { id: plant.id, label: plant.label, plantedOn: plant.plantedOn },
    accession: { id: plant.accession.id, accessionNumber: plant.accession.accessionNumber, name: plant.accession.name },
    site: { id: plant.site.id, code: plant.site.code, name: plant.site.name },
    rows,
    progress: progressOf(state!, catalogue),
  };
}

/** `GET /api/accessions/:id/progress`: each plant of the accession, by label. */
export async function accessionProgress(ds: DataSource, accessionId: number, at = new Date()): Promise<PlantProgress[]> {
  const plants = await ds.getRepository(Plant).find({ where: { accession: { id: accessionId } }, relations: PLANT_RELATIONS });
  if (!plants.length && !(await ds.getRepository(Accession).existsBy({ id: accessionId }))) throw AppError.notFound(`No accession ${accessionId}.`);
  const catalogue = await sheetCatalogue(ds);
  const progress = (await plantStates(ds, plants, at)).map((s) => progressOf(s, catalogue));
  return progress.sort((a, b) => a.plantLabel.localeCompare(b.plantLabel, 'en', { numeric: true }));
}

/** `GET /api/progress`: every plant (of one site, if asked), by accession number and label, with counts by state. */
export async function collectionProgress(ds: DataSource, q: ProgressQuery): Promise<CollectionProgress> {
  const plants = await ds.getRepository(Plant).find({ where: q.siteId ? { site: { id: q.siteId } } : {}, relations: PLANT_RELATIONS });
  const catalogue = await sheetCatalogue(ds);
  const at = q.at ? new Date(q.at) : new Date();
  const list = (await plantStates(ds, plants, at)).map((s) => progressOf(s, catalogue));
  list.sort((a, b) => a.accessionNumber.localeCompare(b.accessionNumber, 'en', { numeric: true }) || a.plantLabel.localeCompare(b.plantLabel, 'en', { numeric: true }));
  const counts = { complete: 0, partial: 0, 'not-started': 0 };
  for (const p of list) counts[p.state] += 1;
  return { plants: list, counts };
}

/** Sets a character or descriptor aside for the plant this season; 404 unknown plant, 400 naming the field for an unknown or inactive entry. */
export async function createSkip(ds: DataSource, actor: Actor, user: User, plantId: number, body: CreateSkipBody): Promise<SheetSkip> {
  return ds.transaction(async (m) => {
    const plant = await findPlant(m, plantId);
    if (body.characterId !== undefined) {
      const c = await m.findOneBy(Character, { id: body.characterId });
      if (!c || !c.active || !c.colour) throw AppError.badRequest(`No active colour character ${body.characterId}.`, [{ field: 'characterId', message: `character ${body.characterId} is not an active colour character` }]);
    } else {
      const d = await m.findOneBy(Descriptor, { id: body.descriptorId! });
      if (!d || !d.active || d.kind === 'ratio') throw AppError.badRequest(`No typed descriptor ${body.descriptorId}.`, [{ field: 'descriptorId', message: `descriptor ${body.descriptorId} is not an active descriptor that is typed` }]);
    }
    const window = seasonWindowOf(new Date(), plant.site);
    const skip = await m.save(
      m.create(PlantSkip, { plantId, characterId: body.characterId ?? null, descriptorId: body.descriptorId ?? null, season: window.season, seasonYear: window.seasonYear, reason: body.reason, userId: user.id }),
    );
    await recordAudit(m, actor, 'plant.skip.created', `plant:${plantId}`, { skipId: skip.id, characterId: skip.characterId, descriptorId: skip.descriptorId, reason: skip.reason, ...window });
    return skipDto(skip);
  });
}
