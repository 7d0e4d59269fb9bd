import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { test } from 'node:test';
import { seedCharacterCatalogue, seedDescriptorCatalogue } from '../../server/collection/seed-catalogue.js';
import { openDatabase } from '../../server/data-source.js';
import { seedDemo } from '../../server/demo/seed-demo.js';
import { InstrumentIlluminant1765000000000 } from '../../server/migrations/1765000000000-instrument-illuminant.js';
import { CaseInsensitiveCodes1765030000000 } from '../../server/migrations/1765030000000-case-insensitive-codes.js';
import { loadReferenceSets } from '../../server/reference-sets/load-reference-sets.js';

test('should leave no difference between the migrated schema and the entities', async () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-migrations-'));
  const ds = await openDatabase(path.join(dir, 'hueledger.sqlite'));
  try {
    // TypeORM's schema builder lists what synchronize would change; after the migrations, nothing.
    const pending = await ds.driver.createSchemaBuilder().log();
    assert.deepEqual(pending.upQueries.map((q) => q.query), []);
    const journal = (await ds.query('PRAGMA journal_mode')) as { journal_mode: string }[];
    assert.equal(journal[0]?.journal_mode, 'wal');
    const fk = (await ds.query('PRAGMA foreign_keys')) as { foreign_keys: number }[];
    assert.equal(fk[0]?.foreign_keys, 1);
  } finally {
    await ds.destroy();
    rmSync(dir, { recursive: true, force: true });
  }
});

test('should apply the migrations only once when the database is opened again', async () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-migrations-'));
  const file = path.join(dir, 'hueledger.sqlite');
  try {
    await (await openDatabase(file)).destroy();
    const ds = await openDatabase(file);
    const rows = (await ds.query('SELECT COUNT(*) AS n FROM migrations')) as { n: number }[];
    assert.equal(rows[0]?.n, ds.migrations.length);
    await ds.destroy();
  } finally {
    rmSync(dir, { recursive: true, force: true });
  }
});

test('should rebuild the reading table (light made nullable) on a database full of demo readings, keeping every row, key and index', async () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-migrations-'));
  const ds = await openDatabase(path.join(dir, 'hueledger.sqlite'));
  try {
    await loadReferenceSets(ds);
    await seedCharacterCatalogue(ds);
    await seedDescriptorCatalogue(ds);
    await seedDemo(ds);
    const count = async (table: string) => ((await ds.query(`SELECT COUNT(*) AS n FROM "${table}"`)) as { n: number }[])[0]!.n;
    const before = { readings: await count('reading'), reviews: await count('review') };
    assert.ok(before.readings > 0 && before.reviews > 0, 'the demo has readings and reviews of them');
    const sum = async () => (await ds.query(`SELECT SUM("id" * 7 + "l" * 1000) AS s FROM "reading"`)) as { s: number }[];
    const checksum = await sum();
    // Down and up again on live rows, as the runner does it: foreign keys off around one transaction.
    const migration = new InstrumentIlluminant1765000000000();
    const runner = ds.createQueryRunner();
    await runner.beforeMigration();
    await runner.startTransaction();
    await migration.down(runner);
    await migration.up(runner);
    await runner.commitTransaction();
    await runner.afterMigration();
    await runner.release();
    assert.deepEqual({ readings: await count('reading'), reviews: await count('review') }, before);
    assert.deepEqual(await sum(), checksum);
    assert.deepEqual(await ds.query('PRAGMA foreign_key_check'), []);
    const pending = await ds.driver.createSchemaBuilder().log();
    assert.deepEqual(pending.upQueries.map((q) => q.query), [], 'the rebuilt table still matches the entity, indexes included');
  } finally {
    await ds.destroy();
    rmSync(dir, { recursive: true, force: true });
  }
});

test('should refuse, naming the rows, to make codes case-insensitive unique where an older database already holds a pair', async () => {
  const dir = mkdtempSync(path.join(tmpdir(), 'hueledger-migrations-'));
  const ds = await openDatabase(path.join(dir, 'hueledger.sqlite'));
  try {
    // Undo the migration, write two accession numbers that differ only in case (as an older API let
    // through), then run it again: it stops with both numbers named and creates no index.
    const migration = new CaseInsensitiveCodes1765030000000();
    const runner = ds.createQueryRunner();
    await migration.down(runner);
    await ds.query(`INSERT INTO "site" ("code", "name", "timezone") VALUES ('TST', 'Invented test plot', 'UTC')`);
    await ds.query(`INSERT INTO "accession" ("accessionNumber", "name", "otherNames", "siteId") VALUES ('HL-0001', 'Invented A', '[]', 1), ('hl-0001', 'Invented B', '[]', 1)`);
    await assert.rejects(() => migration.up(runner), /accession numbers HL-0001, hl-0001 \(ids 1, 2\) differ only in letter case/);
    const indexes = (await ds.query(`SELECT name FROM sqlite_master WHERE type = 'index' AND name LIKE 'IDX_%_lower'`)) as { name: string }[];
    assert.deepEqual(indexes, []);
    // Renamed, the same migration goes through.
    await ds.query(`UPDATE "accession" SET "accessionNumber" = 'HL-0002' WHERE "id" = 2`);
    await migration.up(runner);
    await runner.release();
    assert.equal(((await ds.query(`SELECT COUNT(*) AS n FROM sqlite_master WHERE type = 'index' AND name LIKE 'IDX_%_lower'`)) as { n: number }[])[0]!.n, 2);
  } finally {
    await ds.destroy();
    rmSync(dir, { recursive: true, force: true });
  }
});
