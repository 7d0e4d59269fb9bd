// Observations: every current reading as four observations (L*, a*, b*, chip code) and every
// current descriptor value as one. Superseded rows are never served. One SQL query pages the union
// of both, so a page costs the same however many readings the collection holds.
import { In, type DataSource } from 'typeorm';
import { Observation } from '../collection/observation.entity.js';
import { Reading } from '../readings/reading.entity.js';
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

const PARTS_SQL = COLOUR_PARTS.map((p, i) => `SELECT '${p}' AS part, ${i} AS partOrder`).join(' UNION ALL ');

/** The WHERE clause and parameters for a filter; null when the filter can match nothing. */
function whereOf(f: ObservationFilter): { sql: string; params: unknown[] } | null {
  const clauses: string[] = [];
  const params: unknown[] = [];
  const add = (sql: string, ...values: unknown[]) => {
    clauses.push(sql);
    params.push(...values);
  };
  for (const [value, column] of [[f.germplasmDbId, 'accessionId'], [f.observationUnitDbId, 'plantId'], [f.locationDbId, 'siteId']] as const) {
    const id = numericId(value);
    if (id === null) return null;
    if (id !== undefined) add(`x.${column} = ?`, id);
  }
  if (f.observationVariableDbId !== undefined) {
    const v = parseVariableDbId(f.observationVariableDbId);
    if (!v) return null;
    if (v.kind === 'colour') add(`x.kind = 'r' AND x.varId = ? AND x.part = ?`, v.characterId, v.part);
    else add(`x.kind = 'o' AND x.varId = ?`, v.descriptorId);
  }
  if (f.observationDbId !== undefined) {
    const o = parseObservationDbId(f.observationDbId);
    if (!o) return null;
    if (o.kind === 'r') add(`x.kind = 'r' AND x.rowId = ? AND x.part = ?`, o.id, o.part);
    else add(`x.kind = 'o' AND x.rowId = ?`, o.id);
  }
  if (f.seasonDbId !== undefined) {
    const s = parseSeasonDbId(f.seasonDbId);
    if (!s) return null;
    add(`x.season = ? AND x.seasonYear = ?`, s.name, s.year);
  }
  if (f.observationTimeStampRangeStart) add(`x.observedAt >= ?`, sqlTime(f.observationTimeStampRangeStart));
  if (f.observationTimeStampRangeEnd) add(`x.observedAt <= ?`, sqlTime(f.observationTimeStampRangeEnd));
  return { sql: clauses.length ? `WHERE ${clauses.join(' AND ')}` : '', params };
}

/**
 * Current readings (one row per coordinate and the chip) and current, stored descriptor values
 * (ratios are computed, never stored). A descriptor value's site is its plant's, else its
 * accession's; it has no season (seasons are derived for readings only).
 */
const UNION_SQL = `
  SELECT 'r' AS kind, r."id" AS rowId, p.part AS part, p.partOrder AS partOrder, r."accessionId" AS accessionId, r."plantId" AS plantId,
         r."siteId" AS siteId, r."characterId" AS varId, r."observedAt" AS observedAt, r."season" AS season, r."seasonYear" AS seasonYear
    FROM "reading" r CROSS JOIN (${PARTS_SQL}) p
   WHERE r."supersededById" IS NULL
  UNION ALL
  SELECT 'o', o."id", NULL, 0, o."accessionId", o."plantId", COALESCE(pl."siteId", a."siteId"), o."descriptorId", o."observedAt", NULL, NULL
    FROM "observation" o
    JOIN "descriptor" d ON d."id" = o."descriptorId"
    JOIN "accession" a ON a."id" = o."accessionId"
    LEFT JOIN "plant" pl ON pl."id" = o."plantId"
   WHERE o."supersededById" IS NULL AND d."kind" != 'ratio'`;

type Key = { kind: 'r' | 'o'; rowId: number; part: ColourPart | null };

/** One page of observations in time order (then reading before descriptor value, then id, then L*, a*, b*, chip), and how many match. */
export async function findObservations(ds: DataSource, f: ObservationFilter, page: PageRequest): Promise<{ data: Record<string, unknown>[]; totalCount: number }> {
  const where = whereOf(f);
  if (!where) return { data: [], totalCount: 0 };
  const [{ n }] = (await ds.query(`SELECT COUNT(*) AS n FROM (${UNION_SQL}) x ${where.sql}`, where.params)) as [{ n: number }];
  const keys = (await ds.query(
    `SELECT x.kind, x.rowId, x.part FROM (${UNION_SQL}) x ${where.sql} ORDER BY x.observedAt, x.kind, x.rowId, x.partOrder LIMIT ? OFFSET ?`,
    [...where.params, page.pageSize, page.page * page.pageSize],
  )) as Key[];
  return { data: await materialise(ds, keys), totalCount: n };
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
  return keys.map((k) => (k.kind === 'r' ? fromReading(readings.get(k.rowId)!, k.part!) : fromDescriptorValue(observations.get(k.rowId)!)));
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
