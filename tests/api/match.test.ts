import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { differenceCiede2000, formatHex } from 'culori';
import type { MatchAnswer } from '../../shared/api/reference-set-answers.js';
import type { ReferenceChip, ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { readSetV1 } from './reference-set-file.js';

/** Bands of Paravina et al. (2015), J. Esthet. Restor. Dent. 27:S1–S9: perceptibility 0.8, acceptability 1.8 (ΔE00). */
function expectedVerdict(deltaE: number): string {
  return deltaE <= 0.8 ? 'indistinguishable' : deltaE <= 1.8 ? 'close' : 'clearly different';
}

/** ΔE00 by culori directly over the file, every chip scanned: the answer the server's index must give. */
const ciede2000 = differenceCiede2000();
function bruteForceNearest(chips: readonly ReferenceChip[], lab: [number, number, number], k: number): { code: string; deltaE: number }[] {
  const probe = { mode: 'lab65' as const, l: lab[0], a: lab[1], b: lab[2] };
  return chips
    .map((c) => ({ code: c.code, deltaE: ciede2000(probe, { mode: 'lab65', l: c.lab[0], a: c.lab[1], b: c.lab[2] }) }))
    .sort((x, y) => x.deltaE - y.deltaE)
    .slice(0, k);
}

describe('POST /api/match', () => {
  let h: Harness;
  let recorder: Client;
  let file: ReferenceSetFile;

  before(async () => {
    h = await startHarness();
    recorder = await signedInAs(h, 'recorder');
    file = readSetV1();
  });
  after(() => h.close());

  async function match(body: object): Promise<MatchAnswer> {
    const res = await recorder.post('/api/match', body);
    assert.equal(res.status, 200, res.text);
    return res.body as MatchAnswer;
  }

  describe('refuses bad input with 400 problem+json naming the field', () => {
    const cases: [string, object, string[]][] = [
      ['no colour at all', {}, ['hex', 'lab']],
      ['both hex and lab', { hex: '#7b3f6e', lab: [40, 20, -10] }, ['hex', 'lab']],
      ['a hex with a letter that is not hex', { hex: '#7b3f6g' }, ['hex']],
      ['a hex of five digits', { hex: '#7b3f6' }, ['hex']],
      ['a hex with alpha', { hex: '#7b3f6eff' }, ['hex']],
      ['a colour name instead of hex', { hex: 'purple' }, ['hex']],
      ['a hex that is a number', { hex: 0x7b3f6e }, ['hex']],
      ['an empty hex', { hex: '' }, ['hex']],
      ['L* below 0', { lab: [-0.01, 0, 0] }, ['lab.0']],
      ['L* above 100', { lab: [100.5, 0, 0] }, ['lab.0']],
      ['a* above 200', { lab: [50, 200.1, 0] }, ['lab.1']],
      ['a* below −200', { lab: [50, -201, 0] }, ['lab.1']],
      ['b* above 200', { lab: [50, 0, 250] }, ['lab.2']],
      ['b* below −200', { lab: [50, 0, -200.5] }, ['lab.2']],
      ['a lab of two numbers', { lab: [50, 0] }, ['lab']],
      ['a lab of four numbers', { lab: [50, 0, 0, 0] }, ['lab']],
      ['a lab given as text', { lab: '50,0,0' }, ['lab']],
      ['a lab with a text channel', { lab: [50, '0', 0] }, ['lab.1']],
      ['k of 0', { hex: '#7b3f6e', k: 0 }, ['k']],
      ['k of 51', { hex: '#7b3f6e', k: 51 }, ['k']],
      ['k not whole', { hex: '#7b3f6e', k: 2.5 }, ['k']],
      ['k as text', { hex: '#7b3f6e', k: '5' }, ['k']],
      ['a set id that cannot be one', { hex: '#7b3f6e', setId: 'v1; drop' }, ['setId']],
    ];
    for (const [what, body, fields] of cases) {
      test(`should refuse ${what}`, async () => {
        assertInvalidFields(await recorder.post('/api/match', body), ...fields);
      });
    }

    test('should answer 404 problem+json for a set that does not exist', async () => {
      const problem = assertProblem(await recorder.post('/api/match', { hex: '#7b3f6e', setId: 'v9' }), 404);
      assert.match(problem.detail ?? '', /v9/);
    });
  });

  test("should find a chip itself, ΔE00 below 0.01, when given the chip's own CIELAB", async () => {
    for (const chip of [file.chips[0]!, file.chips[1234]!, file.chips.at(-1)!]) {
      const answer = await match({ lab: chip.lab, k: 1 });
      assert.equal(answer.matches.length, 1);
      assert.equal(answer.matches[0]!.code, chip.code);
      assert.ok(answer.matches[0]!.deltaE00 < 0.01, `ΔE00 ${answer.matches[0]!.deltaE00}`);
      assert.equal(answer.matches[0]!.verdict, 'indistinguishable');
      assert.deepEqual(answer.matches[0]!.lab, chip.lab);
      assert.equal(answer.matches[0]!.parent, chip.parent);
      assert.equal(answer.between?.a, chip.code);
      assert.equal(answer.between?.t, 0, 'a chip itself lies at the start of its own segment');
    }
  });

  test('should give five matches by default, nearest first, each with the verdict of its band, against the current set', async () => {
    const answer = await match({ hex: '#7b3f6e' });
    assert.equal(answer.setId, 'v1');
    assert.equal(answer.matches.length, 5);
    for (let i = 1; i < answer.matches.length; i++) assert.ok(answer.matches[i - 1]!.deltaE00 <= answer.matches[i]!.deltaE00);
    for (const m of answer.matches) assert.equal(m.verdict, expectedVerdict(m.deltaE00), `${m.code} at ${m.deltaE00}`);
  });

  test('should describe the input in CIELAB, LCh and display hex, sRGB #7b3f6e being in gamut', async () => {
    const { input } = await match({ hex: '7B3F6E', k: 1 });
    assert.equal(input.hex, '#7b3f6e');
    assert.equal(input.inGamut, true);
    assert.equal(input.lab.length, 3);
    const [l, a, b] = input.lab;
    assert.ok(Math.abs(input.lch[1] - Math.hypot(a, b)) < 1e-9, 'C*ab = √(a*² + b*²) (CIE 15:2004 § 8.2.1)');
    assert.ok(Math.abs(input.lch[0] - l) < 1e-9);
    const h = (Math.atan2(b, a) * 180) / Math.PI;
    assert.ok(Math.abs(input.lch[2] - (h + 360) % 360) < 1e-9, 'h°ab = atan2(b*, a*)');
  });

  test('should mark a CIELAB colour outside sRGB and give a gamut-mapped stand-in hex', async () => {
    const { input } = await match({ lab: [50, 120, -120], k: 1 });
    assert.equal(input.inGamut, false);
    assert.match(input.hex, /^#[0-9a-f]{6}$/);
  });

  test('should give up to 50 matches and match an explicit set id', async () => {
    const answer = await match({ lab: [55, -30, 40], k: 50, setId: 'v1' });
    assert.equal(answer.matches.length, 50);
    assert.equal(new Set(answer.matches.map((m) => m.code)).size, 50);
  });

  test('should give the same nearest chips as a full scan of the file with culori (20 seeded sRGB colours)', async () => {
    const random = mulberry32(0x4d415443);
    for (let i = 0; i < 20; i++) {
      const hex = formatHex({ mode: 'rgb', r: random(), g: random(), b: random() });
      const answer = await match({ hex, k: 3 });
      const expected = bruteForceNearest(file.chips, answer.input.lab, 3);
      assert.deepEqual(answer.matches.map((m) => m.code), expected.map((e) => e.code), hex);
      answer.matches.forEach((m, j) => assert.ok(Math.abs(m.deltaE00 - expected[j]!.deltaE) < 1e-9, `${hex} ${m.code}`));
    }
  });

  test('should place the colour between its two nearest chips: a, b their codes and t its projection on the segment', async () => {
    const a = file.chips.find((c) => c.code === 'F-087.014')!;
    // A colour a little way from chip a, so its two nearest are a and one neighbour.
    const lab: [number, number, number] = [a.lab[0] + 0.4, a.lab[1] - 0.3, a.lab[2] + 0.2];
    const answer = await match({ lab, k: 2 });
    const between = answer.between!;
    assert.equal(between.a, answer.matches[0]!.code);
    assert.equal(between.b, answer.matches[1]!.code);
    const [p, q] = [answer.matches[0]!.lab, answer.matches[1]!.lab];
    const ab = [q[0] - p[0], q[1] - p[1], q[2] - p[2]];
    const ap = [lab[0] - p[0], lab[1] - p[1], lab[2] - p[2]];
    const t = (ab[0]! * ap[0]! + ab[1]! * ap[1]! + ab[2]! * ap[2]!) / (ab[0]! ** 2 + ab[1]! ** 2 + ab[2]! ** 2);
    assert.ok(Math.abs(between.t - Math.min(1, Math.max(0, t))) < 1e-12, `t ${between.t} vs ${t}`);
    assert.ok(between.t >= 0 && between.t <= 1);
  });

  test('should put the midpoint of two neighbouring chips half-way between them', async () => {
    const answer = await match({ lab: file.chips[1]!.lab, k: 2 });
    const [p, q] = [answer.matches[0]!.lab, answer.matches[1]!.lab];
    const mid: [number, number, number] = [(p[0] + q[0]) / 2, (p[1] + q[1]) / 2, (p[2] + q[2]) / 2];
    const atMid = await match({ lab: mid, k: 2 });
    // In set v1 no third chip is nearer this midpoint than the two ends, so the pair stays and t is ½.
    assert.deepEqual([atMid.between!.a, atMid.between!.b].sort(), [answer.matches[0]!.code, answer.matches[1]!.code].sort());
    assert.ok(Math.abs(atMid.between!.t - 0.5) < 1e-6, `t ${atMid.between!.t}`);
  });
});
