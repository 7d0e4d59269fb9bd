// Observations: every current reading as four observations (L*, a*, b*, chip code) and every
// current descriptor value as one. Superseded rows are never served.
import { In, type DataSource } from 'typeorm';
import { Observation } from '../collection/observation.entity.js';
import { Reading } from '../readings/reading.entity.js';
import { clusterWords } from '../../shared/api/reading-answers.js';
import { parseSeasonDbId, numericId, seasonDbId, unitName } from './brapi-collection.js';
import type { PageRequest } from './brapi-envelope.js';
import { COLOUR_PARTS, colourVariableName, parseVariableDbId, variableDbId, type ColourPart } from './brapi-variables.js';

/** The filters of `GET /observations` that we honour (names as the specification gives them). */
export interface ObservationFilter {
  observationDbId?: string;
  germplasmDbId?: string;
  observationUnitDbId?: string;
  observationVariableDbId?: string;
  seasonDbId?: string;
  locationDbId?: string;
  observationTimeStampRangeStart?: Date;
  observationTimeStampRangeEnd?: Date;
}

/** Colour values to 2 places, as the readings exports write them: finer than any instrument repeats. */
const round2 = (x: number) => Math.round(x * 100) / 100;

/** An observation DbId: "r123-L" (a reading's coordinate or chip) or "o45" (a descriptor value). */
export function observationDbId(row: { kind: 'r'; id: number; part: ColourPart } | { kind: 'o'; id: number }): string {
  return row.kind === 'r' ? `r${row.id}-${row.part}` : `o${row.id}`;
}

function parseObservationDbId(dbId: string): { kind: 'r'; id: number; part: ColourPart } | { kind: 'o'; id: number } | null {
  let m = /^r([1-9]\d{0,11})-(L|a|b|chip)$/.exec(dbId);
  if (m) return { kind: 'r', id: Number(m[1]), part: m[2] as ColourPart };
  m = /^o([1-9]\d{0,11})$/.exec(dbId);
  return m ? { kind: 'o', id: Number(m[1]) } : null;
}

/** TypeORM keeps SQLite datetimes as UTC text "YYYY-MM-DD HH:MM:SS.SSS". */
const sqlTime = (d: Date) => d.toISOString().replace('T', ' ').replace('Z', '');

/** A filter as SQL over each source: readings (`r`) and descriptor values (`o`); null when that source can match nothing. */
interface Plan {
  readings: { where: string[]; params: unknown[]; parts: readonly ColourPart[] } | null;
  values: { where: string[]; params: unknown[] } | null;
}

