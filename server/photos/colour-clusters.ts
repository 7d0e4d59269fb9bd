import { kmeans } from 'ml-kmeans';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import type { Lab } from '../../shared/colour/lab.js';
import { applyMatrix, LINEAR_OF_CODE, linearToLab, type LinearRgb, type Matrix3, type RegionTally } from '../../shared/photo/region-stats.js';
import { CLUSTER_COUNTS, CLUSTER_MIN_SEPARATION_DE00, CLUSTER_MIN_SHARE, CLUSTER_SEED, THIRD_CLUSTER_GAIN } from '../../shared/photo/sampling-rules.js';

/** One colour of a region that holds several. */
export interface ColourCluster {
  /** The cluster's colour: its pixels averaged in linear light, as CIELAB D65. */
  lab: Lab;
  /** Share of the region's sampled kept pixels in this cluster, 0–1. */
  share: number;
  /** Sampled pixels in the cluster. */
  pixels: number;
  /** Mean ΔE00 of the cluster's pixels from its colour. */
  spreadDeltaE00: number;
}

interface Split {
  clusters: ColourCluster[];
  /** Mean ΔE00 of every pixel from its own cluster's colour. */
  within: number;
}

/**
 * Splits a region's sampled kept pixels (corrected as the mean is) into two or three colours by
 * k-means in CIELAB (ml-kmeans, k-means++ start with a fixed seed, so the answer is the same every
 * time). Three are answered only when a third colour explains much more than two
 * (`THIRD_CLUSTER_GAIN`) and stays apart from the others (`CLUSTER_MIN_SEPARATION_DE00`); clusters
 * below `CLUSTER_MIN_SHARE` are left out. Largest share first, so the ground colour of a striped
 * petiole comes before its stripes. Empty when the pixels hold fewer than two separate colours.
 */
export function colourClusters(tally: RegionTally, correction: Matrix3 | null): ColourCluster[] {
  const linear: LinearRgb[] = [];
  const s = tally.samples;
  for (let i = 0; i < tally.sampleCount; i++) {
    const raw: LinearRgb = [LINEAR_OF_CODE[s[3 * i]!]!, LINEAR_OF_CODE[s[3 * i + 1]!]!, LINEAR_OF_CODE[s[3 * i + 2]!]!];
    linear.push(correction ? applyMatrix(correction, raw) : raw);
  }
  const labs = linear.map(linearToLab);
  const points = labs.map((lab) => [lab.l, lab.a, lab.b]);
  if (new Set(points.map((p) => p.join(','))).size < CLUSTER_COUNTS[0]) return [];

  let best: Split | null = null;
  for (const k of CLUSTER_COUNTS) {
    const split = splitInto(k, points, linear, labs);
    if (!split || !apart(split.clusters)) continue;
    if (best === null || split.within <= THIRD_CLUSTER_GAIN * best.within) best = split;
  }
  const kept = best ? best.clusters.filter((c) => c.share >= CLUSTER_MIN_SHARE) : [];
  return kept.length >= CLUSTER_COUNTS[0] ? kept : [];
}

function splitInto(k: number, points: number[][], linear: readonly LinearRgb[], labs: readonly Lab[]): Split | null {
  const { clusters: assignment } = kmeans(points, k, { initialization: 'kmeans++', seed: CLUSTER_SEED, maxIterations: 100 });
  const members: number[][] = Array.from({ length: k }, () => []);
  assignment.forEach((c, i) => members[c]!.push(i));
  if (members.some((m) => m.length === 0)) return null;
  let withinSum = 0;
  const clusters = members.map((m) => {
    const mean: LinearRgb = [0, 0, 0];
    for (const i of m) for (let ch = 0; ch < 3; ch++) mean[ch]! += linear[i]![ch]! / m.length;
    const lab = linearToLab(mean);
    let sum = 0;
    for (const i of m) sum += deltaE00(lab, labs[i]!);
    withinSum += sum;
    return { lab, share: m.length / points.length, pixels: m.length, spreadDeltaE00: sum / m.length };
  });
  clusters.sort((p, q) => q.share - p.share || q.lab.l - p.lab.l);
  return { clusters, within: withinSum / points.length };
}

function apart(clusters: readonly ColourCluster[]): boolean {
  return clusters.every((p, i) => clusters.slice(i + 1).every((q) => deltaE00(p.lab, q.lab) >= CLUSTER_MIN_SEPARATION_DE00));
}
