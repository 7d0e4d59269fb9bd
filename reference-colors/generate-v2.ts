// Writes reference-colors/reference-set-v2.json, byte-identical on every run.
//   TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx reference-colors/generate-v2.ts [--out FILE] [--report]
// --out writes elsewhere (the determinism test compares that file with the committed one);
// --report also prints chip counts, field-chip spacing and the coverage of the whole gamut and of
// each tissue region, on the generator's own samples (the test draws others).
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { createChipIndex } from '../shared/colour/chip-index.js';
import { labFromTuple } from '../shared/colour/lab.js';
import { formatReferenceSet } from './build-set.js';
import { buildReferenceSetV2 } from './build-set-v2.js';
import { coverageOfSample, percentile, sampleGamut } from './coverage.js';
import { sampleRegion, TISSUE_REGIONS_V2 } from '../shared/colour/tissue-regions.js';

const DEFAULT_OUT = fileURLToPath(new URL('./reference-set-v2.json', import.meta.url));

/** The generator's report samples (our own sizes and seeds; the test uses other seeds). */
const REPORT_SAMPLE = { gamut: 200000, perRegion: 20000, seed: 0x52455032 } as const;

const { values } = parseArgs({ options: { out: { type: 'string' }, report: { type: 'boolean', default: false } } });
const started = performance.now();
const set = buildReferenceSetV2();
writeFileSync(values.out ?? DEFAULT_OUT, formatReferenceSet(set));
const field = set.chips.filter((c) => c.parent === null);
console.log(`${set.chips.length} chips (${field.length} field, ${set.chips.length - field.length} fine) in ${((performance.now() - started) / 1000).toFixed(1)} s`);

if (values.report) {
  const fieldIndex = createChipIndex(field.map((c) => labFromTuple(c.lab)));
  const spacing = field.map((c) => fieldIndex.nearest(labFromTuple(c.lab), 2)[1].deltaE).sort((x, y) => x - y);
  console.log(`field codes ${field[0].code} … ${field[field.length - 1].code}`);
  console.log(`field chips' nearest-neighour ΔE00: min ${spacing[0].toFixed(2)}, median ${percentile(spacing, 0.5).toFixed(2)}, max ${spacing[spacing.length - 1].toFixed(2)}`);
  const perParent = new Map<string, number>();
  for (const c of set.chips) if (c.parent) perParent.set(c.parent, (perParent.get(c.parent) ?? 0) + 1);
  const counts = [...perParent.values()].sort((x, y) => x - y);
  console.log(`fine chips per field chip: ${counts[0]} … ${counts[counts.length - 1]} (median ${percentile(counts, 0.5)})`);
  console.log(`out of sRGB gamut: ${set.chips.filter((c) => !c.inGamut).length} chips`);
  const index = createChipIndex(set.chips.map((c) => labFromTuple(c.lab)));
  const show = (s: { regionId: string; samples: number; p50: number; p99: number; max: number }) =>
    console.log(`${s.regionId}: ${s.samples} samples, nearest-chip ΔE00 p50 ${s.p50.toFixed(3)}, p99 ${s.p99.toFixed(3)}, max ${s.max.toFixed(3)}`);
  show(coverageOfSample(index, 'whole sRGB gamut', sampleGamut(REPORT_SAMPLE.gamut, REPORT_SAMPLE.seed)));
  TISSUE_REGIONS_V2.forEach((region, i) => show(coverageOfSample(index, region.id, sampleRegion(region, REPORT_SAMPLE.perRegion, REPORT_SAMPLE.seed + 1 + i))));
}
