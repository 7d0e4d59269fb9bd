// Look-alike accessions (issue 14): the demo's planted duplicate found and nothing else, distances
// that agree with the characterisation records (colorjs.io as an independent CIEDE2000), Gower's
// per-variable dissimilarity worked by hand, roles and bad input.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Color from 'colorjs.io';
import type { AccessionProfile, DescriptorSummary, DuplicatesAnswer, SimilarAnswer } from '../../shared/api/profile-answers.js';
import { DEMO_DUPLICATE } from '../../server/demo/demo-scenario.js';
import { gowerPart } from '../../server/profile/similar.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { Client, signedInAs, startHarness, type Harness } from './harness.js';

/** colorjs.io's CIEDE2000 on the same L*a*b* numbers (tests/reference/cross-check.test.ts). */
const colorjsDE00 = (p: number[], q: number[]) => new Color('lab', p as [number, number, number]).deltaE(new Color('lab', q as [number, number, number]), '2000');

describe('look-alike accessions', () => {
  let h: Harness;
  let reviewer: Client;
  const id = { original: 0, duplicate: 0 };

  before(async () => {
    h = await startHarness({ demo: true });
    reviewer = await signedInAs(h, 'reviewer');
    const accessions = (await reviewer.get('/api/accessions').expect(200)).body as { id: number; accessionNumber: string }[];
    id.original = accessions.find((a) => a.accessionNumber === DEMO_DUPLICATE.sameAs)!.id;
    id.duplicate = accessions.find((a) => a.accessionNumber === DEMO_DUPLICATE.accessionNumber)!.id;
  });
  after(() => h.close());

  test('should find the planted duplicate as the collection\'s only possible duplicate', async () => {
    const d = (await reviewer.get('/api/accessions/duplicates').expect(200)).body as DuplicatesAnswer;
    assert.deepEqual(d.pairs.map((p) => [p.a.accessionNumber, p.b.accessionNumber]), [[DEMO_DUPLICATE.sameAs, DEMO_DUPLICATE.accessionNumber]]);
    assert.ok(d.pairs[0]!.worstColourRatio <= 1 && d.pairs[0]!.sharedColour >= 3);
    assert.match(d.method, /Gower \(1971, Biometrics 27:857–871\)/);
  });

  test('should rank the duplicate first, with ΔE00 between the records\' accepted colours per shared character', async () => {
    const s = (await reviewer.get(`/api/accessions/${id.original}/similar?limit=5`).expect(200)).body as SimilarAnswer;
    assert.equal(s.items.length, 5);
    assert.equal(s.items[0]!.accessionNumber, DEMO_DUPLICATE.accessionNumber);
    assert.equal(s.items[0]!.possibleDuplicate, true);
    assert.ok(s.items.slice(1).every((x) => !x.possibleDuplicate && x.distance >= s.items[0]!.distance));
    const [mine, theirs] = await Promise.all([id.original, id.duplicate].map(async (x) => (await reviewer.get(`/api/accessions/${x}/profile`).expect(200)).body as AccessionProfile));
    for (const c of s.items[0]!.characters.filter((x) => x.kind === 'colour')) {
      const a = mine!.characters.find((x) => x.code === c.code)!.centre.lab;
      const b = theirs!.characters.find((x) => x.code === c.code)!.centre.lab;
      assert.ok(Math.abs(c.distance - colorjsDE00(a, b)) < 1e-4, `${c.code}: ${c.distance} vs colorjs ${colorjsDE00(a, b)}`);
      assert.equal(c.separates, c.distance > c.threshold);
    }
    // Another accession is told apart, and the characters that separate it come first.
    const other = s.items[1]!;
    assert.ok(other.characters[0]!.separates);
    const firstKept = other.characters.findIndex((c) => !c.separates);
    assert.ok(firstKept === -1 || other.characters.slice(firstKept).every((c) => !c.separates), 'separating characters first');
  });

  test('should compute Gower\'s per-variable dissimilarity: |x − y| / R for numbers, 0 or 1 for categories (Gower 1971)', () => {
    const number = (median: number): DescriptorSummary => ({ descriptorId: 1, code: 'petiole.length', label: 'Petiole length', kind: 'length', n: 2, median, min: median, max: median, formatted: null, mode: null, modeLabel: null, share: null });
    const category = (mode: string): DescriptorSummary => ({ ...number(0), kind: 'category', median: null, min: null, max: null, mode, modeLabel: mode, share: 1 });
    // Medians 0.90 m and 1.02 m over a collection range of 0.40 m: 0.12 / 0.40 = 0.3.
    assert.ok(Math.abs(gowerPart(number(0.9), number(1.02), 0.4) - 0.3) < 1e-12);
    assert.equal(gowerPart(number(0.9), number(1.02), 0), 0, 'a range of 0: every accession alike');
    assert.equal(gowerPart(category('level'), category('level'), undefined), 0);
    assert.equal(gowerPart(category('level'), category('tip-up'), undefined), 1);
  });

  test('should be read by every role and refused when signed out', async () => {
    for (const role of ['admin', 'trainer', 'recorder'] as const) {
      const c = await signedInAs(h, role);
      await c.get(`/api/accessions/${id.original}/similar`).expect(200);
      await c.get('/api/accessions/duplicates').expect(200);
    }
    assertProblem(await new Client(h.app).get(`/api/accessions/${id.original}/similar`), 401);
    assertProblem(await new Client(h.app).get('/api/accessions/duplicates'), 401);
  });

  test('should refuse bad input with problem+json naming the field', async () => {
    assertInvalidFields(await reviewer.get(`/api/accessions/${id.original}/similar?limit=0`), 'limit');
    assertInvalidFields(await reviewer.get(`/api/accessions/${id.original}/similar?minShared=some`), 'minShared');
    assertInvalidFields(await reviewer.get(`/api/accessions/${id.original}/similar?colour=red`), 'query');
    assertInvalidFields(await reviewer.get('/api/accessions/duplicates?minShared=999'), 'minShared');
    assertProblem(await reviewer.get('/api/accessions/999999/similar'), 404);
  });
});
