import { test } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import { createHash } from 'node:crypto';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import Color from 'colorjs.io';
import { createChipIndex } from '../../shared/colour/chip-index.js';
import { chipName, pickerOrder } from '../../shared/colour/chip-name.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { createScan } from '../../shared/colour/nearest.js';
import { FIELD_CODE_PATTERN, FINE_CODE_PATTERN, type ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { coverageOfSample, sampleGamut } from '../../reference-colors/coverage.js';
import { sampleRegion } from '../../shared/colour/tissue-regions.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';
import { TISSUE_REGIONS_V2 } from '../../shared/colour/tissue-regions.js';

// Set v2 (reference-colors/README.md): determinism, codes that never reuse v1's, names of our own,
// and coverage on samples the generator never saw — whole sRGB gamut p99 ≤ 1.5 and max ≤ 1.8,
// each widened tissue region p99 ≤ 1.2 (ΔE00; 1.8 is the 50:50 % acceptability threshold of
// Paravina et al. 2015, J. Esthet. Restor. Dent. 27:S1–S9; 1.5 and 1.2 are our own aims).

const root = path.resolve(fileURLToPath(new URL('../..', import.meta.url)));
const committed = readFileSync(path.join(root, 'reference-colors', 'reference-set-v2.json'));
const set = JSON.parse(committed.toString('utf8')) as ReferenceSetFile;
const v1Bytes = readFileSync(path.join(root, 'reference-colors', 'reference-set-v1.json'));
const v1 = JSON.parse(v1Bytes.toString('utf8')) as ReferenceSetFile;
const field = set.chips.filter((c) => c.parent === null);
const fine = set.chips.filter((c) => c.parent !== null);
const byCode = new Map(set.chips.map((c) => [c.code, c]));

/** Test samples: our own seeds, none of them the generator's (0x52455032 and the next five). */
const TEST_SAMPLE = { gamut: 4000, perRegion: 1500, seed: 0x76325445 };

/** SHA-256 of reference-set-v1.json as published: v2's arrival must leave it byte for byte. */
const V1_SHA256 = 'a045c2953843669e153c2f97aa931602a110765097ca6f3262c0c5fe1cdf1325';

const OLD_WORDS = /very pale|greyish|moderate|strong|vivid|deep|yellow-orange|yellow-green|blue-green|red-purple/i;

test('the v2 generator writes the committed file byte for byte (run once in a child process)', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-refset-v2-'));
  try {
    const out = path.join(dir, 'reference-set-v2.json');
    const started = performance.now();
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'reference-colors/generate-v2.ts', '--out', out], {
      cwd: root,
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' },
      encoding: 'utf8',
    });
    assert.equal(run.status, 0, run.stderr);
    console.log(`v2 generator: ${run.stdout.trim()} (child process ${((performance.now() - started) / 1000).toFixed(1)} s)`);
    const again = readFileSync(out);
    assert.equal(again.length, committed.length, 'lengths differ');
    assert.ok(again.equals(committed), 'the regenerated file differs from the committed one');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
});

test('the v1 file is still the one published', () => {
  assert.equal(createHash('sha256').update(v1Bytes).digest('hex'), V1_SHA256);
});

test('the file names set v2, its white and observer', () => {
  assert.deepEqual(Object.keys(set), ['id', 'version', 'name', 'white', 'observer', 'generatedBy', 'chips']);
  assert.equal(set.id, 'v2');
  assert.equal(set.version, 2);
  assert.equal(set.white, 'D65');
  assert.equal(set.observer, '2°');
  assert.equal(set.generatedBy, 'reference-colors/generate-v2.ts');
});

test('no v2 code is a v1 code; field numbers follow on from v1’s last and count up; fine codes count from .001', () => {
  const v1Codes = new Set(v1.chips.map((c) => c.code));
  assert.deepEqual(set.chips.filter((c) => v1Codes.has(c.code)).map((c) => c.code).slice(0, 5), []);
  const lastV1 = Math.max(...v1.chips.filter((c) => c.parent === null).map((c) => Number(c.code.slice(2))));
  field.forEach((c, i) => assert.equal(c.code, `F-${String(lastV1 + 1 + i).padStart(3, '0')}`));
  assert.equal(new Set(set.chips.map((c) => c.code)).size, set.chips.length, 'a code is used twice');
  const next = new Map<string, number>();
  for (const c of fine) {
    assert.match(c.code, FINE_CODE_PATTERN);
    assert.ok(FIELD_CODE_PATTERN.test(c.parent!) && byCode.get(c.parent!)?.parent === null, `${c.code} has parent ${c.parent}`);
    const n = (next.get(c.parent!) ?? 0) + 1;
    assert.equal(c.code, `${c.parent}.${String(n).padStart(3, '0')}`);
    next.set(c.parent!, n);
  }
  console.log(`${field.length} field chips (${field[0]!.code} … ${field.at(-1)!.code}), ${fine.length} fine chips`);
});

