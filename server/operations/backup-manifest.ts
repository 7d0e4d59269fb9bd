import { createHash } from 'node:crypto';
import { createReadStream } from 'node:fs';
import { readdir } from 'node:fs/promises';
import path from 'node:path';

/** The file written beside a backup's copies: what was copied, with a SHA-256 of each file. */
export const MANIFEST_FILE = 'manifest.json';

/** One copied file, relative to the backup folder, with forward slashes. */
export interface BackupFile {
  path: string;
  bytes: number;
  sha256: string;
}

/** What a backup holds; restore refuses a backup whose files do not match it. */
export interface BackupManifest {
  format: 'hueledger-backup';
  formatVersion: 1;
  createdAt: string;
  appVersion: string;
  /** Rows per table in the copied database, for a quick look without opening it. */
  tables: Record<string, number>;
  files: BackupFile[];
}

/** SHA-256 and size of a file, streamed (photos can be 25 MB). */
export async function hashFile(file: string): Promise<{ bytes: number; sha256: string }> {
  const hash = createHash('sha256');
  let bytes = 0;
  for await (const chunk of createReadStream(file)) {
    hash.update(chunk as Buffer);
    bytes += (chunk as Buffer).length;
  }
  return { bytes, sha256: hash.digest('hex') };
}

/** Every file under a folder, relative to it, sorted; folders named in `skip` are not entered. */
export async function filesUnder(root: string, skip: ReadonlySet<string> = new Set()): Promise<string[]> {
  const out: string[] = [];
  async function walk(dir: string): Promise<void> {
    for (const entry of await readdir(dir, { withFileTypes: true })) {
      if (skip.has(entry.name)) continue;
      const full = path.join(dir, entry.name);
      if (entry.isDirectory()) await walk(full);
      else if (entry.isFile()) out.push(path.relative(root, full).split(path.sep).join('/'));
    }
  }
  await walk(root);
  return out.sort();
}
