// BrAPI observations over 100,000 seeded readings (400,000 observations: L*, a*, b*, chip each)
// against a bare better-sqlite3 read of the same reading rows a page serves, in the same run.
// A client pulls the whole collection page by page, so the first, a middle and the last page are
// timed, and one accession's page. Asserts nothing.
//   npm run bench brapi   (or: TSX_TSCONFIG_PATH=server/tsconfig.json node --import tsx bench/brapi.bench.ts [readings])
import Database from 'better-sqlite3';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { User } from '../server/auth/user.entity.js';
import { Accession } from '../server/collection/accession.entity.js';
import { Character } from '../server/collection/character.entity.js';
import { seedCharacterCatalogue } from '../server/collection/seed-catalogue.js';
import { Site } from '../server/collection/site.entity.js';
import { openDatabase } from '../server/data-source.js';
import { findObservations } from '../server/brapi/brapi-observations.js';
import { benchSize, reportRatio } from './ratio.js';

const READINGS = benchSize(100_000, 400);
const ACCESSIONS = 25;
/** A BrAPI client's usual page: the specification's default size. */
const PAGE_SIZE = 1000;
const FROM = Date.parse('2023-01-01T00:00:00Z');
const TO = Date.parse('2026-01-01T00:00:00Z');

const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-brapi-bench-'));
const file = path.join(dir, 'bench.sqlite');
const ds = await openDatabase(file);
const db = (ds.driver as unknown as { databaseConnection: Database.Database }).databaseConnection;

await seedCharacterCatalogue(ds);
const observer = await ds.getRepository(User).save({ email: 'bench@bench.invalid', name: 'Bench Observer', role: 'recorder', passwordHash: 'x', active: true, lastLoginAt: null });
const site = await ds.getRepository(Site).save({ code: 'BNS', name: 'Bench Plot', timezone: 'Pacific/Fiji', latitude: null, longitude: null, elevationM: null });
const accessions: Accession[] = [];
for (let i = 0; i < ACCESSIONS; i++) accessions.push(await ds.getRepository(Accession).save({ accessionNumber: `BN-${i}`, name: `Bench ${i}`, otherNames: [], site }));
const characters = (await ds.getRepository(Character).find({ where: { colour: true }, order: { sortOrder: 'ASC' }, take: 8 })).map((c) => c.id);
const insert = db.prepare(
  `INSERT INTO "reading" ("accessionId", "characterId", "siteId", "observerId", "observedAt", "method", "l", "a", "b", "hex", "inGamut", "setId", "bestChipCode", "bestChipName", "bestChipHex", "deltaE00", "light", "season", "seasonYear", "status")
   VALUES (?, ?, ?, ?, ?, 'instrument', ?, ?, ?, '#808080', 1, 'v1', 'F-001', 'bench chip', '#808080', 1.0, 'open-shade', ?, ?, 'submitted')`,
);
// Seeded, not random: the same rows every run (a linear congruential step, Numerical Recipes constants).
let state = 0x42524150;
const next = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0) / 2 ** 32;
db.transaction(() => {
  for (let n = 0; n < READINGS; n++) {
    const at = new Date(FROM + next() * (TO - FROM));
    insert.run(accessions[n % ACCESSIONS]!.id, characters[n % characters.length]!, site.id, observer.id, at.toISOString().replace('T', ' ').replace('Z', ''), 30 + next() * 40, next() * 40 - 20, next() * 40 - 20, next() < 0.5 ? 'Wet' : 'Dry', at.getUTCFullYear());
  }
})();

const bare = new Database(file, { readonly: true });
/** The floor: the reading rows one page of 1000 observations holds (250 readings), read by a bare prepared statement. */
const floorStatement = bare.prepare(`SELECT * FROM "reading" WHERE "supersededById" IS NULL ORDER BY "id" LIMIT ? OFFSET ?`);

function median(xs: number[]): number {
  const s = [...xs].sort((a, b) => a - b);
  return s[Math.floor(s.length / 2)]!;
}
async function timed(run: () => unknown, times = 7): Promise<number> {
  await run();
  const runs: number[] = [];
  for (let i = 0; i < times; i++) {
    const t = performance.now();
    await run();
    runs.push(performance.now() - t);
  }
  return median(runs);
}

const observations = READINGS * 4;
const lastPage = Math.ceil(observations / PAGE_SIZE) - 1;
const midPage = Math.floor(lastPage / 2);
const perPage = PAGE_SIZE / 4;
const floor = await timed(() => floorStatement.all(perPage, midPage * perPage));
const cases: [string, () => Promise<unknown>][] = [
  ['first page of all observations', () => findObservations(ds, {}, { page: 0, pageSize: PAGE_SIZE })],
  ['middle page of all observations', () => findObservations(ds, {}, { page: midPage, pageSize: PAGE_SIZE })],
  ['last page of all observations', () => findObservations(ds, {}, { page: lastPage, pageSize: PAGE_SIZE })],
  ['first page of one accession', () => findObservations(ds, { germplasmDbId: String(accessions[3]!.id) }, { page: 0, pageSize: PAGE_SIZE })],
];
console.log(`${READINGS} readings (${observations} observations), pages of ${PAGE_SIZE}`);
console.log('| step | time | × floor |');
console.log('|---|---|---|');
console.log(`| floor: bare better-sqlite3 read of one page's ${perPage} reading rows, median of 7 | ${floor.toFixed(2)} ms | 1.0× |`);
let worst = 0;
for (const [what, run] of cases) {
  const ms = await timed(run);
  worst = Math.max(worst, ms / floor);
  console.log(`| ${what} (findObservations: count, page keys, rows, shaping) | ${ms.toFixed(1)} ms | ${(ms / floor).toFixed(1)}× |`);
}
reportRatio(`BrAPI observations, ${READINGS} readings, slowest of first/middle/last/one-accession page of ${PAGE_SIZE}`, worst, "a bare better-sqlite3 read of the page's reading rows", '< 20×');

bare.close();
await ds.destroy();
rmSync(dir, { recursive: true, force: true });
