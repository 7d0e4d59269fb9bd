import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { meanLab, spreadDeltaE00 } from './lab-stats.js';
import { permutationTest } from './permutation-test.js';

/** What the site comparison needs of a reading (superseded readings are left out before it). */
export interface SiteInput {
  siteId: number;
  lab: Lab;
}

/** One site's readings of an accession and character. */
export interface SiteGroupStats {
  siteId: number;
  n: number;
  meanLab: Lab;
  /** Mean ΔE00 of the site's readings from their CIELAB mean. */
  spreadDeltaE00: number;
}

/** Per-site groups and, for every pair of sites, ΔE00 between their means and its permutation test. */
export interface SiteComparison {
  /** In the order of `siteOrder` (sites without readings left out). */
  sites: SiteGroupStats[];
  /** Symmetric, 0 on the diagonal. */
  deltaE00: number[][];
  /** Symmetric, 1 on the diagonal (a site against itself is no difference at all). */
  pValue: number[][];
}

/** The seed of the site pairs' permutation tests ("site"), distinct from the season one. */
export const SITE_SEED = 0x73697465;

/**
 * The same statistic as the season drift (ΔE00 between CIELAB means, seeded permutation test of
 * `permutation-test.ts`), between sites instead of season groups: one accession and character
 * grown at several sites. Each pair gets its own seed from its two site ids, so the matrix does
 * not change when a third site gains readings, and (i, j) and (j, i) are one test.
 */
export function compareSites(readings: readonly SiteInput[], siteOrder: readonly number[], alpha = 0.05): SiteComparison {
  const bySite = new Map<number, Lab[]>();
  for (const r of readings) {
    let labs = bySite.get(r.siteId);
    if (!labs) bySite.set(r.siteId, (labs = []));
    labs.push(r.lab);
  }
  const ids = siteOrder.filter((id) => bySite.has(id));
  const sites = ids.map((siteId) => {
    const labs = bySite.get(siteId)!;
    const mean = meanLab(labs);
    return { siteId, n: labs.length, meanLab: mean, spreadDeltaE00: spreadDeltaE00(labs, mean) };
  });
  const n = ids.length;
  const de = Array.from({ length: n }, () => new Array<number>(n).fill(0));
  const p = Array.from({ length: n }, () => new Array<number>(n).fill(1));
  for (let i = 0; i < n; i++) {
    for (let j = i + 1; j < n; j++) {
      const [lo, hi] = ids[i]! < ids[j]! ? [ids[i]!, ids[j]!] : [ids[j]!, ids[i]!];
      const test = permutationTest(bySite.get(lo)!, bySite.get(hi)!, { seed: pairSeed(lo, hi), alpha });
      de[i]![j] = de[j]![i] = deltaE00(sites[i]!.meanLab, sites[j]!.meanLab);
      p[i]![j] = p[j]![i] = test.pValue;
    }
  }
  return { sites, deltaE00: de, pValue: p };
}

/** FNV-1a (32 bits) of the two site ids, mixed with SITE_SEED. */
function pairSeed(lo: number, hi: number): number {
  let h = (0x811c9dc5 ^ SITE_SEED) >>> 0;
  for (const ch of `${lo}|${hi}`) {
    h ^= ch.codePointAt(0)!;
    h = Math.imul(h, 0x01000193) >>> 0;
  }
  return h;
}
