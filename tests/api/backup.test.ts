import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Database from 'better-sqlite3';
import { spawnSync } from 'node:child_process';
import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { backupDataFolder } from '../../server/operations/backup.js';
import { restoreDataFolder } from '../../server/operations/restore.js';
import { filesUnder, MANIFEST_FILE } from '../../server/operations/backup-manifest.js';
import { signedInAs, startHarness, type Harness } from './harness.js';
import { paintScene, fromRaw, uploadPhoto } from './photo-fixtures.js';

/** Every row of every table, in rowid order, with blobs as hex: equal dumps mean equal database content. */
function dumpDatabase(file: string): Record<string, unknown[]> {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const tables = db.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`).pluck().all() as string[];
    const schema = db.prepare(`SELECT type, name, sql FROM sqlite_master WHERE name NOT LIKE 'sqlite_%' ORDER BY type, name`).all();
    const out: Record<string, unknown[]> = { '(schema)': schema };
    for (const t of tables) {
      out[t] = db
        .prepare(`SELECT * FROM "${t}" ORDER BY rowid`)
        .all()
        .map((row) => Object.fromEntries(Object.entries(row as object).map(([k, v]) => [k, Buffer.isBuffer(v) ? v.toString('hex') : v])));
    }
    return out;
  } finally {
    db.close();
  }
}

/** Every file under a folder (half-written staging uploads left out) with its bytes as base64. */
async function fileBytes(root: string): Promise<Map<string, string>> {
  const names = await filesUnder(root, new Set(['.staging']));
  return new Map(names.map((rel) => [rel, readFileSync(path.join(root, rel)).toString('base64')]));
}

describe('backup and restore (npm run backup / restore)', () => {
  let h: Harness;
  let scratch: string;

  before(async () => {
    h = await startHarness({ demo: true });
    scratch = mkdtempSync(path.join(tmpdir(), 'hueledger-backup-'));
    const recorder = await signedInAs(h, 'recorder');
    const px = paintScene(64, 48, [128, 128, 128], [{ x: 8, y: 8, width: 24, height: 24, rgb: [120, 60, 110] }]);
    const res = await uploadPhoto(recorder, await fromRaw(px, 64, 48).jpeg({ quality: 95 }).toBuffer());
    assert.equal(res.status, 201, res.text);
    writeFileSync(path.join(h.dir, 'session-secret'), 'a-test-secret-kept-in-the-data-folder-0123456789');
  });

  after(async () => {
    await h.close();
    rmSync(scratch, { recursive: true, force: true });
  });

  test('a backup restored into an empty folder has the same database content and the same photo bytes', async () => {
    const out = path.join(scratch, 'one');
    const manifest = await backupDataFolder(h.dir, out);
    assert.ok(manifest.files.some((f) => f.path.startsWith('photos/')), 'photos are copied');
    assert.ok(manifest.tables['user'] >= 4, 'the demo people are in the copy');
    const target = path.join(scratch, 'restored-one');
    const result = await restoreDataFolder(out, target, { replace: false });
    assert.equal(result.previousMovedTo, null);
    assert.deepEqual(dumpDatabase(path.join(target, 'hueledger.sqlite')), dumpDatabase(h.dbFile));
    assert.deepEqual(await fileBytes(path.join(target, 'photos')), await fileBytes(path.join(h.dir, 'photos')));
    assert.equal(readFileSync(path.join(target, 'session-secret'), 'utf8'), readFileSync(path.join(h.dir, 'session-secret'), 'utf8'));
  });

  test('a backup taken while the app keeps writing is consistent and passes the integrity check', async () => {
    const admin = await signedInAs(h, 'admin');
    const siteId = (await admin.get('/api/sites')).body[0].id as number;
    let stop = false;
    let written = 0;
    const writer = (async () => {
      for (let i = 0; !stop && i < 400; i++) {
        const r = await admin.post('/api/accessions', { accessionNumber: `BK-${i}`, name: `Backup test ${i}`, siteId });
        assert.equal(r.status, 201, r.text);
        written++;
      }
    })();
    const out = path.join(scratch, 'busy');
    await backupDataFolder(h.dir, out);
    stop = true;
    await writer;
    const copy = dumpDatabase(path.join(out, 'hueledger.sqlite'));
    const live = dumpDatabase(h.dbFile);
    const copied = (copy['accession'] as { accessionNumber: string }[]).filter((a) => a.accessionNumber.startsWith('BK-'));
    assert.ok(copied.length <= written);
    // A snapshot: every accession in the copy is exactly the live row, and its audit event came with it.
    const liveById = new Map((live['accession'] as { id: number }[]).map((a) => [a.id, a]));
    for (const a of copy['accession'] as { id: number }[]) assert.deepEqual(a, liveById.get(a.id));
    const createdEvents = new Set(
      (copy['audit_event'] as { action: string; subject: string }[]).filter((e) => e.action === 'accession.created').map((e) => e.subject),
    );
    for (const a of copied as unknown as { id: number }[]) assert.ok(createdEvents.has(`accession:${a.id}`), `accession ${a.id} came with its audit event`);
    const db = new Database(path.join(out, 'hueledger.sqlite'), { readonly: true });
    assert.equal(db.pragma('integrity_check', { simple: true }), 'ok');
    db.close();
  });

  test('restore refuses a damaged backup and leaves the target untouched', async () => {
    const out = path.join(scratch, 'damaged');
    const manifest = await backupDataFolder(h.dir, out);
    const photo = manifest.files.find((f) => f.path.startsWith('photos/'))!;
    const file = path.join(out, ...photo.path.split('/'));
    const bytes = readFileSync(file);
    bytes[bytes.length - 1] ^= 0xff;
    writeFileSync(file, bytes);
    const target = path.join(scratch, 'restored-damaged');
    await assert.rejects(restoreDataFolder(out, target, { replace: false }), /does not match the manifest/);
    assert.equal(existsSync(target), false, 'nothing was written');
  });

  test('restore over existing data needs --replace and moves the old contents aside instead of deleting them', async () => {
    const out = path.join(scratch, 'over');
    await backupDataFolder(h.dir, out);
    const target = path.join(scratch, 'restored-over');
    await restoreDataFolder(out, target, { replace: false });
    const before = dumpDatabase(path.join(target, 'hueledger.sqlite'));
    await assert.rejects(restoreDataFolder(out, target, { replace: false }), /--replace/);
    const result = await restoreDataFolder(out, target, { replace: true });
    assert.ok(result.previousMovedTo);
    assert.deepEqual(dumpDatabase(path.join(result.previousMovedTo, 'hueledger.sqlite')), before);
    assert.deepEqual(dumpDatabase(path.join(target, 'hueledger.sqlite')), dumpDatabase(path.join(out, 'hueledger.sqlite')));
  });

  test('npm run backup and npm run restore work as commands on HUELEDGER_DATA_DIR', async () => {
    const out = path.join(scratch, 'cli');
    const env = { ...process.env, HUELEDGER_DATA_DIR: h.dir };
    const b = spawnSync('npm', ['run', '--silent', 'backup', '--', '--out', out], { env, encoding: 'utf8' });
    assert.equal(b.status, 0, b.stderr);
    assert.match(b.stdout, /Backed up .* files/);
    assert.ok(existsSync(path.join(out, MANIFEST_FILE)));
    assert.equal(existsSync(`${out}.partial`), false);
    const target = path.join(scratch, 'cli-restored');
    const r = spawnSync('npm', ['run', '--silent', 'restore', '--', out], { env: { ...process.env, HUELEDGER_DATA_DIR: target }, encoding: 'utf8' });
    assert.equal(r.status, 0, r.stderr);
    assert.deepEqual(await filesUnder(path.join(target, 'photos')), await filesUnder(path.join(out, 'photos')));
    const again = spawnSync('npm', ['run', '--silent', 'restore', '--', out], { env: { ...process.env, HUELEDGER_DATA_DIR: target }, encoding: 'utf8' });
    assert.equal(again.status, 1);
    assert.match(again.stderr, /--replace/);
  });
});
