// Listing readings: every filter, sort and page in SQL (TypeORM QueryBuilder), and the DTO of a
// row. The exports and (later) the review queue use the same query.
import type { DataSource, EntityManager, SelectQueryBuilder } from 'typeorm';
import type { ReadingDto, ReadingList, ReadingSort } from '../../shared/api/reading-answers.js';
import type { ListReadingsQuery } from '../../shared/api/readings.js';
import { labToLch } from '../../shared/colour/lab.js';
import { verdictFor } from '../../shared/colour/verdict.js';
import { seasonLabel } from '../../shared/collection/season-of.js';
import { Reading } from './reading.entity.js';
import { nameBestChips } from '../reference-sets/chip-names.js';

/** The filters of a list query (the exports take these without page and page size). */
export type ReadingFilters = Omit<ListReadingsQuery, 'page' | 'pageSize'>;

/** The SQL expression each sort orders by; ties fall back to the id in the same direction. */
const SORT_COLUMN: Readonly<Record<ReadingSort, string>> = {
  observedAt: 'r.observedAt',
  accession: 'accession.accessionNumber',
  character: 'character.label',
  site: 'site.code',
  observer: 'observer.name',
  deltaE00: 'r.deltaE00',
  status: 'r.status',
  method: 'r.method',
};

/**
 * TypeORM writes a `datetime` column as UTC "YYYY-MM-DD HH:MM:SS.SSS" on SQLite, so a UTC day's
 * bounds compare as text.
 */
function dayStart(isoDate: string): string {
  return `${isoDate} 00:00:00.000`;
}

function nextDay(isoDate: string): string {
  const d = new Date(`${isoDate}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  return dayStart(d.toISOString().slice(0, 10));
}

/** Readings with their accession, plant, character, site and observer joined, filtered and sorted; superseded ones left out unless asked for. */
export function readingsQuery(ds: DataSource, q: ReadingFilters): SelectQueryBuilder<Reading> {
  const qb = ds
    .getRepository(Reading)
    .createQueryBuilder('r')
    .innerJoinAndSelect('r.accession', 'accession')
    .leftJoinAndSelect('r.plant', 'plant')
    .innerJoinAndSelect('r.character', 'character')
    .innerJoinAndSelect('r.site', 'site')
    .innerJoinAndSelect('r.observer', 'observer');
  if (q.accessionId !== undefined) qb.andWhere('r.accessionId = :accessionId', { accessionId: q.accessionId });
  if (q.characterId !== undefined) qb.andWhere('r.characterId = :characterId', { characterId: q.characterId });
  if (q.siteId !== undefined) qb.andWhere('r.siteId = :siteId', { siteId: q.siteId });
  if (q.season !== undefined) qb.andWhere('LOWER(r.season) = LOWER(:season)', { season: q.season });
  if (q.seasonYear !== undefined) qb.andWhere('r.seasonYear = :seasonYear', { seasonYear: q.seasonYear });
  if (q.observerId !== undefined) qb.andWhere('r.observerId = :observerId', { observerId: q.observerId });
  if (q.method !== undefined) qb.andWhere('r.method = :method', { method: q.method });
  if (q.status !== undefined) qb.andWhere('r.status = :status', { status: q.status });
  if (q.from !== undefined) qb.andWhere('r.observedAt >= :from', { from: dayStart(q.from) });
  if (q.to !== undefined) qb.andWhere('r.observedAt < :to', { to: nextDay(q.to) });
  if (!q.includeSuperseded) qb.andWhere('r.supersededById IS NULL');
  const dir = q.dir === 'asc' ? 'ASC' : 'DESC';
  return qb.orderBy(SORT_COLUMN[q.sort], dir).addOrderBy('r.id', dir);
}

/** One page of readings and how many match in all. */
export async function listReadings(ds: DataSource, q: ListReadingsQuery): Promise<ReadingList> {
  const qb = readingsQuery(ds, q);
  // Every join is to-one, so plain OFFSET/LIMIT pages correctly (no DISTINCT sub-query needed).
  const [rows, total, wrapping] = await Promise.all([qb.clone().offset((q.page - 1) * q.pageSize).limit(q.pageSize).getMany(), qb.clone().getCount(), wrappingSeasons(ds.manager)]);
  return { items: (await nameBestChips(ds, rows)).map((r) => toReadingDto(r, wrapping)), total };
}

/** Keys `siteId|season name in lower case` of the seasons that wrap the year end. */
export type WrappingSeasons = ReadonlySet<string>;

/** Every site's seasons that wrap the year end (end before start): a small table read whole. */
export async function wrappingSeasons(m: EntityManager): Promise<WrappingSeasons> {
  const rows: { siteId: number; name: string }[] = await m.query(`SELECT "siteId" AS siteId, name FROM season WHERE "end" < "start"`);
  return new Set(rows.map((s) => `${s.siteId}|${s.name.toLowerCase()}`));
}

/** The API shape of a reading (relations accession, plant, character, site and observer loaded); `wrapping` names the seasons labelled across two years. */
export function toReadingDto(r: Reading, wrapping: WrappingSeasons = new Set()): ReadingDto {
  const lch = labToLch({ l: r.l, a: r.a, b: r.b });
  return {
    id: r.id,
    accessionId: r.accessionId,
    accessionNumber: r.accession!.accessionNumber,
    accessionName: r.accession!.name,
    plantId: r.plantId,
    plantLabel: r.plant?.label ?? null,
    characterId: r.characterId,
    characterCode: r.character!.code,
    characterLabel: r.character!.label,
    siteId: r.siteId,
    siteCode: r.site!.code,
    observerId: r.observerId,
    observerName: r.observer!.name,
    observedAt: r.observedAt.toISOString(),
    method: r.method,
    lab: [r.l, r.a, r.b],
    lch: [lch.l, lch.c, lch.h],
    hex: r.hex,
    inGamut: r.inGamut,
    bestChip: r.bestChipCode,
    bestChipName: r.bestChipName,
    bestChipHex: r.bestChipHex,
    deltaE00: r.deltaE00,
    verdict: verdictFor(r.deltaE00),
    eyeChipCode: r.eyeChipCode,
    eyeDeltaE00: r.eyeDeltaE00,
    setId: r.setId,
    season: r.season,
    seasonYear: r.seasonYear,
    seasonLabel: seasonLabel(r.season, r.seasonYear, r.season !== null && wrapping.has(`${r.siteId}|${r.season.toLowerCase()}`)),
    plantAgeMonths: r.plantAgeMonths,
    light: r.light,
    secondsSinceCut: r.secondsSinceCut,
    leafPosition: r.leafPosition,
    notes: r.notes,
    status: r.status,
    supersedesId: r.supersedesId,
    supersededById: r.supersededById,
    createdAt: r.createdAt.toISOString(),
  };
}
