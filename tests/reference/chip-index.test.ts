import { test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import { converter, differenceCiede2000, type Lab65 } from 'culori';
import { createChipIndex } from '../../shared/colour/chip-index.js';
import { deltaE00LowerBound, meanChromaPrimeMax } from '../../shared/colour/delta-e-bound.js';
import { deltaE00 } from '../../shared/colour/delta-e.js';
import { fromCulori, labFromTuple, type Lab } from '../../shared/colour/lab.js';
import { createScan } from '../../shared/colour/nearest.js';
import type { ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';

// Exactness of the chip index: its answers must equal a full scan's (the scan computes every
// ΔE00 with culori and sorts, ties by list position). Seeds are our own.

const set = JSON.parse(readFileSync(new URL('../../reference-colors/reference-set-v1.json', import.meta.url), 'utf8')) as ReferenceSetFile;
const allLabs = set.chips.map((c) => labFromTuple(c.lab));
const fieldLabs = set.chips.filter((c) => c.parent === null).map((c) => labFromTuple(c.lab));
const toLab65 = converter('lab65');

/** Seeded queries: mostly sRGB colours, some anywhere in the API's range (L 0–100, |a|, |b| ≤ 200). */
function queries(count: number, seed: number): Lab[] {
  const random = mulberry32(seed);
  return Array.from({ length: count }, (_, i) =>
    i % 4 === 3
      ? { l: 100 * random(), a: 400 * random() - 200, b: 400 * random() - 200 }
      : fromCulori(toLab65({ mode: 'rgb', r: random(), g: random(), b: random() })),
  );
}

const ciede2000 = differenceCiede2000(1, 1, 1);

/**
 * The test's own full scan, independent of the library's: every ΔE00 computed with culori, then
 * the k smallest picked by k passes (ties to the lower position).
 */
function fullScan(colours: Lab65[], query: Lab, k: number): { index: number; deltaE: number }[] {
  const probe: Lab65 = { mode: 'lab65', ...query };
  const all = Float64Array.from(colours, (c) => ciede2000(probe, c));
  const picked: { index: number; deltaE: number }[] = [];
  for (let round = 0; round < Math.min(k, all.length); round++) {
    let best = -1;
    for (let i = 0; i < all.length; i++) if (!Number.isNaN(all[i]) && (best < 0 || all[i] < all[best])) best = i;
    picked.push({ index: best, deltaE: all[best] });
    all[best] = NaN;
  }
  return picked;
}

/** Index answers for k = 1 and k = `k` against one full scan per query. */
function assertSameAnswers(labs: Lab[], qs: Lab[], k: number) {
  const index = createChipIndex(labs);
  const colours: Lab65[] = labs.map((l) => ({ mode: 'lab65', ...l }));
  for (const q of qs) {
    const want = fullScan(colours, q, k);
    const same = (got: { index: number; deltaE: number }[], expected: typeof want) =>
      got.length === expected.length && got.every((g, i) => g.index === expected[i].index && g.deltaE === expected[i].deltaE);
    const top = index.nearest(q, k);
    if (!same(top, want)) assert.deepEqual(top, want, `top-${k} of ${JSON.stringify(q)}`);
    const first = index.nearest(q, 1);
    if (!same(first, want.slice(0, 1))) assert.deepEqual(first, want.slice(0, 1), `top-1 of ${JSON.stringify(q)}`);
  }
}

test('the ΔE00 lower bound never exceeds the true ΔE00 (1,000,000 seeded pairs, with boxes around the second colour)', () => {
  const random = mulberry32(0x424f554e);
  let violations = 0;
  let tightest = Infinity;
  for (let n = 0; n < 1_000_000; n++) {
    const q = { l: 100 * random(), a: 260 * random() - 130, b: 260 * random() - 130 };
    // Mostly near pairs (the index's working range), some far ones.
    const spread = n % 10 === 0 ? 100 : 8 * random();
    const p = { l: Math.min(100, Math.max(0, q.l + spread * (2 * random() - 1))), a: q.a + spread * (2 * random() - 1), b: q.b + spread * (2 * random() - 1) };
    const grow = n % 2 === 0 ? 0 : 5 * random();
    const box = { lMin: p.l - grow * random(), lMax: p.l + grow * random(), aMin: p.a - grow * random(), aMax: p.a + grow * random(), bMin: p.b - grow * random(), bMax: p.b + grow * random() };
    const bound = deltaE00LowerBound(q, box);
    const truth = deltaE00(q, p);
    if (bound > truth * (1 + 1e-12)) violations++;
    if (grow === 0 && truth > 0.5) tightest = Math.min(tightest, truth / bound);
  }
  assert.equal(violations, 0);
  // It must also prune: a bound of 0 everywhere would be "safe" and useless.
  assert.ok(tightest < 3, `the bound is never within a factor 3 of ΔE00 (best ratio ${tightest})`);
});

test('C̄′max = (1 + G(C̄))·C̄ is non-decreasing in C̄, as the bound assumes (grid of 0.001 up to 300)', () => {
  let previous = -Infinity;
  for (let c = 0; c <= 300; c += 0.001) {
    const v = meanChromaPrimeMax(c);
    assert.ok(v >= previous, `decreases at C̄ = ${c}`);
    previous = v;
  }
});

test('index = full scan, top-1 and top-5, on 25,000 seeded colours over the 189 field chips', () => {
  const qs = queries(25_000, 0x46494531);
  assertSameAnswers(fieldLabs, qs, 5);
});

test('index = full scan, top-1 and top-5, on 1,000 seeded colours over the whole reference set', () => {
  assertSameAnswers(allLabs, queries(1000, 0x57484f4c), 5);
});

test('index = full scan on a crowded blue set (where R_T is largest), with exact ties and repeated chips', () => {
  const random = mulberry32(0x424c5545);
  const labs: Lab[] = [];
  for (let i = 0; i < 3000; i++) labs.push({ l: 20 + 40 * random(), a: 30 * random() - 5, b: -20 - 60 * random() });
  labs.push(...labs.slice(0, 200)); // duplicates: equal ΔE00, so ties must go to the lower position
  labs.push({ l: 40, a: 10, b: -50 }, { l: 40, a: 10, b: -50 });
  const qs = Array.from({ length: 3000 }, () => ({ l: 20 + 40 * random(), a: 40 * random() - 10, b: -10 - 70 * random() }));
  qs.push({ l: 40, a: 10, b: -50 }, labs[7]);
  assertSameAnswers(labs, qs, 5);
  assertSameAnswers(labs, qs.slice(0, 300), 50);
});

test('index answers: k larger than the set, the chip itself at ΔE00 0, and a refused k', () => {
  const labs = fieldLabs.slice(0, 3);
  const index = createChipIndex(labs);
  assert.equal(index.nearest({ l: 50, a: 0, b: 0 }, 10).length, 3);
  const self = createChipIndex(allLabs).nearest(allLabs[1234], 1)[0];
  assert.deepEqual(self, { index: 1234, deltaE: 0 });
  assert.throws(() => index.nearest({ l: 50, a: 0, b: 0 }, 0), RangeError);
  assert.throws(() => index.nearest({ l: 50, a: 0, b: 0 }, 1.5), RangeError);
  assert.deepEqual(createChipIndex([]).nearest({ l: 50, a: 0, b: 0 }, 3), []);
  // The library's own scan (used by the benchmark) gives the same answers as the index.
  const scan = createScan(allLabs);
  const big = createChipIndex(allLabs);
  for (const q of queries(200, 0x5343414e)) assert.deepEqual(scan(q, 5), big.nearest(q, 5));
});
