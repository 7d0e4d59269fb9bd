import type { EntityManager } from 'typeorm';

import { seasonLabel } from '../../shared/collection/season-of.js';
import { wrappingSeasons, type WrappingSeasons } from '../readings/reading-list.js';

/**
 * A season group as people say it ("Dry 2025", "Wet 2024–25"); null without a season. `siteIds`
 * are the sites whose readings the group holds: the season is named by both years if it wraps the
 * year end at any of them (a group pooled over sites takes its name from the sites it pools, never
 * from an unrelated site's season of the same name).
 */
export type SeasonNamer = (season: string | null, seasonYear: number | null, siteIds: Iterable<number>) => string | null;

/** The namer over every site's season scheme, read once (a small table). */
export async function seasonNamer(m: EntityManager): Promise<SeasonNamer> {
  return namerOf(await wrappingSeasons(m));
}

/** The namer over a set of wrapping seasons already read (keys `siteId|season name in lower case`). */
export function namerOf(wrapping: WrappingSeasons): SeasonNamer {
  return (season, seasonYear, siteIds) => {
    if (season === null) return null;
    const name = season.toLowerCase();
    let wraps = false;
    for (const id of siteIds) wraps ||= wrapping.has(`${id}|${name}`);
    return seasonLabel(season, seasonYear, wraps);
  };
}

/** The sites of each season group of some readings, keyed `season-year|season`. */
export function groupSites(readings: Iterable<{ season: string | null; seasonYear: number | null; siteId: number }>): Map<string, Set<number>> {
  const out = new Map<string, Set<number>>();
  for (const r of readings) {
    if (r.season === null || r.seasonYear === null) continue;
    const key = `${r.seasonYear}|${r.season}`;
    let sites = out.get(key);
    if (!sites) out.set(key, (sites = new Set()));
    sites.add(r.siteId);
  }
  return out;
}
