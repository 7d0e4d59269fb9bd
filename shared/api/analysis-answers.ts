// Answers of the drift and site-comparison routes (docs/colour.md, statistics beside colour), without zod
// so the client may import them; the query schemas are in analysis.ts.
import type { LabTuple } from '../colour/lab.js';
import type { LchTuple } from './reference-set-answers.js';

/** One season group: a season of one season-year (superseded readings left out). */
export interface DriftGroup {
  season: string;
  seasonYear: number;
  /** The group as people say it: "Dry 2025", or "Wet 2024–25" for a season that wraps the year end. */
  seasonLabel: string;
  n: number;
  meanLab: LabTuple;
  meanLch: LchTuple;
  meanHex: string;
  /** Mean ΔE00 of the group's readings from its CIELAB mean. */
  spreadDeltaE00: number;
  /** ISO 8601. */
  firstObservedAt: string;
  lastObservedAt: string;
}

export const COMPARISON_KINDS = ['consecutive', 'same-season'] as const;
export type ComparisonKind = (typeof COMPARISON_KINDS)[number];

export interface GroupKey {
  season: string;
  seasonYear: number;
}

/** A group key with the group's name as people say it. */
export interface NamedGroupKey extends GroupKey {
  /** "Dry 2025", or "Wet 2024–25" for a season that wraps the year end. */
  seasonLabel: string;
}

/** Between two groups: consecutive in time, or the same season a year apart. */
export interface DriftComparison<K extends GroupKey = NamedGroupKey> {
  from: K;
  to: K;
  kind: ComparisonKind;
  /** ΔE00 between the two groups' CIELAB means. */
  deltaE00: number;
  /** Permutation test of that ΔE00 (seeded; exact for small groups, else random, stopped early by Besag & Clifford's sequential rule when plainly chance). */
  pValue: number;
  test: 'exact' | 'random' | 'sequential';
  permutations: number;
  /** ΔE00 ≥ threshold, p < alpha, and both groups have at least minGroupSize readings. */
  drift: boolean;
  /** Why it is or is not drift, in plain words. */
  reason: string;
}

/** One reading as a point on the charts. */
export interface DriftPoint {
  readingId: number;
  season: string | null;
  seasonYear: number | null;
  observedAt: string;
  lab: LabTuple;
  lch: LchTuple;
  hex: string;
}

/** `GET /api/analysis/drift?accessionId=&characterId=[&siteId=]`. */
export interface DriftAnswer {
  accessionId: number;
  characterId: number;
  siteId: number | null;
  groups: DriftGroup[];
  comparisons: DriftComparison[];
  points: DriftPoint[];
  /** Readings outside every season of their site's scheme (not grouped). */
  unseasoned: number;
  /** The character's threshold (admins set it; default 1.8, Paravina et al. 2015), alpha and minimum group size. */
  threshold: number;
  alpha: number;
  minGroupSize: number;
}

/** One site's readings of an accession and character. */
export interface SiteGroup {
  siteId: number;
  siteCode: string;
  siteName: string;
  n: number;
  meanLab: LabTuple;
  meanHex: string;
  spreadDeltaE00: number;
}

/** `GET /api/analysis/sites?accessionId=&characterId=`: per-site groups and the ΔE00 between every pair of site means. */
export interface SiteComparisonAnswer {
  accessionId: number;
  characterId: number;
  /** The season group compared, when asked for one; null: every season together. */
  season: string | null;
  seasonYear: number | null;
  /** That group as people say it ("Wet 2024–25"); null: every season together. */
  seasonLabel: string | null;
  sites: SiteGroup[];
  /** deltaE00[i][j]: ΔE00 between the means of sites[i] and sites[j] (0 on the diagonal). */
  deltaE00: number[][];
  /** pValue[i][j]: permutation test of that difference (1 on the diagonal). */
  pValue: number[][];
  threshold: number;
}

/** One flag of the drift overview: season drift between two season groups, or two sites apart within one season group. */
export interface DriftOverviewFlag {
  kind: 'season-drift' | 'site-difference';
  /** "Dry 2025 → Wet 2025–26", or "RDP ↔ HTG in Wet 2025–26" (wrap-year seasons named by both years). */
  label: string;
  deltaE00: number;
  pValue: number;
  reason: string;
  /** Site differences: the season group compared. */
  season: string | null;
  seasonYear: number | null;
}

/** One accession × character with at least one flag. */
export interface DriftOverviewItem {
  accessionId: number;
  accessionNumber: string;
  accessionName: string;
  characterId: number;
  characterCode: string;
  characterLabel: string;
  /** Readings in force of the pair. */
  n: number;
  /** The largest flagged ΔE00 (the sort key). */
  deltaE00: number;
  flags: DriftOverviewFlag[];
}

/** `GET /api/analysis/overview`: every flagged accession × character of the collection, largest ΔE00 first. */
export interface DriftOverviewAnswer {
  items: DriftOverviewItem[];
  /** Accession × character pairs with readings, and readings in force, analysed. */
  pairs: number;
  readings: number;
  /** Pairs analysed afresh for this answer (the rest were unchanged since the last one). */
  recomputed: number;
  /** ISO 8601. */
  computedAt: string;
}
