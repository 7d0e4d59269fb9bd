import type { DataSource } from 'typeorm';
import type { DriftAnswer, DriftPoint, SiteComparisonAnswer } from '../../shared/api/analysis-answers.js';
import type { DriftQuery, SiteComparisonQuery } from '../../shared/api/analysis.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { labToLch, labToTuple, type Lab } from '../../shared/colour/lab.js';
import { Accession } from '../collection/accession.entity.js';
import { Character } from '../collection/character.entity.js';
import { groupSites, seasonNamer } from '../collection/season-names.js';
import { Site } from '../collection/site.entity.js';
import { AppError } from '../core/app-error.js';
import { analyseDrift, type DriftInput } from './drift.js';
import { compareSites } from './sites.js';

/** The columns the drift analysis reads of a reading. */
interface DriftRow {
  id: number;
  siteId: number;
  l: number;
  a: number;
  b: number;
  hex: string;
  season: string | null;
  seasonYear: number | null;
  /** Epoch milliseconds (UTC). */
  observedAt: number;
}

/**
 * A reading's `observedAt` as epoch milliseconds, computed by SQLite from the UTC text TypeORM
 * stores ("YYYY-MM-DD HH:MM:SS.SSS"): 2440587.5 is the Julian day of 1970-01-01T00:00Z (SQLite docs,
 * "Date And Time Functions"). A double holds a Julian day to about 50 µs, so the rounding to whole
 * milliseconds gives the stored instant exactly; cheaper than parsing 100,000 strings in JavaScript.
 */
export const OBSERVED_AT_MS_SQL = `CAST(ROUND((julianday("observedAt") - 2440587.5) * 86400000) AS INTEGER)`;

/**
 * A read straight through the data source's better-sqlite3 connection, rows as arrays: TypeORM's
 * layer, and better-sqlite3's own row objects, cost more than the query itself on large reads.
 */
export function rawRows<Row extends unknown[]>(ds: DataSource, sql: string, params: readonly unknown[] = []): Row[] {
  const db = (ds.driver as unknown as { databaseConnection: { prepare(sql: string): { raw(on: boolean): { all(...p: unknown[]): unknown[] } } } }).databaseConnection;
  return db.prepare(sql).raw(true).all(...params) as Row[];
}

/**
 * One query for the readings in force (not superseded) of an accession and character, optionally
 * at one site, oldest first, with only the columns the analysis needs. The (accessionId,
 * characterId) index of `reading` serves it (see the plan note below).
 */
export async function driftRows(ds: DataSource, accessionId: number, characterId: number, siteId?: number): Promise<DriftRow[]> {
  const params: number[] = [accessionId, characterId];
  let sql =
    `SELECT "id", "siteId", "l", "a", "b", "hex", "season", "seasonYear", ${OBSERVED_AT_MS_SQL} FROM "reading" ` +
    // The unary + keeps SQLite from answering "IS NULL" through the unique index on supersededById
    // (which holds every reading in force) instead of the (accessionId, characterId) index: without
    // it every call walked all current readings. (SQLite docs, "The SQLite Query Optimizer
    // Overview": a unary + on a column disqualifies that term from using an index.)
    'WHERE "accessionId" = ? AND "characterId" = ? AND +"supersededById" IS NULL';
  if (siteId !== undefined) {
    sql += ' AND "siteId" = ?';
    params.push(siteId);
  }
  type Raw = [number, number, number, number, number, string, string | null, number | null, number];
  return rawRows<Raw>(ds, `${sql} ORDER BY "observedAt", "id"`, params).map(([id, siteId, l, a, b, hex, season, seasonYear, observedAt]) => ({ id, siteId, l, a, b, hex, season, seasonYear, observedAt }));
}

/** TypeORM keeps `datetime` columns on SQLite as UTC text "YYYY-MM-DD HH:MM:SS.SSS"; raw SQL gets that text back. */
export function utcFromSqlite(text: string): Date {
  return new Date(/[zZ]|[+-]\d\d:\d\d$/.test(text) ? text : `${text.replace(' ', 'T')}Z`);
}

/** The character's drift threshold after checking the accession (and site) exist; 404 naming what is unknown. */
async function subjects(ds: DataSource, accessionId: number, characterId: number, siteId?: number): Promise<Character> {
  if (!(await ds.getRepository(Accession).existsBy({ id: accessionId }))) throw AppError.notFound(`There is no accession ${accessionId}.`);
  const character = await ds.getRepository(Character).findOneBy({ id: characterId });
  if (!character) throw AppError.notFound(`There is no character ${characterId}.`);
  if (siteId !== undefined && !(await ds.getRepository(Site).existsBy({ id: siteId }))) throw AppError.notFound(`There is no site ${siteId}.`);
  return character;
}

