import { test } from 'node:test';
import assert from 'node:assert/strict';
import { between, segmentPosition } from '../../shared/colour/between.js';
import { createChipIndex } from '../../shared/colour/chip-index.js';
import { ACCEPTABILITY_THRESHOLD_DE00, PERCEPTIBILITY_THRESHOLD_DE00 } from '../../shared/colour/constants.js';
import type { Lab } from '../../shared/colour/lab.js';
import { createMatcher } from '../../shared/colour/matcher.js';
import { verdictFor } from '../../shared/colour/verdict.js';

// "Between": t of the reading's projection on the CIELAB segment nearest → second nearest,
// clamped to [0, 1] (docs/colour.md). Constructed cases, so the expected t is known exactly.

const A: Lab = { l: 50, a: 10, b: 10 };
const B: Lab = { l: 54, a: 10, b: 10 };

test('between: the midpoint of the segment gives t = 0.5', () => {
  assert.equal(segmentPosition({ l: 52, a: 10, b: 10 }, A, B), 0.5);
});

test('between: a point off the segment projects onto it (t = 0.25 for L* 51, whatever its a*)', () => {
  assert.equal(segmentPosition({ l: 51, a: 13, b: 10 }, A, B), 0.25);
});

test('between: t is clamped to 0 before a and to 1 beyond b', () => {
  assert.equal(segmentPosition({ l: 47, a: 10, b: 10 }, A, B), 0);
  assert.equal(segmentPosition({ l: 60, a: 10, b: 10 }, A, B), 1);
  assert.equal(segmentPosition(A, A, B), 0);
  assert.equal(segmentPosition(B, A, B), 1);
});

test('between: coinciding chips give t = 0', () => {
  assert.equal(segmentPosition({ l: 51, a: 0, b: 0 }, A, A), 0);
});

test('between through the index: the two nearest chips, the nearer as "from", and t < 0.5', () => {
  const chips = [
    { code: 'X', lab: [50, 10, 10] as [number, number, number] },
    { code: 'Y', lab: [54, 10, 10] as [number, number, number] },
    { code: 'Z', lab: [80, -30, 40] as [number, number, number] },
  ];
  const matcher = createMatcher(chips);
  const result = matcher.between({ l: 51, a: 10, b: 10 })!;
  assert.equal(result.from.chip.code, 'X');
  assert.equal(result.to.chip.code, 'Y');
  assert.equal(result.t, 0.25);
  assert.ok(result.from.deltaE < result.to.deltaE);
  const reading = { l: 53.5, a: 10, b: 10 };
  const near = matcher.between(reading)!;
  assert.equal(near.from.chip.code, 'Y');
  assert.equal(near.to.chip.code, 'X');
  assert.equal(near.t, 0.125);
  const labOf = (c: (typeof chips)[number]) => ({ l: c.lab[0], a: c.lab[1], b: c.lab[2] });
  assert.equal(between(createChipIndex([A]), [chips[0]], labOf, reading), undefined, 'one chip has no "between"');
});

// Verdict bands, Paravina et al. (2015), J. Esthet. Restor. Dent. 27:S1–S9: 50:50 % perceptibility
// ΔE00 = 0.8, 50:50 % acceptability ΔE00 = 1.8; upper ends inclusive.
test('verdict bands at their edges (Paravina et al. 2015: 0.8 and 1.8)', () => {
  assert.equal(PERCEPTIBILITY_THRESHOLD_DE00, 0.8);
  assert.equal(ACCEPTABILITY_THRESHOLD_DE00, 1.8);
  assert.equal(verdictFor(0), 'indistinguishable');
  assert.equal(verdictFor(0.8), 'indistinguishable');
  assert.equal(verdictFor(0.8000001), 'close');
  assert.equal(verdictFor(1.8), 'close');
  assert.equal(verdictFor(1.8000001), 'clearly different');
  assert.equal(verdictFor(40), 'clearly different');
  assert.throws(() => verdictFor(-0.1), RangeError);
  assert.throws(() => verdictFor(Number.NaN), RangeError);
});

test('matches carry their verdict', () => {
  const matcher = createMatcher([{ lab: [50, 0, 0] as [number, number, number] }, { lab: [60, 0, 0] as [number, number, number] }]);
  const [first, second] = matcher.nearest({ l: 50.5, a: 0, b: 0 }, 2);
  assert.equal(first.verdict, verdictFor(first.deltaE));
  assert.equal(first.verdict, 'indistinguishable');
  assert.equal(second.verdict, 'clearly different');
});
