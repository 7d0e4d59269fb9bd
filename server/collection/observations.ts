import { IsNull, type DataSource, type EntityManager, type FindOptionsWhere } from 'typeorm';
import type { CreateObservationBody, CreateObservationsBody, Observation as ObservationDto, ObservationPage, ObservationQuery, SupersedeObservationBody } from '../../shared/api/descriptors.js';
import { KIND_QUANTITY } from '../../shared/api/descriptor-answers.js';
import { quantityOf, toSi, unitsOf, type Unit } from '../../shared/units/units.js';
import { implausibleValue } from '../../shared/units/plausible-ranges.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import type { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import { Accession, Plant } from './accession.entity.js';
import { Descriptor } from './descriptor.entity.js';
import { Observation, toObservationDto } from './observation.entity.js';

/** How far ahead of the server's clock an observation time may be (our own allowance for phone clocks). */
const CLOCK_SKEW_MS = 5 * 60 * 1000;

type ValueInput = Pick<CreateObservationBody, 'value' | 'unit' | 'category'>;

/** What is stored for a value: SI, category, and what was typed; 400 naming the field when it does not fit the descriptor. */
export function valueFor(d: Descriptor, input: ValueInput): Pick<Observation, 'valueSi' | 'category' | 'enteredValue' | 'enteredUnit'> {
  const bad = (field: string, message: string) => AppError.badRequest(`The observation does not fit ${d.code}: ${field} ${message}.`, [{ field, message }]);
  if (d.kind === 'ratio') throw bad('descriptorId', `is the ratio ${d.code}; ratios are computed from ${d.numeratorCode} and ${d.denominatorCode}, never typed`);
  if (d.kind === 'category') {
    if (input.value !== undefined) throw bad('value', `must be left out: ${d.code} takes a category`);
    if (input.unit !== undefined) throw bad('unit', `must be left out: ${d.code} takes a category`);
    if (input.category === undefined) throw bad('category', `is required: one of ${d.categories.map((c) => c.id).join(', ')}`);
    if (!d.categories.some((c) => c.id === input.category)) throw bad('category', `must be one of ${d.categories.map((c) => c.id).join(', ')}`);
    return { valueSi: null, category: input.category, enteredValue: null, enteredUnit: null };
  }
  const quantity = KIND_QUANTITY[d.kind]!;
  if (input.category !== undefined) throw bad('category', `must be left out: ${d.code} takes a value`);
  if (input.value === undefined) throw bad('value', 'is required');
  const unit: Unit | undefined = input.unit ?? (quantity === 'count' ? 'count' : undefined);
  if (unit === undefined) throw bad('unit', `is required: one of ${unitsOf(quantity).join(', ')}`);
  if (quantityOf(unit) !== quantity) throw bad('unit', `must be one of ${unitsOf(quantity).join(', ')} for a ${quantity}, not ${unit}`);
  if (quantity === 'count' && !Number.isInteger(input.value)) throw bad('value', 'must be a whole number for a count');
  const implausible = implausibleValue(d, quantity, input.value, unit);
  if (implausible) throw bad('value', `is out of range: ${implausible}`);
  return { valueSi: toSi(input.value, unit), category: null, enteredValue: input.value, enteredUnit: unit };
}

function observedAtOf(value: string | undefined, now: Date): Date {
  if (value === undefined) return now;
  const at = new Date(value);
  if (at.getTime() > now.getTime() + CLOCK_SKEW_MS) throw AppError.badRequest('The observation time is in the future.', [{ field: 'observedAt', message: 'is in the future' }]);
  return at;
}

async function plantOf(m: EntityManager, accessionId: number, plantId: number | null | undefined): Promise<Plant | null> {
  if (plantId === undefined || plantId === null) return null;
  const plant = await m.findOne(Plant, { where: { id: plantId }, relations: { accession: true } });
  if (!plant) throw AppError.badRequest(`No plant ${plantId}.`, [{ field: 'plantId', message: `plant ${plantId} does not exist` }]);
  if (plant.accession.id !== accessionId) throw AppError.badRequest(`Plant ${plantId} is not of accession ${accessionId}.`, [{ field: 'plantId', message: `plant ${plantId} belongs to another accession` }]);
  return plant;
}

async function reload(m: EntityManager, id: number): Promise<ObservationDto> {
  return toObservationDto(await m.findOneOrFail(Observation, { where: { id }, relations: { descriptor: true, observer: true } }));
}

/** Stores one observation in SI, with what was typed; 400 naming the field for unknown ids or a value that does not fit. */
export async function createObservation(ds: DataSource, actor: Actor, observer: User, body: CreateObservationBody): Promise<ObservationDto> {
  return ds.transaction((m) => createIn(m, actor, observer, body));
}