/**
 * `GET /api/analysis/drift`: season groups of the readings in force, the comparisons between them
 * with the character's own threshold, and every reading as a chart point (docs/colour.md, statistics beside colour).
 */
export async function driftAnswer(ds: DataSource, q: DriftQuery): Promise<DriftAnswer> {
  const character = await subjects(ds, q.accessionId, q.characterId, q.siteId);
  const rows = await driftRows(ds, q.accessionId, q.characterId, q.siteId);
  const inputs: DriftInput[] = rows.map((r) => ({ lab: { l: r.l, a: r.a, b: r.b }, season: r.season, seasonYear: r.seasonYear, observedAt: new Date(r.observedAt) }));
  const analysis = analyseDrift(inputs, { threshold: character.driftThreshold });
  const named = await seasonNamer(ds.manager);
  const sitesOf = groupSites(rows);
  const key = (k: { season: string; seasonYear: number }) => ({ season: k.season, seasonYear: k.seasonYear, seasonLabel: named(k.season, k.seasonYear, sitesOf.get(`${k.seasonYear}|${k.season}`) ?? [])! });
  const points: DriftPoint[] = rows.map((r, i) => {
    const lab = inputs[i]!.lab;
    const lch = labToLch(lab);
    // The stored display hex: the one the reading was shown with, gamut-mapped when it was taken.
    return { readingId: r.id, season: r.season, seasonYear: r.seasonYear, observedAt: inputs[i]!.observedAt.toISOString(), lab: labToTuple(lab), lch: [lch.l, lch.c, lch.h], hex: r.hex };
  });
  return {
    accessionId: q.accessionId,
    characterId: q.characterId,
    siteId: q.siteId ?? null,
    groups: analysis.groups.map((g) => ({
      ...key(g),
      n: g.n,
      meanLab: labToTuple(g.meanLab),
      meanLch: lchTuple(g.meanLab),
      meanHex: displayHex(g.meanLab).hex,
      spreadDeltaE00: g.spreadDeltaE00,
      firstObservedAt: g.firstObservedAt.toISOString(),
      lastObservedAt: g.lastObservedAt.toISOString(),
    })),
    comparisons: analysis.comparisons.map((c) => ({ ...c, from: key(c.from), to: key(c.to) })),
    points,
    unseasoned: analysis.unseasoned,
    threshold: analysis.rules.threshold,
    alpha: analysis.rules.alpha,
    minGroupSize: analysis.rules.minGroupSize,
  };
}

/** `GET /api/analysis/sites`: per-site groups of the readings in force, sites in code order, and the ΔE00 and p-value matrices. */
export async function siteComparisonAnswer(ds: DataSource, q: SiteComparisonQuery): Promise<SiteComparisonAnswer> {
  const character = await subjects(ds, q.accessionId, q.characterId);
  const all = await driftRows(ds, q.accessionId, q.characterId);
  const rows = q.season === undefined ? all : all.filter((r) => r.season === q.season && r.seasonYear === q.seasonYear);
  const siteIds = [...new Set(rows.map((r) => r.siteId))];
  const sites = siteIds.length ? await ds.getRepository(Site).find({ where: siteIds.map((id) => ({ id })), order: { code: 'ASC' } }) : [];
  const result = compareSites(
    rows.map((r) => ({ siteId: r.siteId, lab: { l: r.l, a: r.a, b: r.b } })),
    sites.map((s) => s.id),
  );
  const byId = new Map(sites.map((s) => [s.id, s]));
  return {
    accessionId: q.accessionId,
    characterId: q.characterId,
    season: q.season ?? null,
    seasonYear: q.seasonYear ?? null,
    seasonLabel: q.season === undefined ? null : (await seasonNamer(ds.manager))(q.season, q.seasonYear ?? null, siteIds),
    sites: result.sites.map((g) => {
      const site = byId.get(g.siteId)!;
      return { siteId: g.siteId, siteCode: site.code, siteName: site.name, n: g.n, meanLab: labToTuple(g.meanLab), meanHex: displayHex(g.meanLab).hex, spreadDeltaE00: g.spreadDeltaE00 };
    }),
    deltaE00: result.deltaE00,
    pValue: result.pValue,
    threshold: character.driftThreshold,
  };
}

function lchTuple(lab: Lab): [number, number, number] {
  const lch = labToLch(lab);
  return [lch.l, lch.c, lch.h];
}