test("fine chips lie in their parent's cell (full scan of the field chips, 3,000 seeded fine chips)", () => {
  const scan = createScan(field.map((c) => labFromTuple(c.lab)));
  const random = mulberry32(0x70617265);
  const picked = Array.from({ length: 3000 }, () => fine[Math.floor(random() * fine.length)]!);
  const wrong = picked.filter((c) => field[scan(labFromTuple(c.lab), 1)[0]!.index]!.code !== c.parent);
  assert.deepEqual(wrong.map((c) => c.code).slice(0, 5), []);
});

test('within each field chip, fine chips run by sector, then light to dark, then strongest to greyest', () => {
  let previous: (typeof fine)[number] | undefined;
  for (const c of fine) {
    if (previous?.parent === c.parent) assert.ok(pickerOrder(previous.lab, c.lab) < 0, `${previous.code} before ${c.code}`);
    previous = c;
  }
});

test('names are our own words, derived from CIELAB, and a fine chip is never named like its parent', () => {
  for (const c of set.chips) {
    const parent = c.parent === null ? null : labFromTuple(byCode.get(c.parent)!.lab);
    assert.equal(c.name, chipName(labFromTuple(c.lab), parent), `${c.code} name`);
    assert.doesNotMatch(c.name, OLD_WORDS, `${c.code}`);
    if (c.parent !== null) assert.notEqual(c.name, byCode.get(c.parent)!.name, `${c.code} is named like ${c.parent}`);
    const shown = displayHex(labFromTuple(c.lab));
    assert.equal(c.hex, shown.hex, `${c.code} hex`);
    assert.equal(c.inGamut, shown.inGamut, `${c.code} inGamut`);
  }
  assert.ok(field.every((c) => c.inGamut), 'a field chip lies outside sRGB');
});

const index = createChipIndex(set.chips.map((c) => labFromTuple(c.lab)));

test('whole sRGB gamut: nearest-chip ΔE00 p99 ≤ 1.5 and max ≤ 1.8 on a sample the generator never saw', () => {
  const stats = coverageOfSample(index, 'gamut', sampleGamut(TEST_SAMPLE.gamut, TEST_SAMPLE.seed));
  console.log(`whole gamut: ${stats.samples} samples, p50 ${stats.p50.toFixed(3)}, p99 ${stats.p99.toFixed(3)}, max ${stats.max.toFixed(3)}`);
  assert.ok(stats.p99 <= 1.5, `p99 ${stats.p99}`);
  assert.ok(stats.max <= 1.8, `max ${stats.max}`);
});

for (const [i, region] of TISSUE_REGIONS_V2.entries()) {
  test(`${region.label} (L* ${region.l.join('–')}, C*ab ${region.c.join('–')}, h°ab ${region.h.join('→')}): p99 ≤ 1.2`, () => {
    const stats = coverageOfSample(index, region.id, sampleRegion(region, TEST_SAMPLE.perRegion, TEST_SAMPLE.seed + 1 + i));
    console.log(`${region.id}: ${stats.samples} samples, p50 ${stats.p50.toFixed(3)}, p99 ${stats.p99.toFixed(3)}, max ${stats.max.toFixed(3)}`);
    assert.ok(stats.p99 <= 1.2, `p99 ${stats.p99}`);
  });
}

test('colorjs.io agrees on the coverage: its sRGB gamut test and deltaE2000 on the same D65 numbers', () => {
  // colorjs.io 0.7.1: `lab-d65` is CIELAB with our white; deltaE2000 reads L*, a*, b* as numbers.
  const samples = sampleGamut(500, TEST_SAMPLE.seed + 99);
  let worst = 0;
  for (const lab of samples) {
    assert.ok(new Color('lab-d65', [lab.l, lab.a, lab.b]).inGamut('srgb', { epsilon: 1e-6 }), `${lab.l} ${lab.a} ${lab.b} out of sRGB`);
    const near = index.nearest(lab, 1)[0]!;
    const chip = set.chips[near.index]!;
    const theirs = new Color('lab', [lab.l, lab.a, lab.b]).deltaE2000(new Color('lab', chip.lab));
    worst = Math.max(worst, Math.abs(theirs - near.deltaE));
    assert.ok(theirs <= 1.8, `colorjs.io ΔE00 ${theirs} to ${chip.code}`);
  }
  assert.ok(worst < 1e-9, `largest difference ${worst}`);
});
