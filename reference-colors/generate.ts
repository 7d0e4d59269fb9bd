// Writes reference-colors/reference-set-v1.json, byte-identical on every run.
//   TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx reference-colors/generate.ts [--out FILE] [--report]
// --out writes elsewhere (the determinism test compares that file with the committed one);
// --report also prints chip counts, field-chip spacing and the tissue regions' coverage.
import { writeFileSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { parseArgs } from 'node:util';
import { createChipIndex } from '../shared/colour/chip-index.js';
import { labFromTuple } from '../shared/colour/lab.js';
import { buildReferenceSet, formatReferenceSet } from './build-set.js';
import { COVERAGE_SAMPLE, coverageOf, percentile } from './coverage.js';
import { sampleRegion, TISSUE_REGIONS } from '../shared/colour/tissue-regions.js';

const DEFAULT_OUT = fileURLToPath(new URL('./reference-set-v1.json', import.meta.url));

const { values } = parseArgs({ options: { out: { type: 'string' }, report: { type: 'boolean', default: false } } });
const started = performance.now();
const set = buildReferenceSet();
const out = values.out ?? DEFAULT_OUT;
writeFileSync(out, formatReferenceSet(set));
const seconds = (performance.now() - started) / 1000;
const field = set.chips.filter((c) => c.parent === null);
console.log(`${set.chips.length} chips (${field.length} field, ${set.chips.length - field.length} fine) in ${seconds.toFixed(1)} s`);

if (values.report) {
  const fieldIndex = createChipIndex(field.map((c) => labFromTuple(c.lab)));
  const spacing = field.map((c) => fieldIndex.nearest(labFromTuple(c.lab), 2)[1].deltaE).sort((x, y) => x - y);
  console.log(
    `field chips' nearest-neighbour ΔE00: min ${spacing[0].toFixed(2)}, median ${percentile(spacing, 0.5).toFixed(2)}, max ${spacing[spacing.length - 1].toFixed(2)}`,
  );
  const perParent = new Map<string, number>();
  for (const c of set.chips) if (c.parent) perParent.set(c.parent, (perParent.get(c.parent) ?? 0) + 1);
  console.log(`fine chips per field chip: ${Math.min(...perParent.values())} … ${Math.max(...perParent.values())}`);
  console.log(`out of sRGB gamut: ${set.chips.filter((c) => !c.inGamut).length} chips`);
  const index = createChipIndex(set.chips.map((c) => labFromTuple(c.lab)));
  TISSUE_REGIONS.forEach((region, i) => {
    const stats = coverageOf(index, region, sampleRegion(region, COVERAGE_SAMPLE.perRegion, COVERAGE_SAMPLE.seed + i));
    console.log(`${region.id}: ${stats.samples} samples, nearest-chip ΔE00 p50 ${stats.p50.toFixed(3)}, p99 ${stats.p99.toFixed(3)}, max ${stats.max.toFixed(3)}`);
  });
}
