// The drift overview's worker threads really run the analysis, under tsx as the server runs, and
// give exactly the flags this thread gives. On Node 20 a worker does not inherit tsx's module hooks,
// so without its own registration every worker failed to start and the pool quietly analysed
// everything in the main thread.
import assert from 'node:assert/strict';
import { test } from 'node:test';
import { DriftPool } from '../../server/analysis/drift-pool.js';
import { pairFlags, type PairInput } from '../../server/analysis/pair-flags.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';

/** Invented readings of one pair: a wet and a dry season at two sites, the dry season `shift` L* lighter. */
function pair(key: string, shift: number, seed: number): PairInput {
  const random = mulberry32(seed);
  const input: PairInput = { key, threshold: 1.8, siteId: [], l: [], a: [], b: [], season: [], seasonYear: [], observedAt: [] };
  for (let i = 0; i < 40; i++) {
    const dry = i % 2 === 1;
    input.siteId.push(1 + (i % 4 < 2 ? 0 : 1));
    input.l.push(40 + (dry ? shift : 0) + (random() - 0.5) * 2);
    input.a.push(20 + (random() - 0.5) * 2);
    input.b.push(-5 + (random() - 0.5) * 2);
    input.season.push(dry ? 'Dry' : 'Wet');
    input.seasonYear.push(2025);
    input.observedAt.push(Date.UTC(2025, dry ? 6 : 1, 1 + i));
  }
  return input;
}

test('should analyse every share in a worker thread, with the same flags as this thread', async () => {
  const pairs = [pair('1:1', 6, 1), pair('1:2', 0, 2), pair('2:1', 4, 3), pair('2:2', 0.2, 4)];
  const pool = new DriftPool(2);
  try {
    const inWorkers = await pool.run(pairs);
    assert.equal(pool.fallbacks, 0, 'no share fell back to the main thread');
    assert.deepEqual(inWorkers, pairs.map(pairFlags));
    assert.ok(inWorkers.some((r) => r.flags.length > 0) && inWorkers.some((r) => r.flags.length === 0), 'the invented pairs hold both a drifting and a steady one');
  } finally {
    await pool.close();
  }
});

test('should keep a script alive while two overlapping runs share one worker, and answer both', async () => {
  // The worker is held while any share is out: before, the first answer let it go while the second
  // was still being analysed, and a script awaiting both could end with nothing printed.
  const pool = new DriftPool(1);
  try {
    const first = [pair('1:1', 6, 5), pair('1:2', 0, 6)];
    const second = [pair('2:1', 5, 7), pair('2:2', 0, 8), pair('2:3', 3, 9)];
    const [a, b] = await Promise.all([pool.run(first), pool.run(second)]);
    assert.equal(pool.fallbacks, 0);
    assert.deepEqual(a, first.map(pairFlags));
    assert.deepEqual(b, second.map(pairFlags));
  } finally {
    await pool.close();
  }
});
