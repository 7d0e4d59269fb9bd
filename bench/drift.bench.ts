// The drift analysis (issue 6) over 100,000 seeded readings against a bare better-sqlite3 GROUP BY
// of the same rows (counts and CIELAB means per accession, character, season and season-year), in
// the same run, with a breakdown of where the analysis spends its time. Asserts nothing.
//   npm run bench drift   (or: TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx bench/drift.bench.ts [readings])
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { seasonOf } from '../shared/collection/season-of.js';
import { displayHex } from '../shared/colour/display-hex.js';
import type { Lab } from '../shared/colour/lab.js';
import { analyseDrift } from '../server/analysis/drift.js';
import { driftAnswer, driftRows } from '../server/analysis/drift-query.js';
import { DriftOverview } from '../server/analysis/drift-overview.js';
import { DriftPool } from '../server/analysis/drift-pool.js';
import { meanLab, spreadDeltaE00 } from '../server/analysis/lab-stats.js';
import { User } from '../server/auth/user.entity.js';
import { Accession } from '../server/collection/accession.entity.js';
import { Character } from '../server/collection/character.entity.js';
import { seedCharacterCatalogue } from '../server/collection/seed-catalogue.js';
import { Season, Site } from '../server/collection/site.entity.js';
import { openDatabase } from '../server/data-source.js';
import { DEMO_SITES } from '../server/demo/demo-scenario.js';
import { mulberry32 } from '../shared/random/mulberry32.js';
import { benchSize, reportRatio } from './ratio.js';

const READINGS = benchSize(100_000, 400);
const ACCESSIONS = 25;
const CHARACTERS = 8;
/** Three years of readings, so every pair has same-season comparisons a year apart. */
const FROM = Date.parse('2023-01-01T00:00:00Z');
const TO = Date.parse('2026-01-01T00:00:00Z');

const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-drift-bench-'));
const file = path.join(dir, 'bench.sqlite');
const ds = await openDatabase(file);

/** TypeORM's own better-sqlite3 connection, for bulk inserts outside its layer. */
function db(): Database.Database {
  return (ds.driver as unknown as { databaseConnection: Database.Database }).databaseConnection;
}

interface Pair {
  accessionId: number;
  characterId: number;
}

/** Sites with their schemes, accessions, characters, one observer; then the readings in one transaction. */
async function seed(ds: DataSource): Promise<Pair[]> {
  await seedCharacterCatalogue(ds);
  const observer = await ds.getRepository(User).save({ email: 'bench@bench.invalid', name: 'Bench Observer', role: 'recorder', passwordHash: 'x', active: true, lastLoginAt: null });
  const sites: { site: Site; seasons: Season[] }[] = [];
  for (const s of DEMO_SITES) {
    const site = await ds.getRepository(Site).save({ code: s.code, name: s.name, timezone: s.timezone, latitude: null, longitude: null, elevationM: null });
    const seasons = await ds.getRepository(Season).save(s.seasons.map((x) => ({ ...x, site })));
    sites.push({ site, seasons });
  }
  const accessions: Accession[] = [];
  for (let i = 0; i < ACCESSIONS; i++) {
    accessions.push(await ds.getRepository(Accession).save({ accessionNumber: `BN-${i}`, name: `Bench ${i}`, otherNames: [], site: sites[i % sites.length]!.site }));
  }
  const characters = (await ds.getRepository(Character).find({ order: { sortOrder: 'ASC' }, take: CHARACTERS })).map((c) => c.id);
  const pairs: Pair[] = accessions.flatMap((a) => characters.map((characterId) => ({ accessionId: a.id, characterId })));

  const random = mulberry32(0x44524654);
  const insert = db().prepare(
    `INSERT INTO "reading" ("accessionId", "characterId", "siteId", "observerId", "observedAt", "method", "l", "a", "b", "hex", "inGamut", "setId", "bestChipCode", "bestChipName", "bestChipHex", "deltaE00", "light", "season", "seasonYear", "status")
     VALUES (?, ?, ?, ?, ?, 'instrument', ?, ?, ?, ?, ?, 'v1', 'F-001', 'bench chip', '#808080', 1.0, 'open-shade', ?, ?, 'submitted')`,
  );
  // Every pair: a base colour; a third of the pairs also shift with the season (real drift), the rest hold steady.
  const base = pairs.map((_, i) => ({ l: 30 + random() * 40, a: -30 + random() * 60, b: -20 + random() * 60, drifts: i % 3 === 0 }));
  db().transaction(() => {
    for (let n = 0; n < READINGS; n++) {
      const p = n % pairs.length;
      const pair = pairs[p]!;
      // Each accession is read where it grows (its home site), so its season groups follow one scheme.
      const { site, seasons } = sites[(pair.accessionId - 1) % sites.length]!;
      const at = new Date(FROM + random() * (TO - FROM));
      const s = seasonOf(at, site.timezone, seasons);
      const shift = base[p]!.drifts && s.season ? (seasons.findIndex((x) => x.name === s.season) * 2.5) : 0;
      const lab: Lab = { l: base[p]!.l + shift + (random() - 0.5) * 3, a: base[p]!.a + (random() - 0.5) * 3, b: base[p]!.b - shift + (random() - 0.5) * 3 };
      const shown = displayHex(lab);
      insert.run(pair.accessionId, pair.characterId, site.id, observer.id, at.toISOString().replace('T', ' ').replace('Z', ''), lab.l, lab.a, lab.b, shown.hex, shown.inGamut ? 1 : 0, s.season, s.seasonYear);
    }
  })();
  return pairs;
}

