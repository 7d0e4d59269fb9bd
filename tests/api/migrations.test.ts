import assert from 'node:assert/strict';
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { test } from 'node:test';
import { openDatabase } from '../../server/data-source.js';

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