/** Splits a filter into a query per source; a filter naming something that cannot be ours empties both. */
function planOf(f: ObservationFilter): Plan {
  const none: Plan = { readings: null, values: null };
  const r = { where: ['r."supersededById" IS NULL'], params: [] as unknown[], parts: COLOUR_PARTS as readonly ColourPart[] };
  const o = { where: ['o."supersededById" IS NULL', `d."kind" != 'ratio'`], params: [] as unknown[] };
  let readings = true;
  let values = true;
  const both = (rSql: string, oSql: string, value: unknown) => {
    r.where.push(rSql);
    r.params.push(value);
    o.where.push(oSql);
    o.params.push(value);
  };
  const ids: [string | undefined, string, string][] = [
    [f.germplasmDbId, 'r."accessionId" = ?', 'o."accessionId" = ?'],
    [f.observationUnitDbId, 'r."plantId" = ?', 'o."plantId" = ?'],
    [f.locationDbId, 'r."siteId" = ?', 'COALESCE(pl."siteId", a."siteId") = ?'],
  ];
  for (const [value, rSql, oSql] of ids) {
    const id = numericId(value);
    if (id === null) return none;
    if (id !== undefined) both(rSql, oSql, id);
  }
  // A variable or an observation id names one side: a colour part of readings, or descriptor values.
  const onlyReadings = (sql: string, value: number, part: ColourPart) => {
    values = false;
    r.where.push(sql);
    r.params.push(value);
    r.parts = r.parts.filter((p) => p === part);
  };
  const onlyValues = (sql: string, value: number) => {
    readings = false;
    o.where.push(sql);
    o.params.push(value);
  };
  if (f.observationVariableDbId !== undefined) {
    const v = parseVariableDbId(f.observationVariableDbId);
    if (!v) return none;
    if (v.kind === 'colour') onlyReadings('r."characterId" = ?', v.characterId, v.part);
    else onlyValues('o."descriptorId" = ?', v.descriptorId);
  }
  if (f.observationDbId !== undefined) {
    const id = parseObservationDbId(f.observationDbId);
    if (!id) return none;
    if (id.kind === 'r') onlyReadings('r."id" = ?', id.id, id.part);
    else onlyValues('o."id" = ?', id.id);
  }
  if (f.seasonDbId !== undefined) {
    const season = parseSeasonDbId(f.seasonDbId);
    if (!season) return none;
    // Seasons are derived for readings only; a descriptor value has none.
    values = false;
    r.where.push('r."season" = ?', 'r."seasonYear" = ?');
    r.params.push(season.name, season.year);
  }
  if (f.observationTimeStampRangeStart) both('r."observedAt" >= ?', 'o."observedAt" >= ?', sqlTime(f.observationTimeStampRangeStart));
  if (f.observationTimeStampRangeEnd) both('r."observedAt" <= ?', 'o."observedAt" <= ?', sqlTime(f.observationTimeStampRangeEnd));
  return { readings: readings && r.parts.length ? r : null, values: values ? o : null };
}

const VALUES_FROM = `FROM "observation" o JOIN "descriptor" d ON d."id" = o."descriptorId" JOIN "accession" a ON a."id" = o."accessionId" LEFT JOIN "plant" pl ON pl."id" = o."plantId"`;

type Key = { kind: 'r'; rowId: number; part: ColourPart } | { kind: 'o'; rowId: number };

/**
 * One page of observations and how many match. The order is fixed and cheap to page: readings by
 * id, each as L*, a*, b*, chip; then descriptor values by id. Each source is paged by its primary
 * key with LIMIT/OFFSET in rows of its own table, so a page never sorts the whole collection
 * (see bench/brapi.bench.ts).
 */
export async function findObservations(ds: DataSource, f: ObservationFilter, page: PageRequest): Promise<{ data: Record<string, unknown>[]; totalCount: number }> {
  const plan = planOf(f);
  const count = async (sql: string, params: unknown[]) => ((await ds.query(sql, params)) as [{ n: number }])[0].n;
  const nReadings = plan.readings ? await count(`SELECT COUNT(*) AS n FROM "reading" r WHERE ${plan.readings.where.join(' AND ')}`, plan.readings.params) : 0;
  const nValues = plan.values ? await count(`SELECT COUNT(*) AS n ${VALUES_FROM} WHERE ${plan.values.where.join(' AND ')}`, plan.values.params) : 0;
  const perReading = plan.readings?.parts.length ?? 0;
  const readingRows = nReadings * perReading;
  const totalCount = readingRows + nValues;
  const start = page.page * page.pageSize;
  const end = Math.min(start + page.pageSize, totalCount);
  const keys: Key[] = [];
  if (plan.readings && start < readingRows) {
    const first = Math.floor(start / perReading);
    const last = Math.ceil(Math.min(end, readingRows) / perReading);
    const ids = (await ds.query(`SELECT r."id" AS id FROM "reading" r WHERE ${plan.readings.where.join(' AND ')} ORDER BY r."id" LIMIT ? OFFSET ?`, [...plan.readings.params, last - first, first])) as { id: number }[];
    const parts = plan.readings.parts;
    const expanded = ids.flatMap(({ id }) => parts.map((part): Key => ({ kind: 'r', rowId: id, part })));
    keys.push(...expanded.slice(start - first * perReading, Math.min(end, readingRows) - first * perReading));
  }
  if (plan.values && end > readingRows) {
    const from = Math.max(0, start - readingRows);
    const ids = (await ds.query(`SELECT o."id" AS id ${VALUES_FROM} WHERE ${plan.values.where.join(' AND ')} ORDER BY o."id" LIMIT ? OFFSET ?`, [...plan.values.params, end - readingRows - from, from])) as { id: number }[];
    keys.push(...ids.map(({ id }): Key => ({ kind: 'o', rowId: id })));
  }
  return { data: await materialise(ds, keys), totalCount };
}

