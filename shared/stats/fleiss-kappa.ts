// Fleiss' kappa: agreement among many raters who each put a subject into one of k categories.
//
// Fleiss, J. L. (1971), "Measuring nominal scale agreement among many raters", Psychological
// Bulletin 76(5):378–382, eqs. 2–9, for N subjects each rated by the same number n of raters:
//   p_j  = (1 / N n) Σ_i n_ij                       share of all assignments in category j
//   P_i  = (1 / n(n − 1)) Σ_j n_ij (n_ij − 1)        agreeing ordered pairs of raters on subject i
//   P̄   = (1 / N) Σ_i P_i,   P̄e = Σ_j p_j²,   κ = (P̄ − P̄e) / (1 − P̄e).
//
// In a calibration session not every observer answers every specimen, so the number of raters
// r_i varies. We take the generalisation Gwet gives for missing ratings ("Fleiss' generalized
// kappa", Gwet, K. L., Handbook of Inter-Rater Reliability, Advanced Analytics; the chapter on
// Fleiss' kappa with missing ratings — chapter from memory), exactly as his irrCAC R package
// computes it in `fleiss.kappa.dist`:
//   P_i = Σ_j r_ij (r_ij − 1) / (r_i (r_i − 1)), averaged over the subjects with r_i ≥ 2;
//   π_j = (1 / n') Σ_i r_ij / r_i, averaged over the n' subjects with r_i ≥ 1;   P̄e = Σ_j π_j².
// With every r_i equal this is Fleiss (1971) term for term (π_j = p_j), so both published
// examples hold exactly. Subjects nobody rated are left out; a subject with one rating counts
// towards π_j only (one rating cannot agree or disagree with anything).

/** What `fleissKappa` found. */
export interface FleissKappa {
  /** κ; null when P̄e = 1 (every rating in one category: no disagreement is possible by chance, so κ is 0/0) or no subject has two ratings. */
  kappa: number | null;
  /** P̄, mean agreement over the subjects with at least two ratings; null when there are none. */
  observed: number | null;
  /** P̄e, chance agreement; null when nobody rated anything. */
  chance: number | null;
  /** π_j (p_j when every subject has the same raters), one per category column. */
  categoryShares: number[];
  /** Subjects in P̄ (at least two ratings). */
  subjects: number;
}

/** P_i of one subject's counts by category; null with fewer than two ratings. */
export function subjectAgreement(counts: readonly number[]): number | null {
  const r = counts.reduce((s, c) => s + c, 0);
  if (r < 2) return null;
  const pairs = counts.reduce((s, c) => s + c * (c - 1), 0);
  return pairs / (r * (r - 1));
}

/**
 * Fleiss' kappa of a subjects × categories count matrix (`table[i][j]`: how many raters put
 * subject i in category j). Rows may sum to different totals (see the rule above).
 */
export function fleissKappa(table: readonly (readonly number[])[]): FleissKappa {
  const k = table[0]?.length ?? 0;
  for (const row of table) {
    if (row.length !== k) throw new RangeError('every subject needs one count per category');
    if (row.some((c) => !Number.isInteger(c) || c < 0)) throw new RangeError('counts must be whole numbers ≥ 0');
  }
  const rated = table.filter((row) => row.some((c) => c > 0));
  const shares = new Array<number>(k).fill(0);
  for (const row of rated) {
    const r = row.reduce((s, c) => s + c, 0);
    row.forEach((c, j) => (shares[j] += c / r));
  }
  const categoryShares = rated.length ? shares.map((s) => s / rated.length) : shares;
  const agreements = rated.map(subjectAgreement).filter((p): p is number => p !== null);
  const observed = agreements.length ? agreements.reduce((s, p) => s + p, 0) / agreements.length : null;
  const chance = rated.length ? categoryShares.reduce((s, p) => s + p * p, 0) : null;
  // P̄e within a rounding hair of 1 is 1: every rating fell in one category.
  const kappa = observed === null || chance === null || 1 - chance < 1e-12 ? null : (observed - chance) / (1 - chance);
  return { kappa, observed, chance, categoryShares, subjects: agreements.length };
}

/** Builds the count matrix from each subject's list of category labels; categories in first-seen order unless given. */
export function countTable(subjects: readonly (readonly string[])[], categories?: readonly string[]): { categories: string[]; table: number[][] } {
  const cats = categories ? [...categories] : [...new Set(subjects.flat())];
  const index = new Map(cats.map((c, j) => [c, j]));
  const table = subjects.map((labels) => {
    const row = new Array<number>(cats.length).fill(0);
    for (const label of labels) {
      const j = index.get(label);
      if (j === undefined) throw new RangeError(`unknown category ${label}`);
      row[j] += 1;
    }
    return row;
  });
  return { categories: cats, table };
}
