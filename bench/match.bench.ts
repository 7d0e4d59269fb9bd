// Chip index vs full scan, top-5 per query, over seeded queries. Prints a table; asserts nothing.
//   TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx bench/match.bench.ts [queries]
import { readFileSync } from 'node:fs';
import { converter } from 'culori';
import { createChipIndex, type SearchStats } from '../shared/colour/chip-index.js';
import { fromCulori, labFromTuple, type Lab } from '../shared/colour/lab.js';
import { createScan } from '../shared/colour/nearest.js';
import type { ReferenceSetFile } from '../shared/colour/reference-set.js';
import { mulberry32 } from '../shared/random/mulberry32.js';
import { sampleRegion, TISSUE_REGIONS } from '../shared/colour/tissue-regions.js';
import { benchSize, reportRatio } from './ratio.js';

const K = 5;
const QUERIES = benchSize(2000, 20);
const set = JSON.parse(readFileSync(new URL('../reference-colors/reference-set-v1.json', import.meta.url), 'utf8')) as ReferenceSetFile;
const toLab65 = converter('lab65');

function randomSrgb(count: number, seed: number): Lab[] {
  const random = mulberry32(seed);
  return Array.from({ length: count }, () => fromCulori(toLab65({ mode: 'rgb', r: random(), g: random(), b: random() })));
}

function time(run: () => void): number {
  const started = performance.now();
  run();
  return performance.now() - started;
}

const chipSets: [string, Lab[]][] = [
  [`whole set (${set.chips.length})`, set.chips.map((c) => labFromTuple(c.lab))],
  [`field chips (${set.chips.filter((c) => !c.parent).length})`, set.chips.filter((c) => !c.parent).map((c) => labFromTuple(c.lab))],
];
const querySets: [string, Lab[]][] = [
  ['random sRGB', randomSrgb(QUERIES, 0x42454e43)],
  ['tissue regions', TISSUE_REGIONS.flatMap((r, i) => sampleRegion(r, Math.ceil(QUERIES / TISSUE_REGIONS.length), 0x54495353 + i))],
];

console.log(`top-${K}, ${QUERIES} queries per row, times per query`);
console.log('| chips | queries | full scan | index | speed-up | ΔE00 computed (index) | cells opened |');
console.log('|---|---|---|---|---|---|---|');
for (const [chipName, labs] of chipSets) {
  const index = createChipIndex(labs);
  const scan = createScan(labs);
  for (const [queryName, qs] of querySets) {
    // Warm both paths up before timing.
    qs.slice(0, 100).forEach((q) => (scan(q, K), index.nearest(q, K)));
    const stats: SearchStats = { cellsOpened: 0, differencesComputed: 0 };
    const scanMs = time(() => qs.forEach((q) => scan(q, K)));
    const indexMs = time(() => qs.forEach((q) => index.nearest(q, K, stats)));
    const us = (ms: number) => `${((ms * 1000) / qs.length).toFixed(1)} µs`;
    console.log(
      `| ${chipName} | ${queryName} | ${us(scanMs)} | ${us(indexMs)} | ${(scanMs / indexMs).toFixed(1)}× | ` +
        `${(stats.differencesComputed / qs.length).toFixed(0)} | ${(stats.cellsOpened / qs.length).toFixed(0)} |`,
    );
    reportRatio(`match, index vs scan: ${chipName}, ${queryName}`, indexMs / scanMs, 'a full scan of the same chips');
  }
}
