import { ACCEPTABILITY_THRESHOLD_DE00 } from '../../shared/colour/constants.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import type { ComparisonKind, DriftComparison, GroupKey } from '../../shared/api/analysis-answers.js';
import { meanLab, spreadDeltaE00 } from './lab-stats.js';
import { permutationTest } from './permutation-test.js';

/** What the drift analysis needs of a reading (superseded readings are left out before it). */
export interface DriftInput {
  lab: Lab;
  season: string | null;
  seasonYear: number | null;
  observedAt: Date;
}

/** One season group: a season of one season-year. */
export interface SeasonGroup {
  season: string;
  seasonYear: number;
  n: number;
  meanLab: Lab;
  /** Mean ΔE00 of the group's readings from its mean (docs/colour.md). */
  spreadDeltaE00: number;
  firstObservedAt: Date;
  lastObservedAt: Date;
}

export interface DriftRules {
  /** ΔE00 at or above which a difference counts; the character's own, else Paravina et al. (2015) acceptability 1.8. */
  threshold: number;
  alpha: number;
  /** Smallest group that can be flagged; smaller groups are reported, never flagged. */
  minGroupSize: number;
  seed: number;
}

export const DRIFT_RULES_DEFAULT: DriftRules = { threshold: ACCEPTABILITY_THRESHOLD_DE00, alpha: 0.05, minGroupSize: 3, seed: 0x64726966 };

export interface DriftAnalysis {
  groups: SeasonGroup[];
  comparisons: DriftComparison<GroupKey>[];
  /** Readings outside every season of their site's scheme, not grouped. */
  unseasoned: number;
  rules: DriftRules;
}

/**
 * Season groups and the comparisons between them (docs/colour.md, statistics beside colour): each group's CIELAB mean
 * and spread; for consecutive groups in time and for the same season in consecutive years, ΔE00
 * between the means with a seeded permutation test; drift only when the difference is at least
 * the threshold, p < alpha, and both groups have at least `minGroupSize` readings.
 */
export function analyseDrift(readings: readonly DriftInput[], rules: Partial<DriftRules> = {}): DriftAnalysis {
  const r: DriftRules = { ...DRIFT_RULES_DEFAULT, ...rules };
  const byKey = new Map<string, { key: GroupKey; labs: Lab[]; first: Date; last: Date }>();
  let unseasoned = 0;
  for (const x of readings) {
    if (x.season === null || x.seasonYear === null) {
      unseasoned++;
      continue;
    }
    const id = `${x.seasonYear}\u0000${x.season}`;
    let g = byKey.get(id);
    if (!g) byKey.set(id, (g = { key: { season: x.season, seasonYear: x.seasonYear }, labs: [], first: x.observedAt, last: x.observedAt }));
    g.labs.push(x.lab);
    if (x.observedAt < g.first) g.first = x.observedAt;
    if (x.observedAt > g.last) g.last = x.observedAt;
  }
  const raw = [...byKey.values()].sort((p, q) => p.first.getTime() - q.first.getTime() || p.key.seasonYear - q.key.seasonYear || p.key.season.localeCompare(q.key.season));
  const groups: SeasonGroup[] = raw.map((g) => {
    const mean = meanLab(g.labs);
    return { ...g.key, n: g.labs.length, meanLab: mean, spreadDeltaE00: spreadDeltaE00(g.labs, mean), firstObservedAt: g.first, lastObservedAt: g.last };
  });

  const pairs: [number, number, ComparisonKind][] = [];
  for (let i = 0; i + 1 < raw.length; i++) pairs.push([i, i + 1, 'consecutive']);
  const seen = new Set(pairs.map(([i, j]) => `${i}:${j}`));
  for (let i = 0; i < raw.length; i++) {
    const next = raw.findIndex((g, j) => j > i && g.key.season === raw[i]!.key.season && g.key.seasonYear > raw[i]!.key.seasonYear);
    if (next > 0 && !seen.has(`${i}:${next}`)) pairs.push([i, next, 'same-season']);
  }

  const comparisons = pairs.map(([i, j, kind]) => compare(raw[i]!, raw[j]!, kind, r));
  return { groups, comparisons, unseasoned, rules: r };
}

function compare(g: { key: GroupKey; labs: Lab[] }, h: { key: GroupKey; labs: Lab[] }, kind: ComparisonKind, r: DriftRules): DriftComparison<GroupKey> {
  const test = permutationTest(g.labs, h.labs, { seed: seedFor(r.seed, g.key, h.key), alpha: r.alpha });
  const big = g.labs.length >= r.minGroupSize && h.labs.length >= r.minGroupSize;
  const large = test.statistic >= r.threshold;
  const unlikely = test.pValue < r.alpha;
  const drift = big && large && unlikely;
  const reason = !big
    ? `too few readings to tell (${g.labs.length} and ${h.labs.length}; at least ${r.minGroupSize} each)`
    : drift
      ? `ΔE00 ${test.statistic.toFixed(2)} is at least ${r.threshold} and unlikely by chance (${formatP(test.pValue)})`
      : !large
        ? `ΔE00 ${test.statistic.toFixed(2)} is below ${r.threshold}`
        : `ΔE00 ${test.statistic.toFixed(2)} could be chance (${formatP(test.pValue)}, not below ${r.alpha})`;
  return { from: g.key, to: h.key, kind, deltaE00: deltaE00(meanLab(g.labs), meanLab(h.labs)), pValue: test.pValue, test: test.method, permutations: test.permutations, drift, reason };
}

/** A p-value as a reason prints it: "p < 0.001" below a thousandth, else "p = 0.012". */
export function formatP(p: number): string {
  return p < 0.001 ? 'p < 0.001' : `p = ${p.toFixed(3)}`;
}

/** A seed per pair of groups, so adding a third group never changes the p-value of the first two (FNV-1a, 32 bits). */
function seedFor(seed: number, a: GroupKey, b: GroupKey): number {
  let h = (0x811c9dc5 ^ seed) >>> 0;
  for (const ch of `${a.season}/${a.seasonYear}|${b.season}/${b.seasonYear}`) {
    h ^= ch.codePointAt(0)!;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}