async function materialise(ds: DataSource, keys: Key[]): Promise<Record<string, unknown>[]> {
  const readingIds = [...new Set(keys.filter((k) => k.kind === 'r').map((k) => k.rowId))];
  const observationIds = [...new Set(keys.filter((k) => k.kind === 'o').map((k) => k.rowId))];
  const readings = new Map(
    (readingIds.length ? await ds.getRepository(Reading).find({ where: { id: In(readingIds) }, relations: { accession: true, plant: true, character: true, site: true, observer: true } }) : []).map((r) => [r.id, r]),
  );
  const observations = new Map(
    (observationIds.length ? await ds.getRepository(Observation).find({ where: { id: In(observationIds) }, relations: { accession: true, plant: true, descriptor: true, observer: true } }) : []).map((o) => [o.id, o]),
  );
  return keys.map((k) => (k.kind === 'r' ? fromReading(readings.get(k.rowId)!, k.part) : fromDescriptorValue(observations.get(k.rowId)!)));
}

function fromReading(r: Reading, part: ColourPart): Record<string, unknown> {
  const value = part === 'chip' ? r.bestChipCode : round2(part === 'L' ? r.l : part === 'a' ? r.a : r.b).toFixed(2);
  return {
    observationDbId: observationDbId({ kind: 'r', id: r.id, part }),
    observationVariableDbId: variableDbId({ kind: 'colour', characterId: r.characterId, part }),
    observationVariableName: colourVariableName(r.character!.code, part),
    germplasmDbId: String(r.accessionId),
    germplasmName: r.accession!.name,
    ...(r.plant ? { observationUnitDbId: String(r.plant.id), observationUnitName: unitName(r.accession!.accessionNumber, r.plant.label) } : {}),
    observationTimeStamp: r.observedAt.toISOString(),
    collector: r.observer!.name,
    ...(r.season && r.seasonYear ? { season: { seasonDbId: seasonDbId(r.seasonYear, r.season), seasonName: r.season, year: r.seasonYear } } : {}),
    value,
    additionalInfo: {
      readingId: String(r.id),
      method: r.method,
      light: r.light,
      reviewStatus: r.status,
      locationDbId: String(r.siteId),
      // A photo region that split into colours: which one this reading took (1 = the largest share) and its share.
      ...(r.cluster ? { photoColour: clusterWords(r.cluster), photoColourShare: r.cluster.share.toFixed(3) } : {}),
      ...(part === 'chip' ? { referenceSet: r.setId, chipName: r.bestChipName, deltaE00: r.deltaE00.toFixed(2) } : {}),
    },
  };
}

function fromDescriptorValue(o: Observation): Record<string, unknown> {
  const d = o.descriptor;
  return {
    observationDbId: observationDbId({ kind: 'o', id: o.id }),
    observationVariableDbId: variableDbId({ kind: 'descriptor', descriptorId: d.id }),
    observationVariableName: d.code,
    germplasmDbId: String(o.accession.id),
    germplasmName: o.accession.name,
    ...(o.plant ? { observationUnitDbId: String(o.plant.id), observationUnitName: unitName(o.accession.accessionNumber, o.plant.label) } : {}),
    observationTimeStamp: o.observedAt.toISOString(),
    collector: o.observer.name,
    value: d.kind === 'category' ? (o.category ?? '') : String(o.valueSi),
    additionalInfo: { ...(o.enteredValue !== null && o.enteredUnit ? { enteredAs: `${o.enteredValue} ${o.enteredUnit}` } : {}) },
  };
}
