// Sampling a region of a stored 12-megapixel photo against a bare full decode of the same JPEG
// with sharp, in the same run. Prints a table of medians and ratios; asserts nothing.
//   npm run bench photo   (or: TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx bench/photo.bench.ts [runs])
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import sharp from 'sharp';
import type { SampleBody } from '../shared/api/photos.js';
import { User } from '../server/auth/user.entity.js';
import { openDatabase } from '../server/data-source.js';
import { PhotoFiles } from '../server/photos/photo-files.js';
import { samplePhoto, storePhoto } from '../server/photos/photos.js';
import { loadReferenceSets } from '../server/reference-sets/load-reference-sets.js';
import { ReferenceSets } from '../server/reference-sets/reference-sets.js';
import { mulberry32 } from '../shared/random/mulberry32.js';
import { benchSize, reportRatio, SMOKE } from './ratio.js';

const RUNS = benchSize(9, 1);
const WIDTH = SMOKE ? 800 : 4000;
const HEIGHT = SMOKE ? 600 : 3000;
/** Region coordinates are written for 4000 × 3000 and scaled to the photo of this run. */
const at = (n: number) => Math.round((n * WIDTH) / 4000);

// Neither path may be answered from libvips' operation cache.
sharp.cache(false);

/** A 12 MP scene with smooth gradients and seeded noise, so the JPEG is as hard to decode as a photo. */
async function twelveMegapixelJpeg(): Promise<Buffer> {
  const random = mulberry32(0x50484f54);
  const px = Buffer.alloc(WIDTH * HEIGHT * 3);
  for (let y = 0; y < HEIGHT; y++) {
    for (let x = 0; x < WIDTH; x++) {
      const i = (y * WIDTH + x) * 3;
      px[i] = Math.min(255, (60 + (x * 120) / WIDTH + random() * 24) | 0);
      px[i + 1] = Math.min(255, (50 + (y * 110) / HEIGHT + random() * 24) | 0);
      px[i + 2] = Math.min(255, (70 + ((x + y) % 400) / 8 + random() * 24) | 0);
    }
  }
  return sharp(px, { raw: { width: WIDTH, height: HEIGHT, channels: 3 } }).jpeg({ quality: 92 }).toBuffer();
}

async function median(run: () => Promise<unknown>): Promise<number> {
  await run();
  const times: number[] = [];
  for (let i = 0; i < RUNS; i++) {
    const started = performance.now();
    await run();
    times.push(performance.now() - started);
  }
  return times.sort((a, b) => a - b)[Math.floor(times.length / 2)]!;
}

const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-bench-'));
try {
  const ds = await openDatabase(path.join(dir, 'hueledger.sqlite'));
  await loadReferenceSets(ds, { log: () => {} });
  const sets = new ReferenceSets(ds);
  const user = await ds.getRepository(User).save({ email: 'bench@test.example', name: 'Bench', role: 'recorder', passwordHash: 'x', active: true, lastLoginAt: null });
  const files = new PhotoFiles(path.join(dir, 'photos'));
  const jpeg = await twelveMegapixelJpeg();

  let started = performance.now();
  const { photo } = await storePhoto(ds, files, { id: user.id, email: user.email, ip: null }, jpeg);
  const uploadMs = performance.now() - started;
  const match = (lab: Parameters<ReferenceSets['match']>[0], k: number) => sets.match(lab, k);
  await match({ l: 50, a: 0, b: 0 }, 5); // build the chip index outside the timings

  const decodeMs = await median(() => sharp(jpeg).raw().toBuffer());
  const cases: [string, SampleBody][] = [
    ['rect 300 × 300', { region: { shape: 'rect', x: at(1800), y: at(1300), width: at(300), height: at(300) } }],
    ['ellipse 800 × 500', { region: { shape: 'ellipse', cx: at(2000), cy: at(1500), rx: at(400), ry: at(250) } }],
    ['rect 300 × 300 + neutral card', { region: { shape: 'rect', x: at(1800), y: at(1300), width: at(300), height: at(300) }, neutral: { region: { shape: 'rect', x: at(200), y: at(200), width: at(200), height: at(200) } } }],
    ['polygon over 2000 × 1500', { region: { shape: 'polygon', points: [[at(1000), at(750)], [at(3000), at(750)], [at(3000), at(2250)], [at(1000), at(2250)]] } }],
    ['the whole photo', { region: { shape: 'rect', x: 0, y: 0, width: WIDTH, height: HEIGHT } }],
  ];

  console.log(`12 MP JPEG (${(jpeg.length / 1e6).toFixed(1)} MB, ${WIDTH} × ${HEIGHT}), median of ${RUNS} runs; upload and normalisation once: ${uploadMs.toFixed(0)} ms`);
  console.log('| what | time | ratio to a full decode |');
  console.log('|---|---|---|');
  console.log(`| sharp full decode of the JPEG (floor) | ${decodeMs.toFixed(1)} ms | 1.00× |`);
  for (const [what, body] of cases) {
    const ms = await median(() => samplePhoto(ds, files, match, photo.id, body));
    console.log(`| sample: ${what} | ${ms.toFixed(1)} ms | ${(ms / decodeMs).toFixed(2)}× |`);
    reportRatio(`photo sample: ${what}`, ms / decodeMs, 'a bare sharp decode of the photo');
  }
  await ds.destroy();
} finally {
  rmSync(dir, { recursive: true, force: true });
}
