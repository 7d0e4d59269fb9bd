import Database from 'better-sqlite3';
import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { cp, mkdir, readFile, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import { filesUnder, hashFile, MANIFEST_FILE, type BackupManifest } from './backup-manifest.js';
import { DATA_FOLDER, databaseFile } from './data-folder.js';

/** What a restore did. */
export interface RestoreResult {
  manifest: BackupManifest;
  /** Where the data folder's previous contents were moved, when it had any. */
  previousMovedTo: string | null;
}

/**
 * Puts a backup back into a data folder. The server must be stopped. The backup is checked
 * against its manifest first (every file present, same size and SHA-256, nothing extra) and its
 * database must pass `PRAGMA integrity_check`; only then is anything in the data folder touched.
 * A data folder that already holds a database is refused unless `replace` is set, and even then
 * its old contents are moved aside into `.before-restore-<time>/` inside it, never deleted.
 */
export async function restoreDataFolder(backupDir: string, dataDir: string, opts: { replace: boolean }): Promise<RestoreResult> {
  const manifest = await verifyBackup(backupDir);
  const hasData = existsSync(databaseFile(dataDir));
  if (hasData && !opts.replace) throw new Error(`${dataDir} already holds a database; pass --replace to move it aside and restore over it.`);

  await mkdir(dataDir, { recursive: true });
  const staging = path.join(dataDir, `.restore-${randomBytes(6).toString('hex')}`);
  try {
    for (const name of [DATA_FOLDER.database, DATA_FOLDER.photos, DATA_FOLDER.secret]) {
      const from = path.join(backupDir, name);
      if (existsSync(from)) await cp(from, path.join(staging, name), { recursive: true });
    }
    let previousMovedTo: string | null = null;
    if (hasData) {
      previousMovedTo = path.join(dataDir, `.before-restore-${new Date().toISOString().replace(/[:.]/g, '-')}`);
      await mkdir(previousMovedTo);
      for (const name of [DATA_FOLDER.database, `${DATA_FOLDER.database}-wal`, `${DATA_FOLDER.database}-shm`, DATA_FOLDER.photos, DATA_FOLDER.secret]) {
        const current = path.join(dataDir, name);
        if (existsSync(current)) await rename(current, path.join(previousMovedTo, name));
      }
    }
    for (const name of [DATA_FOLDER.database, DATA_FOLDER.photos, DATA_FOLDER.secret]) {
      const staged = path.join(staging, name);
      if (existsSync(staged)) await rename(staged, path.join(dataDir, name));
    }
    return { manifest, previousMovedTo };
  } finally {
    await rm(staging, { recursive: true, force: true });
  }
}

/** Reads a backup's manifest and checks every file against it; throws naming the first problem. */
export async function verifyBackup(backupDir: string): Promise<BackupManifest> {
  const manifestPath = path.join(backupDir, MANIFEST_FILE);
  if (!existsSync(manifestPath)) throw new Error(`${backupDir} has no ${MANIFEST_FILE}: not a Hueledger backup (or an unfinished one).`);
  const manifest = JSON.parse(await readFile(manifestPath, 'utf8')) as BackupManifest;
  if (manifest.format !== 'hueledger-backup' || manifest.formatVersion !== 1) throw new Error(`${manifestPath} is not a backup manifest this version can read.`);
  const listed = new Set(manifest.files.map((f) => f.path));
  for (const rel of await filesUnder(backupDir)) {
    if (rel !== MANIFEST_FILE && !listed.has(rel)) throw new Error(`${rel} is in the backup but not in its manifest.`);
  }
  for (const f of manifest.files) {
    const file = path.join(backupDir, ...f.path.split('/'));
    if (!existsSync(file)) throw new Error(`${f.path} is missing from the backup.`);
    const actual = await hashFile(file);
    if (actual.sha256 !== f.sha256 || actual.bytes !== f.bytes) throw new Error(`${f.path} does not match the manifest (changed or damaged since the backup).`);
  }
  if (!listed.has(DATA_FOLDER.database)) throw new Error('The backup holds no database.');
  const db = new Database(path.join(backupDir, DATA_FOLDER.database), { readonly: true, fileMustExist: true });
  try {
    const check = db.pragma('integrity_check', { simple: true });
    if (check !== 'ok') throw new Error(`The backup's database fails its integrity check: ${String(check)}`);
  } finally {
    db.close();
  }
  return manifest;
}
