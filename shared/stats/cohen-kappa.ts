// Cohen's kappa for two raters, unweighted and linear-weighted.
//
// Unweighted: Cohen, J. (1960), "A coefficient of agreement for nominal scales", Educational and
// Psychological Measurement 20(1):37–46: p_o = Σ_i n_ii / n, p_e = Σ_i n_i+ n_+i / n²,
// κ = (p_o − p_e) / (1 − p_e).
// Weighted: Cohen, J. (1968), "Weighted kappa", Psychological Bulletin 70(4):213–220, with
// agreement weights w_ij = 1 − |i − j| / (k − 1) (the "linear" weights of Cicchetti & Allison
// 1971): p_o(w) = Σ w_ij n_ij / n, p_e(w) = Σ w_ij n_i+ n_+j / n², κ_w = (p_o(w) − p_e(w)) / (1 − p_e(w)).
// Linear weights only mean something when the categories are ordered; field chips are not (their
// codes run by hue family, then lightness), so the calibration screen uses the unweighted κ.

/** κ of a k × k table (`table[i][j]`: rater A said i, rater B said j); null when p_e = 1 (0/0) or the table is empty. */
export function cohenKappa(table: readonly (readonly number[])[]): number | null {
  return weightedKappa(table, (i, j) => (i === j ? 1 : 0));
}

/** Linear-weighted κ_w of a k × k table whose categories are in their order; null as for `cohenKappa`. */
export function linearWeightedKappa(table: readonly (readonly number[])[]): number | null {
  const k = table.length;
  return weightedKappa(table, (i, j) => (k === 1 ? 1 : 1 - Math.abs(i - j) / (k - 1)));
}

function weightedKappa(table: readonly (readonly number[])[], weight: (i: number, j: number) => number): number | null {
  const k = table.length;
  if (table.some((row) => row.length !== k)) throw new RangeError('the table must be square');
  const rows = table.map((row) => row.reduce((s, c) => s + c, 0));
  const cols = table[0]?.map((_, j) => table.reduce((s, row) => s + row[j], 0)) ?? [];
  const n = rows.reduce((s, c) => s + c, 0);
  if (n === 0) return null;
  let po = 0;
  let pe = 0;
  for (let i = 0; i < k; i++) {
    for (let j = 0; j < k; j++) {
      const w = weight(i, j);
      po += (w * table[i][j]) / n;
      pe += (w * rows[i] * cols[j]) / (n * n);
    }
  }
  return 1 - pe < 1e-12 ? null : (po - pe) / (1 - pe);
}

/** The k × k table of two raters' labels for the same subjects (pairs with a missing label left out), categories sorted. */
export function pairTable(a: readonly (string | null)[], b: readonly (string | null)[]): { categories: string[]; table: number[][]; n: number } {
  if (a.length !== b.length) throw new RangeError('both raters need one entry per subject');
  const pairs: [string, string][] = [];
  a.forEach((x, i) => {
    const y = b[i];
    if (x !== null && y !== null) pairs.push([x, y]);
  });
  const categories = [...new Set(pairs.flat())].sort();
  const index = new Map(categories.map((c, j) => [c, j]));
  const table = categories.map(() => new Array<number>(categories.length).fill(0));
  for (const [x, y] of pairs) table[index.get(x)!][index.get(y)!] += 1;
  return { categories, table, n: pairs.length };
}
