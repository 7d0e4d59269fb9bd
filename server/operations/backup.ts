import Database from 'better-sqlite3';
import { existsSync } from 'node:fs';
import { copyFile, mkdir, readdir, rename, rm, writeFile } from 'node:fs/promises';
import path from 'node:path';
import { APP_VERSION } from '../version.js';
import { filesUnder, hashFile, MANIFEST_FILE, type BackupFile, type BackupManifest } from './backup-manifest.js';
import { DATA_FOLDER, databaseFile } from './data-folder.js';

/** Staging folders inside the photo store that hold half-written uploads: never copied. */
const SKIP_IN_PHOTOS = new Set(['.staging']);

/**
 * Copies a data folder while the server may be running: the database through SQLite's online
 * backup API (better-sqlite3 `db.backup`, a consistent snapshot even mid-write), then the photo
 * store and the session secret. The database goes first: a photo's files are in place before its
 * row commits (server/photos/photos.ts), so every photo the snapshot names is on disk by then.
 * Everything is written to `<out>.partial` and renamed at the end, so a backup folder either is
 * complete or does not exist.
 */
export async function backupDataFolder(dataDir: string, outDir: string): Promise<BackupManifest> {
  const source = databaseFile(dataDir);
  if (!existsSync(source)) throw new Error(`No database at ${source}: is HUELEDGER_DATA_DIR right?`);
  if (existsSync(outDir) && (await readdir(outDir)).length > 0) throw new Error(`${outDir} exists and is not empty; choose a new folder.`);
  const partial = `${outDir}.partial`;
  await rm(partial, { recursive: true, force: true });
  await mkdir(partial, { recursive: true });
  try {
    await snapshotDatabase(source, path.join(partial, DATA_FOLDER.database));
    const photos = path.join(dataDir, DATA_FOLDER.photos);
    if (existsSync(photos)) {
      for (const rel of await filesUnder(photos, SKIP_IN_PHOTOS)) {
        const to = path.join(partial, DATA_FOLDER.photos, ...rel.split('/'));
        await mkdir(path.dirname(to), { recursive: true });
        await copyFile(path.join(photos, ...rel.split('/')), to);
      }
    }
    const secret = path.join(dataDir, DATA_FOLDER.secret);
    if (existsSync(secret)) await copyFile(secret, path.join(partial, DATA_FOLDER.secret));
    const manifest = await manifestOf(partial);
    await writeFile(path.join(partial, MANIFEST_FILE), JSON.stringify(manifest, null, 2) + '\n', { mode: 0o600 });
    if (existsSync(outDir)) await rm(outDir, { recursive: true });
    await rename(partial, outDir);
    return manifest;
  } catch (err) {
    await rm(partial, { recursive: true, force: true });
    throw err;
  }
}

async function snapshotDatabase(source: string, target: string): Promise<void> {
  const db = new Database(source, { fileMustExist: true });
  try {
    db.pragma('busy_timeout = 5000');
    await db.backup(target);
  } finally {
    db.close();
  }
  const copy = new Database(target, { fileMustExist: true });
  try {
    const check = copy.pragma('integrity_check', { simple: true });
    if (check !== 'ok') throw new Error(`The database copy failed its integrity check: ${String(check)}`);
    // The copy is a standalone file: leave it in rollback-journal mode so no -wal file is needed beside it.
    copy.pragma('journal_mode = DELETE');
  } finally {
    copy.close();
  }
}

/** The manifest of a folder of copies: each file's size and SHA-256, and row counts per table. */
export async function manifestOf(dir: string): Promise<BackupManifest> {
  const files: BackupFile[] = [];
  for (const rel of await filesUnder(dir)) {
    if (rel === MANIFEST_FILE) continue;
    files.push({ path: rel, ...(await hashFile(path.join(dir, ...rel.split('/')))) });
  }
  return { format: 'hueledger-backup', formatVersion: 1, createdAt: new Date().toISOString(), appVersion: APP_VERSION, tables: tableCounts(path.join(dir, DATA_FOLDER.database)), files };
}

/** Rows per table of a database file (SQLite's own tables left out). */
export function tableCounts(file: string): Record<string, number> {
  const db = new Database(file, { readonly: true, fileMustExist: true });
  try {
    const names = db.prepare(`SELECT name FROM sqlite_master WHERE type = 'table' AND name NOT LIKE 'sqlite_%' ORDER BY name`).pluck().all() as string[];
    return Object.fromEntries(names.map((n) => [n, Number(db.prepare(`SELECT COUNT(*) FROM "${n.replaceAll('"', '""')}"`).pluck().get())]));
  } finally {
    db.close();
  }
}
