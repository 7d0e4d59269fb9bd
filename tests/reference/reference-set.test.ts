import { test } from 'node:test';
import assert from 'node:assert/strict';
import { spawnSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createChipIndex } from '../../shared/colour/chip-index.js';
import { v1StoredName } from '../../reference-colors/v1-names.js';
import { ACCEPTABILITY_THRESHOLD_DE00 } from '../../shared/colour/constants.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { labFromTuple } from '../../shared/colour/lab.js';
import { createScan } from '../../shared/colour/nearest.js';
import { FIELD_CODE_PATTERN, FINE_CODE_PATTERN, type ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { coverageOf } from '../../reference-colors/coverage.js';
import { sampleRegion, TISSUE_REGIONS } from '../../shared/colour/tissue-regions.js';

// The committed reference set (reference-colors/README.md): determinism, shape and the coverage requirement —
// within sRGB, each tissue region within ΔE00 1.8 of a chip at the 99th percentile, 1.8 being the
// 50:50 % acceptability threshold of Paravina et al. (2015), J. Esthet. Restor. Dent. 27:S1–S9.

const root = path.resolve(fileURLToPath(new URL('../..', import.meta.url)));
const committedPath = path.join(root, 'reference-colors', 'reference-set-v1.json');
const committed = readFileSync(committedPath);
const set = JSON.parse(committed.toString('utf8')) as ReferenceSetFile;
const field = set.chips.filter((c) => c.parent === null);
const fine = set.chips.filter((c) => c.parent !== null);

/** Coverage sample for the test: our own seed and size, not the generator's. */
const TEST_SAMPLE = { perRegion: 25000, seed: 0x54455354 };

test('the generator writes the committed file byte for byte (run once in a child process)', () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-refset-'));
  try {
    const out = path.join(dir, 'reference-set-v1.json');
    const started = performance.now();
    const run = spawnSync(process.execPath, ['--import', 'tsx', 'reference-colors/generate.ts', '--out', out], {
      cwd: root,
      env: { ...process.env, TSX_TSCONFIG_PATH: 'server/tsconfig.json' },
      encoding: 'utf8',
    });
    assert.equal(run.status, 0, run.stderr);
    console.log(`generator: ${run.stdout.trim()} (child process ${((performance.now() - started) / 1000).toFixed(1)} s)`);
    const again = readFileSync(out);
    assert.equal(again.length, committed.length, 'lengths differ');
    assert.ok(again.equals(committed), 'the regenerated file differs from the committed one');
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
});

test('the file names its set, white and observer', () => {
  assert.equal(set.id, 'v1');
  assert.equal(set.version, 1);
  assert.equal(set.white, 'D65');
  assert.equal(set.observer, '2°');
  assert.equal(set.generatedBy, 'reference-colors/generate.ts');
  assert.match(set.name, /\S/);
  assert.deepEqual(Object.keys(set), ['id', 'version', 'name', 'white', 'observer', 'generatedBy', 'chips']);
});

test('chip counts: 120–200 field chips, 8,000–12,000 fine chips', () => {
  console.log(`${field.length} field chips, ${fine.length} fine chips`);
  assert.ok(field.length >= 120 && field.length <= 200, `${field.length} field chips`);
  assert.ok(fine.length >= 8000 && fine.length <= 12000, `${fine.length} fine chips`);
});

test('codes are unique and well formed; fine codes count up from .001 inside each parent', () => {
  const codes = new Set(set.chips.map((c) => c.code));
  assert.equal(codes.size, set.chips.length, 'a code is used twice');
  field.forEach((c, i) => {
    assert.match(c.code, FIELD_CODE_PATTERN);
    assert.equal(c.code, `F-${String(i + 1).padStart(3, '0')}`, 'field codes are not consecutive');
  });
  const next = new Map<string, number>();
  for (const c of fine) {
    assert.match(c.code, FINE_CODE_PATTERN);
    assert.ok(codes.has(c.parent!) && c.parent!.length === 5, `${c.code} has parent ${c.parent}`);
    assert.ok(c.code.startsWith(`${c.parent}.`), `${c.code} is not under ${c.parent}`);
    const n = (next.get(c.parent!) ?? 0) + 1;
    assert.equal(c.code, `${c.parent}.${String(n).padStart(3, '0')}`);
    next.set(c.parent!, n);
  }
  assert.deepEqual([...set.chips.map((c) => c.code)], [...set.chips.map((c) => c.code)].sort(), 'chips are not in code order');
});

test("every fine chip lies in its parent's cell: its nearest field chip by ΔE00 (full scan)", () => {
  const scan = createScan(field.map((c) => labFromTuple(c.lab)));
  const wrong = fine.filter((c) => field[scan(labFromTuple(c.lab), 1)[0].index].code !== c.parent);
  assert.deepEqual(wrong.map((c) => c.code).slice(0, 5), []);
});

test('each chip carries its own name, display hex and gamut flag; field chips print inside sRGB', () => {
  for (const c of set.chips) {
    assert.equal(c.lab.length, 3);
    assert.ok(c.lab.every((v) => Number.isFinite(v) && Math.round(v * 100) / 100 === v), `${c.code} lab ${c.lab}`);
    assert.ok(c.lab[0] >= 0 && c.lab[0] <= 100, `${c.code} L* ${c.lab[0]}`);
    const shown = displayHex(labFromTuple(c.lab));
    assert.equal(c.hex, shown.hex, `${c.code} hex`);
    assert.equal(c.inGamut, shown.inGamut, `${c.code} inGamut`);
    assert.equal(c.name, v1StoredName(labFromTuple(c.lab)), `${c.code} stored name`);
  }
  assert.ok(field.every((c) => c.inGamut), 'a field chip lies outside sRGB');
  assert.ok(fine.some((c) => !c.inGamut), 'expected some fine chips just outside sRGB at the gamut surface');
});

test('field chips: neighbours at least 8 and at most 12 ΔE00 apart', () => {
  const index = createChipIndex(field.map((c) => labFromTuple(c.lab)));
  const spacing = field.map((c) => index.nearest(labFromTuple(c.lab), 2)[1].deltaE);
  const min = Math.min(...spacing);
  const max = Math.max(...spacing);
  console.log(`field chips' nearest neighbour ΔE00: ${min.toFixed(2)} … ${max.toFixed(2)}`);
  assert.ok(min >= 8 && max <= 12, `spacing ${min} … ${max}`);
});

for (const [i, region] of TISSUE_REGIONS.entries()) {
  test(`coverage of ${region.label}: p99 of nearest-chip ΔE00 ≤ 1.8 within sRGB (Paravina et al. 2015)`, () => {
    const index = createChipIndex(set.chips.map((c) => labFromTuple(c.lab)));
    const samples = sampleRegion(region, TEST_SAMPLE.perRegion, TEST_SAMPLE.seed + i);
    const stats = coverageOf(index, region, samples);
    console.log(
      `${region.id} (L* ${region.l.join('–')}, C*ab ${region.c.join('–')}, h°ab ${region.h.join('→')}): ` +
        `${stats.samples} samples, p50 ${stats.p50.toFixed(3)}, p99 ${stats.p99.toFixed(3)}, max ${stats.max.toFixed(3)}`,
    );
    assert.ok(stats.p99 <= ACCEPTABILITY_THRESHOLD_DE00, `p99 ${stats.p99}`);
  });
}
