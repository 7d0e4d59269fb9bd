// Agreement statistics of observer calibration (issue 7) against published worked examples.
import { describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { countTable, fleissKappa, subjectAgreement } from '../../shared/stats/fleiss-kappa.js';
import { cohenKappa, linearWeightedKappa, pairTable } from '../../shared/stats/cohen-kappa.js';
import { landisKochBand } from '../../shared/stats/landis-koch.js';

const close = (actual: number | null, expected: number, tol: number, what = '') => {
  assert.ok(actual !== null, `${what} is null`);
  assert.ok(Math.abs(actual - expected) <= tol, `${what} ${actual} ≠ ${expected} (± ${tol})`);
};

describe("Fleiss' kappa", () => {
  test('worked example of 10 subjects × 14 raters × 5 categories (as reproduced in the statsmodels test suite, test_inter_rater.py)', () => {
    const table = [
      [0, 0, 0, 0, 14],
      [0, 2, 6, 4, 2],
      [0, 0, 3, 5, 6],
      [0, 3, 9, 2, 0],
      [2, 2, 8, 1, 1],
      [7, 7, 0, 0, 0],
      [3, 2, 6, 3, 0],
      [2, 5, 3, 2, 2],
      [6, 5, 2, 1, 0],
      [0, 2, 2, 3, 7],
    ];
    const r = fleissKappa(table);
    close(r.observed, 0.378022, 5e-7, 'P̄');
    close(r.chance, 0.212755, 5e-7, 'P̄e');
    close(r.kappa, 0.2099307, 5e-8, 'κ');
    assert.equal(r.subjects, 10);
  });

  // Fleiss (1971), Psychological Bulletin 76(5):378–382, Table 1: 30 patients, 6 psychiatrists
  // each, categories depression, personality disorder, schizophrenia, neurosis, other; κ = 0.4302
  // and category totals 26, 26, 30, 55, 43. The 30 rows are transcribed here
  // from the `diagnoses` data set of the R package irr (Gamer, Lemon, Fellows & Singh), which
  // distributes that table as one row of six diagnoses per patient; we turned each row into
  // counts. The transcription is checked below against the totals and κ that Fleiss printed.
  const fleiss1971 = [
    [0, 0, 0, 6, 0], [0, 3, 0, 0, 3], [0, 1, 4, 0, 1], [0, 0, 0, 0, 6], [0, 3, 0, 3, 0],
    [2, 0, 4, 0, 0], [0, 0, 4, 0, 2], [2, 0, 3, 1, 0], [2, 0, 0, 4, 0], [0, 0, 0, 0, 6],
    [1, 0, 0, 5, 0], [1, 1, 0, 4, 0], [0, 3, 3, 0, 0], [1, 0, 0, 5, 0], [0, 2, 0, 3, 1],
    [0, 0, 5, 0, 1], [3, 0, 0, 1, 2], [5, 1, 0, 0, 0], [0, 2, 0, 4, 0], [1, 0, 2, 0, 3],
    [0, 0, 0, 0, 6], [0, 1, 0, 5, 0], [0, 2, 0, 1, 3], [2, 0, 0, 4, 0], [1, 0, 0, 4, 1],
    [0, 5, 0, 1, 0], [4, 0, 0, 0, 2], [0, 2, 0, 4, 0], [1, 0, 5, 0, 0], [0, 0, 0, 0, 6],
  ];

  test('Fleiss (1971) Table 1 transcription: 30 subjects, 6 ratings each, category totals 26, 26, 30, 55, 43', () => {
    assert.equal(fleiss1971.length, 30);
    for (const row of fleiss1971) assert.equal(row.reduce((s, c) => s + c, 0), 6);
    const totals = [0, 1, 2, 3, 4].map((j) => fleiss1971.reduce((s, row) => s + row[j], 0));
    assert.deepEqual(totals, [26, 26, 30, 55, 43]);
  });

  test('Fleiss (1971): κ = 0.4302, and p_j = totals / 180', () => {
    const r = fleissKappa(fleiss1971);
    close(r.kappa, 0.4302, 5e-5, 'κ');
    [26, 26, 30, 55, 43].forEach((t, j) => close(r.categoryShares[j], t / 180, 1e-12, `p_${j + 1}`));
  });

  test('missing answers: P̄ over subjects with ≥ 2 ratings, chance shares over per-subject proportions (Gwet, irrCAC fleiss.kappa.dist), by hand', () => {
    // Subject 1: A A B (3 ratings), subject 2: A B (2), subject 3: B (1, chance only).
    //   P_1 = (2·1 + 1·0) / (3·2) = 1/3, P_2 = 0 / 2 = 0 → P̄ = 1/6.
    //   π_A = (2/3 + 1/2 + 0) / 3 = 7/18, π_B = (1/3 + 1/2 + 1) / 3 = 11/18.
    //   P̄e = (49 + 121) / 324 = 170/324; κ = (1/6 − 170/324) / (1 − 170/324) = (54 − 170) / 154 = −116/154.
    const r = fleissKappa([[2, 1], [1, 1], [0, 1], [0, 0]]);
    close(r.observed, 1 / 6, 1e-12, 'P̄');
    close(r.chance, 170 / 324, 1e-12, 'P̄e');
    close(r.kappa, -116 / 154, 1e-12, 'κ');
    assert.equal(r.subjects, 2);
  });

  test('perfect agreement over two categories gives κ = 1', () => {
    close(fleissKappa([[3, 0], [0, 3], [3, 0]]).kappa, 1, 1e-12, 'κ');
  });

  test('every rating in one category: P̄ = P̄e = 1, κ is 0/0 and we answer null rather than a number', () => {
    const r = fleissKappa([[4, 0], [4, 0]]);
    assert.equal(r.kappa, null);
    assert.equal(r.observed, 1);
    assert.equal(r.chance, 1);
  });

  test('no subject with two ratings: κ and P̄ are null', () => {
    const r = fleissKappa([[1, 0], [0, 1]]);
    assert.equal(r.kappa, null);
    assert.equal(r.observed, null);
    assert.equal(subjectAgreement([1, 0]), null);
  });

  test('systematic disagreement gives a negative κ (−1/(n − 1) for two raters who always differ on two equally used categories)', () => {
    close(fleissKappa([[1, 1], [1, 1]]).kappa, -1, 1e-12, 'κ');
  });

  test('refuses ragged or negative tables', () => {
    assert.throws(() => fleissKappa([[1, 2], [1]]), RangeError);
    assert.throws(() => fleissKappa([[1, -1]]), RangeError);
  });

  test('countTable counts labels per subject', () => {
    assert.deepEqual(countTable([['F-001', 'F-002', 'F-001'], ['F-002']]), { categories: ['F-001', 'F-002'], table: [[2, 1], [0, 1]] });
  });
});

describe("Cohen's kappa", () => {
  // A worked 3 × 3 table [[0,4,1],[0,8,0],[0,1,5]] (n = 19), κ = 0.4842, linear-weighted 0.4701.
  // By hand: p_o = 13/19, p_e = (5·0 + 8·13 + 6·6)/361 = 140/361 → κ = (13·19 − 140)/(361 − 140) = 107/221.
  const table = [
    [0, 4, 1],
    [0, 8, 0],
    [0, 1, 5],
  ];
  test('unweighted κ = 0.4842 (= 107/221)', () => {
    close(cohenKappa(table), 0.4842, 5e-5, 'κ');
    close(cohenKappa(table), 107 / 221, 1e-12, 'κ exact');
  });
  test('linear-weighted κ_w = 0.4701 (weights 1 − |i − j|/(k − 1), Cohen 1968)', () => {
    close(linearWeightedKappa(table), 0.4701, 5e-5, 'κ_w');
  });
  test('perfect agreement gives 1; both raters always in one category gives null (p_e = 1)', () => {
    close(cohenKappa([[3, 0], [0, 2]]), 1, 1e-12, 'κ');
    assert.equal(cohenKappa([[5]]), null);
    assert.equal(cohenKappa([[0, 0], [0, 0]]), null);
  });
  test('pairTable builds the table from two label lists, skipping missing answers', () => {
    const t = pairTable(['F-001', 'F-002', null, 'F-002'], ['F-001', 'F-001', 'F-002', 'F-002']);
    assert.deepEqual(t, { categories: ['F-001', 'F-002'], table: [[1, 0], [1, 1]], n: 3 });
  });
});

describe('Landis & Koch (1977) bands, Biometrics 33:159–174', () => {
  const cases: [number, string][] = [
    [-0.01, 'poor'],
    [0, 'slight'],
    [0.2, 'slight'],
    [0.21, 'fair'],
    [0.4, 'fair'],
    [0.41, 'moderate'],
    [0.6, 'moderate'],
    [0.61, 'substantial'],
    [0.8, 'substantial'],
    [0.81, 'almost-perfect'],
    [1, 'almost-perfect'],
  ];
  for (const [kappa, band] of cases) test(`κ = ${kappa} is ${band}`, () => assert.equal(landisKochBand(kappa), band));
  test('the published examples land in their bands: 0.2099 fair, 0.4302 moderate, 0.4842 moderate', () => {
    assert.equal(landisKochBand(0.2099307), 'fair');
    assert.equal(landisKochBand(0.4302), 'moderate');
    assert.equal(landisKochBand(0.4842), 'moderate');
  });
  test('NaN has no band', () => assert.throws(() => landisKochBand(NaN), RangeError));
});
