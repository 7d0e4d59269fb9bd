import { analyseDrift, DRIFT_RULES_DEFAULT } from './drift.js';
import { siteDifferencesWithinSeasons } from './site-seasons.js';
import { groupSites } from '../collection/season-names.js';

/** One accession × character's readings in force, as plain columns (cheap to send to a worker thread). */
export interface PairInput {
  key: string;
  threshold: number;
  siteId: number[];
  l: number[];
  a: number[];
  b: number[];
  season: (string | null)[];
  seasonYear: (number | null)[];
  /** Epoch milliseconds. */
  observedAt: number[];
}

/** A flag the drift rules raise for a pair. */
export interface PairFlag {
  kind: 'season-drift' | 'site-difference';
  deltaE00: number;
  pValue: number;
  reason: string;
  /** Season drift: the two groups. */
  from?: { season: string; seasonYear: number };
  to?: { season: string; seasonYear: number };
  /** Season drift: the sites whose readings each group holds (to name a season that wraps the year end at one of them). */
  fromSiteIds?: number[];
  toSiteIds?: number[];
  /** Site difference: the season group and the two sites. */
  season?: string;
  seasonYear?: number;
  siteA?: number;
  siteB?: number;
}

/** The flags of one pair, largest ΔE00 first. */
export interface PairFlags {
  key: string;
  n: number;
  flags: PairFlag[];
}

/**
 * Season drift and within-season site differences of one pair under the drift rules, with the
 * pair's own threshold. Pure, so it runs the same in the request's thread or a worker thread.
 */
export function pairFlags(input: PairInput): PairFlags {
  const n = input.l.length;
  const readings = Array.from({ length: n }, (_, i) => ({
    siteId: input.siteId[i]!,
    lab: { l: input.l[i]!, a: input.a[i]!, b: input.b[i]! },
    season: input.season[i]!,
    seasonYear: input.seasonYear[i]!,
    observedAt: new Date(input.observedAt[i]!),
  }));
  const rules = { ...DRIFT_RULES_DEFAULT, threshold: input.threshold };
  const flags: PairFlag[] = [];
  const sitesOf = groupSites(readings);
  const sites = (k: { season: string; seasonYear: number }) => [...(sitesOf.get(`${k.seasonYear}|${k.season}`) ?? [])];
  for (const c of analyseDrift(readings, rules).comparisons) {
    if (c.drift) flags.push({ kind: 'season-drift', deltaE00: c.deltaE00, pValue: c.pValue, reason: c.reason, from: c.from, to: c.to, fromSiteIds: sites(c.from), toSiteIds: sites(c.to) });
  }
  for (const d of siteDifferencesWithinSeasons(readings, rules)) {
    if (d.flagged) flags.push({ kind: 'site-difference', deltaE00: d.deltaE00, pValue: d.pValue, reason: d.reason, season: d.season, seasonYear: d.seasonYear, siteA: d.siteA, siteB: d.siteB });
  }
  flags.sort((x, y) => y.deltaE00 - x.deltaE00);
  return { key: input.key, n, flags };
}