async function createIn(m: EntityManager, actor: Actor, observer: User, body: CreateObservationBody): Promise<ObservationDto> {
  {
    const accession = await m.findOneBy(Accession, { id: body.accessionId });
    if (!accession) throw AppError.badRequest(`No accession ${body.accessionId}.`, [{ field: 'accessionId', message: `accession ${body.accessionId} does not exist` }]);
    const descriptor = await m.findOneBy(Descriptor, { id: body.descriptorId });
    if (!descriptor) throw AppError.badRequest(`No descriptor ${body.descriptorId}.`, [{ field: 'descriptorId', message: `descriptor ${body.descriptorId} does not exist` }]);
    if (!descriptor.active) throw AppError.badRequest(`${descriptor.code} is no longer offered.`, [{ field: 'descriptorId', message: `${descriptor.code} is inactive` }]);
    const plant = await plantOf(m, accession.id, body.plantId);
    const value = valueFor(descriptor, body);
    const saved = await m.save(
      m.create(Observation, { accession, plant, descriptor, observer, observedAt: observedAtOf(body.observedAt, new Date()), notes: body.notes || null, ...value, supersedes: null, supersededBy: null }),
    );
    await recordAudit(m, actor, 'observation.created', `observation:${saved.id}`, { accessionId: accession.id, plantId: plant?.id ?? null, descriptor: descriptor.code, ...value });
    return reload(m, saved.id);
  }
}

/**
 * Stores several observations of one plant at once, all or nothing: the first value that does not
 * fit refuses the lot with a 400 naming it (`observations.3.value`), and nothing is written.
 */
export async function createObservations(ds: DataSource, actor: Actor, observer: User, body: CreateObservationsBody): Promise<ObservationDto[]> {
  return ds.transaction(async (m) => {
    const saved: ObservationDto[] = [];
    for (const [i, item] of body.observations.entries()) {
      try {
        saved.push(await createIn(m, actor, observer, item));
      } catch (error) {
        if (error instanceof AppError && error.errors) {
          throw AppError.badRequest(`Value ${i + 1} of ${body.observations.length}: ${error.detail} Nothing was saved.`, error.errors.map((e) => ({ field: `observations.${i}.${e.field}`, message: e.message })));
        }
        throw error;
      }
    }
    return saved;
  });
}

/**
 * Corrects an observation: a new row with the same accession and descriptor supersedes the old,
 * which stays, linked both ways. Recorders and trainers correct only their own; admins any.
 * 404 unknown, 403 someone else's, 409 already superseded.
 */
export async function supersedeObservation(ds: DataSource, actor: Actor, observer: User, id: number, body: SupersedeObservationBody): Promise<ObservationDto> {
  return ds.transaction(async (m) => {
    const old = await m.findOne(Observation, { where: { id }, relations: { accession: true, descriptor: true, plant: true, observer: true } });
    if (!old) throw AppError.notFound(`No observation ${id}.`);
    if (observer.role !== 'admin' && old.observerId !== observer.id) throw AppError.forbidden('Only an admin may correct someone else’s observation.');
    if (old.supersededById) throw AppError.conflict(`Observation ${id} has already been corrected by observation ${old.supersededById}; correct that one instead.`);
    const plant = body.plantId === undefined ? old.plant : await plantOf(m, old.accession.id, body.plantId);
    const value = valueFor(old.descriptor, body);
    const saved = await m.save(
      m.create(Observation, {
        accession: old.accession,
        plant,
        descriptor: old.descriptor,
        observer,
        observedAt: body.observedAt === undefined ? old.observedAt : observedAtOf(body.observedAt, new Date()),
        notes: body.notes === undefined ? old.notes : body.notes || null,
        ...value,
        supersedes: old,
        supersededBy: null,
      }),
    );
    await m.update(Observation, { id: old.id }, { supersededBy: { id: saved.id } });
    await recordAudit(m, actor, 'observation.superseded', `observation:${old.id}`, { by: saved.id, from: { valueSi: old.valueSi, category: old.category }, to: value });
    return reload(m, saved.id);
  });
}

/** Observations with filters, newest observed first; only current ones unless superseded are asked for. */
export async function listObservations(ds: DataSource, q: ObservationQuery): Promise<ObservationPage> {
  const where: FindOptionsWhere<Observation> = {};
  if (q.accessionId !== undefined) where.accession = { id: q.accessionId };
  if (q.plantId !== undefined) where.plant = { id: q.plantId };
  if (q.descriptorId !== undefined) where.descriptor = { id: q.descriptorId };
  if (q.includeSuperseded !== 'true') where.supersededBy = IsNull();
  const [rows, total] = await ds.getRepository(Observation).findAndCount({
    where,
    relations: { descriptor: true, observer: true },
    order: { observedAt: 'DESC', id: 'DESC' },
    skip: (q.page - 1) * q.pageSize,
    take: q.pageSize,
  });
  return { items: rows.map(toObservationDto), total };
}
