// Landis & Koch's plain-words bands for a kappa statistic.
// Source: Landis, J. R. & Koch, G. G. (1977), "The measurement of observer agreement for
// categorical data", Biometrics 33(1):159–174, p. 165: < 0.00 poor; 0.00–0.20 slight;
// 0.21–0.40 fair; 0.41–0.60 moderate; 0.61–0.80 substantial; 0.81–1.00 almost perfect.
// The paper prints its edges to two decimals and leaves the gaps between them (0.20 … 0.21)
// unassigned; we close each band at its upper edge, so 0.20 is slight and 0.2001 is fair, and 0
// itself is slight (the paper's "0.00–0.20").

/** The six bands, worst first. Codes are ours; `KAPPA_BAND_LABELS` gives the paper's words. */
export const KAPPA_BANDS = ['poor', 'slight', 'fair', 'moderate', 'substantial', 'almost-perfect'] as const;
export type KappaBand = (typeof KAPPA_BANDS)[number];

/** Landis & Koch (1977) p. 165, their words. */
export const KAPPA_BAND_LABELS: Readonly<Record<KappaBand, string>> = {
  poor: 'poor',
  slight: 'slight',
  fair: 'fair',
  moderate: 'moderate',
  substantial: 'substantial',
  'almost-perfect': 'almost perfect',
};

/** Upper edge of each band from `slight` on (Landis & Koch 1977, p. 165); anything below 0 is poor. */
export const KAPPA_BAND_EDGES: readonly { upTo: number; band: KappaBand }[] = [
  { upTo: 0.2, band: 'slight' },
  { upTo: 0.4, band: 'fair' },
  { upTo: 0.6, band: 'moderate' },
  { upTo: 0.8, band: 'substantial' },
  { upTo: 1, band: 'almost-perfect' },
];

/** The Landis & Koch band of a kappa value (−1 … 1); throws on NaN, which has no band. */
export function landisKochBand(kappa: number): KappaBand {
  if (Number.isNaN(kappa)) throw new RangeError('kappa is NaN: it has no band');
  if (kappa < 0) return 'poor';
  for (const edge of KAPPA_BAND_EDGES) if (kappa <= edge.upTo) return edge.band;
  // Rounding can push a perfect agreement a hair above 1.
  return 'almost-perfect';
}