async function time<T>(run: () => Promise<T> | T): Promise<{ ms: number; value: T }> {
  const started = performance.now();
  const value = await run();
  return { ms: performance.now() - started, value };
}

const seeded = await time(() => seed(ds));
const pairs = seeded.value;
console.log(`${READINGS} readings, ${pairs.length} accession × character pairs, seeded in ${(seeded.ms / 1000).toFixed(1)} s`);

// A bare better-sqlite3 connection of its own for the floor, so nothing of TypeORM sits in its path.
const bare = new Database(file, { readonly: true });
const groupBy = bare.prepare(
  `SELECT "accessionId", "characterId", "season", "seasonYear", COUNT(*) AS n, AVG("l") AS l, AVG("a") AS a, AVG("b") AS b
   FROM "reading" WHERE "supersededById" IS NULL
   GROUP BY "accessionId", "characterId", "season", "seasonYear"`,
);

// Warm both paths up (JIT, page cache) on a few pairs before timing.
for (const p of pairs.slice(0, 5)) await driftAnswer(ds, p);
groupBy.all();

// The floor is short and the machine shared, so it is the median of several runs.
const floorRuns: number[] = [];
for (let i = 0; i < 9; i++) floorRuns.push((await time(() => groupBy.all())).ms);
const floor = { ms: floorRuns.sort((x, y) => x - y)[4]! };
const full = await time(async () => {
  let comparisons = 0;
  let drifting = 0;
  let permutations = 0;
  for (const p of pairs) {
    const answer = await driftAnswer(ds, p);
    comparisons += answer.comparisons.length;
    drifting += answer.comparisons.filter((c) => c.drift).length;
    permutations += answer.comparisons.reduce((s, c) => s + c.permutations, 0);
  }
  return { comparisons, drifting, permutations };
});

// The overview of the whole collection (issue 14): cold in this thread, cold with worker threads,
// asked again with nothing changed, and after one new reading (only that pair is analysed again).
const single = new DriftOverview(ds, null);
const coldSingle = await time(() => single.answer());
const pool = new DriftPool();
const pooled = new DriftOverview(ds, pool);
await pooled.answer(); // starts the workers (module loading), then forget what it computed
pooled.clear();
const coldPooled = await time(() => pooled.answer());
const warm = await time(() => pooled.answer());
const lastPair = pairs[0]!;
const row = db().prepare('SELECT * FROM "reading" WHERE "accessionId" = ? AND "characterId" = ? ORDER BY "id" DESC LIMIT 1').get(lastPair.accessionId, lastPair.characterId) as Record<string, unknown>;
delete row['id'];
const columns = Object.keys(row);
db().prepare(`INSERT INTO "reading" (${columns.map((c) => `"${c}"`).join(', ')}) VALUES (${columns.map(() => '?').join(', ')})`).run(...columns.map((c) => row[c]));
const oneNew = await time(() => pooled.answer());
await pool.close();
const agree = JSON.stringify(coldSingle.value.items.map((i) => [i.accessionId, i.characterId, i.flags.length])) === JSON.stringify(coldPooled.value.items.map((i) => [i.accessionId, i.characterId, i.flags.length]));

