import { existsSync } from 'node:fs';
import { mkdir, readdir, rename, rm } from 'node:fs/promises';
import path from 'node:path';
import type { DataSource } from 'typeorm';
import { PHOTO_FILES, type PhotoFiles } from './photo-files.js';
import { Photo } from './photo.entity.js';

/** What a check of the photo store found, and what it did about it. */
export interface PhotoStoreReport {
  /** Photo rows whose files are missing (a restore from a partial copy, a deleted folder). */
  missing: { id: number; sha256: string }[];
  /** Complete folders no row names (the process stopped between placing the files and saving the row); moved to `.orphaned/`. */
  orphaned: string[];
  /** Half-written uploads left in `.staging/` by a stop mid-upload; removed. */
  staged: number;
}

/** The folder orphans are moved to, beside the store's content folders; never deleted automatically. */
export const ORPHANED_DIR = '.orphaned';

/**
 * Checks the photo store against the photo table, run at start-up: a stop at any moment of an
 * upload (kill -9, power) leaves at most a staging folder (removed here) or a placed folder whose
 * row never committed (moved aside here, so nothing points at it and nothing is lost). A row whose
 * files are gone cannot be mended here and is reported.
 */
export async function checkPhotoStore(ds: DataSource, files: PhotoFiles): Promise<PhotoStoreReport> {
  const report: PhotoStoreReport = { missing: [], orphaned: [], staged: 0 };
  if (!existsSync(files.root)) {
    const rows = await ds.getRepository(Photo).find({ select: { id: true, sha256: true } });
    report.missing = rows.map((r) => ({ id: r.id, sha256: r.sha256 }));
    return report;
  }
  const staging = path.join(files.root, '.staging');
  if (existsSync(staging)) {
    report.staged = (await readdir(staging)).length;
    await rm(staging, { recursive: true, force: true });
  }
  const rows = await ds.getRepository(Photo).find({ select: { id: true, sha256: true } });
  const known = new Set(rows.map((r) => r.sha256));
  for (const prefix of await readdir(files.root)) {
    if (!/^[0-9a-f]{2}$/.test(prefix)) continue;
    for (const sha of await readdir(path.join(files.root, prefix))) {
      if (known.has(sha)) continue;
      const to = path.join(files.root, ORPHANED_DIR, sha);
      await mkdir(path.dirname(to), { recursive: true });
      await rm(to, { recursive: true, force: true });
      await rename(path.join(files.root, prefix, sha), to);
      report.orphaned.push(sha);
    }
  }
  for (const r of rows) {
    if (!existsSync(files.file(r.sha256, PHOTO_FILES.upright))) report.missing.push({ id: r.id, sha256: r.sha256 });
  }
  return report;
}
