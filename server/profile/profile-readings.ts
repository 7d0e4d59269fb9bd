import type { DataSource } from 'typeorm';
import type { ProfileBasis } from '../../shared/api/profile-answers.js';
import type { Lab } from '../../shared/colour/lab.js';
import type { Region } from '../../shared/photo/region.js';
import { utcFromSqlite } from '../analysis/drift-query.js';
import { labMedian } from './robust-centre.js';

/** What a characterisation reads of a reading in force, straight from SQL. */
export interface ProfileReading {
  id: number;
  accessionId: number;
  characterId: number;
  siteId: number;
  siteCode: string;
  plantId: number | null;
  plantLabel: string | null;
  observerId: number;
  observerName: string;
  status: string;
  lab: Lab;
  hex: string;
  season: string | null;
  seasonYear: number | null;
  observedAt: Date;
  photoId: number | null;
  region: Region | null;
  photoWidth: number | null;
  photoHeight: number | null;
}

/** A row as SQL gives it: CIELAB in three columns, the instant and the region as text. */
type Row = Omit<ProfileReading, 'lab' | 'observedAt' | 'region'> & { l: number; a: number; b: number; observedAt: string; region: string | null };

/**
 * The readings in force (not superseded) of one accession, or of the whole collection, with the
 * names a record prints; one query, oldest first.
 */
export async function profileReadings(ds: DataSource, accessionId?: number): Promise<ProfileReading[]> {
  const rows: Row[] = await ds.query(
    `SELECT r."id", r."accessionId", r."characterId", r."siteId", s."code" AS "siteCode", r."plantId", p."label" AS "plantLabel",
            r."observerId", u."name" AS "observerName", r."status", r."l", r."a", r."b", r."hex", r."season", r."seasonYear",
            r."observedAt", r."photoId", r."region", ph."width" AS "photoWidth", ph."height" AS "photoHeight"
       FROM "reading" r
       JOIN "site" s ON s."id" = r."siteId"
       JOIN "user" u ON u."id" = r."observerId"
       LEFT JOIN "plant" p ON p."id" = r."plantId"
       LEFT JOIN "photo" ph ON ph."id" = r."photoId"
      WHERE r."supersededById" IS NULL${accessionId === undefined ? '' : ' AND r."accessionId" = ?'}
      ORDER BY r."observedAt", r."id"`,
    accessionId === undefined ? [] : [accessionId],
  );
  return rows.map((r) => ({
    id: r.id,
    accessionId: r.accessionId,
    characterId: r.characterId,
    siteId: r.siteId,
    siteCode: r.siteCode,
    plantId: r.plantId,
    plantLabel: r.plantLabel,
    observerId: r.observerId,
    observerName: r.observerName,
    status: r.status,
    lab: { l: r.l, a: r.a, b: r.b },
    hex: r.hex,
    season: r.season,
    seasonYear: r.seasonYear,
    observedAt: utcFromSqlite(r.observedAt),
    photoId: r.photoId,
    region: r.region === null ? null : (JSON.parse(r.region) as Region),
    photoWidth: r.photoWidth,
    photoHeight: r.photoHeight,
  }));
}

/** Readings grouped by a key, in first-seen order. */
export function groupBy<T, K>(xs: readonly T[], key: (x: T) => K): Map<K, T[]> {
  const out = new Map<K, T[]>();
  for (const x of xs) {
    const k = key(x);
    const list = out.get(k);
    if (list) list.push(x);
    else out.set(k, [x]);
  }
  return out;
}

/**
 * The readings a character's accepted colour rests on: the approved ones when a reviewer has
 * approved any, else every reading in force (a collection without review still gets a record).
 */
export function basisOf(readings: readonly ProfileReading[]): { basis: ProfileBasis; readings: ProfileReading[] } {
  const approved = readings.filter((r) => r.status === 'approved');
  return approved.length ? { basis: 'approved', readings: approved } : { basis: 'current', readings: [...readings] };
}

/** The centre (per-channel median, see robust-centre.ts) of one character's basis readings. */
export function centreOf(readings: readonly ProfileReading[]): { basis: ProfileBasis; centre: Lab; n: number } {
  const b = basisOf(readings);
  return { basis: b.basis, centre: labMedian(b.readings.map((r) => r.lab)), n: b.readings.length };
}
