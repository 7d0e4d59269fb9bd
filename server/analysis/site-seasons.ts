import type { Lab } from '../../shared/colour/lab.js';
import { DRIFT_RULES_DEFAULT, formatP, type DriftRules } from './drift.js';
import { compareSites } from './sites.js';

/** What the within-season site comparison needs of a reading. */
export interface SiteSeasonInput {
  siteId: number;
  season: string | null;
  seasonYear: number | null;
  lab: Lab;
}

/** Two sites' readings of one season group (the same season name and season-year). */
export interface SiteSeasonDifference {
  season: string;
  seasonYear: number;
  siteA: number;
  siteB: number;
  nA: number;
  nB: number;
  deltaE00: number;
  pValue: number;
  /** The same rule as season drift: ΔE00 ≥ threshold, p < alpha, both sites with at least minGroupSize readings. */
  flagged: boolean;
  reason: string;
}

/**
 * Site differences with the season held fixed: the readings of each season group (season name and
 * season-year) are split by site and every pair of sites compared with `compareSites` (ΔE00
 * between CIELAB means, seeded permutation test), under the drift rules. Comparing sites over all
 * seasons at once would mix a season effect into the site effect whenever one site was read mostly
 * in the wet season and the other in the dry, so a season group with a single site says nothing.
 */
export function siteDifferencesWithinSeasons(readings: readonly SiteSeasonInput[], rules: Partial<DriftRules> = {}): SiteSeasonDifference[] {
  const r: DriftRules = { ...DRIFT_RULES_DEFAULT, ...rules };
  const groups = new Map<string, { season: string; seasonYear: number; items: SiteSeasonInput[] }>();
  for (const x of readings) {
    if (x.season === null || x.seasonYear === null) continue;
    const key = `${x.seasonYear}\u0000${x.season}`;
    let g = groups.get(key);
    if (!g) groups.set(key, (g = { season: x.season, seasonYear: x.seasonYear, items: [] }));
    g.items.push(x);
  }
  const out: SiteSeasonDifference[] = [];
  for (const g of groups.values()) {
    const siteIds = [...new Set(g.items.map((x) => x.siteId))].sort((p, q) => p - q);
    if (siteIds.length < 2) continue;
    const cmp = compareSites(g.items, siteIds, r.alpha);
    for (let i = 0; i < cmp.sites.length; i++) {
      for (let j = i + 1; j < cmp.sites.length; j++) {
        const a = cmp.sites[i]!;
        const b = cmp.sites[j]!;
        const de = cmp.deltaE00[i]![j]!;
        const p = cmp.pValue[i]![j]!;
        const big = a.n >= r.minGroupSize && b.n >= r.minGroupSize;
        const flagged = big && de >= r.threshold && p < r.alpha;
        const reason = !big
          ? `too few readings to tell (${a.n} and ${b.n}; at least ${r.minGroupSize} each)`
          : flagged
            ? `ΔE00 ${de.toFixed(2)} is at least ${r.threshold} and unlikely by chance (${formatP(p)})`
            : de < r.threshold
              ? `ΔE00 ${de.toFixed(2)} is below ${r.threshold}`
              : `ΔE00 ${de.toFixed(2)} could be chance (${formatP(p)}, not below ${r.alpha})`;
        out.push({ season: g.season, seasonYear: g.seasonYear, siteA: a.siteId, siteB: b.siteId, nA: a.n, nB: b.n, deltaE00: de, pValue: p, flagged, reason });
      }
    }
  }
  return out;
}