// Breakdown: the SQL fetch alone; then group means and spreads alone; then the whole analysis over fetched rows.
const fetched = await time(async () => {
  const all = [];
  for (const p of pairs) all.push(await driftRows(ds, p.accessionId, p.characterId));
  return all;
});
const inputs = fetched.value.map((rows) => rows.map((r) => ({ lab: { l: r.l, a: r.a, b: r.b }, season: r.season, seasonYear: r.seasonYear, observedAt: new Date(r.observedAt) })));
const stats = await time(() => {
  for (const rows of inputs) {
    const groups = new Map<string, Lab[]>();
    for (const r of rows) {
      if (r.season === null) continue;
      const key = `${r.seasonYear}/${r.season}`;
      const g = groups.get(key) ?? [];
      g.push(r.lab);
      groups.set(key, g);
    }
    for (const labs of groups.values()) spreadDeltaE00(labs, meanLab(labs));
  }
});
const analysis = await time(() => {
  for (const rows of inputs) analyseDrift(rows);
});

const ms = (x: number) => `${x.toFixed(0)} ms`;
console.log(`${full.value.comparisons} comparisons (${full.value.drifting} flagged as drift), ${full.value.permutations.toLocaleString('en')} permutations in all`);
console.log('| step | time | × floor |');
console.log('|---|---|---|');
console.log(`| floor: bare better-sqlite3 GROUP BY (count, mean L*a*b*), median of 9 | ${ms(floor.ms)} | 1.0× |`);
console.log(`| drift analysis of every pair (driftAnswer: lookups, SQL, groups, spreads, permutation tests, answer) | ${ms(full.ms)} | ${(full.ms / floor.ms).toFixed(1)}× |`);
reportRatio(`drift analysis, ${READINGS} readings, every pair through driftAnswer in turn (before issue 14: 212×)`, full.ms / floor.ms, 'a bare better-sqlite3 GROUP BY', '< 10×');
console.log(`| drift overview, cold, this thread (${coldSingle.value.pairs} pairs, ${coldSingle.value.items.length} flagged) | ${ms(coldSingle.ms)} | ${(coldSingle.ms / floor.ms).toFixed(1)}× |`);
console.log(`| drift overview, cold, worker threads (${coldPooled.value.recomputed} pairs analysed; same flags as this thread: ${agree ? 'yes' : 'NO'}) | ${ms(coldPooled.ms)} | ${(coldPooled.ms / floor.ms).toFixed(1)}× |`);
console.log(`| drift overview, asked again, nothing changed (${warm.value.recomputed} pairs analysed) | ${ms(warm.ms)} | ${(warm.ms / floor.ms).toFixed(1)}× |`);
console.log(`| drift overview after one new reading (${oneNew.value.recomputed} pair analysed again) | ${ms(oneNew.ms)} | ${(oneNew.ms / floor.ms).toFixed(1)}× |`);
reportRatio(`drift overview, ${READINGS} readings, cold, this thread`, coldSingle.ms / floor.ms, 'a bare better-sqlite3 GROUP BY', '< 10×');
reportRatio(`drift overview, ${READINGS} readings, cold, worker threads`, coldPooled.ms / floor.ms, 'a bare better-sqlite3 GROUP BY', '< 10×');
reportRatio(`drift overview, ${READINGS} readings, after one new reading`, oneNew.ms / floor.ms, 'a bare better-sqlite3 GROUP BY', '< 10×');
console.log(`| one drift answer, mean over the pairs (${(READINGS / pairs.length).toFixed(0)} readings each) | ${(full.ms / pairs.length).toFixed(1)} ms | |`);
console.log(`| … of which the readings query alone (driftRows, every pair) | ${ms(fetched.ms)} | ${(fetched.ms / floor.ms).toFixed(1)}× |`);
console.log(`| … of which group means and spreads alone | ${ms(stats.ms)} | ${(stats.ms / floor.ms).toFixed(1)}× |`);
console.log(`| … of which analyseDrift alone (groups, spreads, permutation tests) | ${ms(analysis.ms)} | ${(analysis.ms / floor.ms).toFixed(1)}× |`);

bare.close();
await ds.destroy();
rmSync(dir, { recursive: true, force: true });
