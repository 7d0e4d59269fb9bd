import { createHash } from 'node:crypto';
import { readdirSync, readFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import type { DataSource, EntityManager } from 'typeorm';
import type { ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { recordAudit, SYSTEM } from '../audit/audit.js';
import { readReferenceSetFile } from './reference-set-file.js';
import { Chip, ReferenceSet } from './reference-set.entity.js';

/** The repository's reference-set folder. */
export const REFERENCE_COLORS_DIR = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../../reference-colors');

/** Which files are reference sets: `reference-set-<anything>.json`. */
const FILE_PATTERN = /^reference-set-[A-Za-z0-9_-]+\.json$/;

/** Rows per INSERT: 10 bound values each, far below SQLite's variable limit (32,766 since 3.32). */
const INSERT_CHUNK = 500;

/** Where the reference sets come from and where the loader reports. */
export interface LoadOptions {
  /** The folder to read; the repository's `reference-colors/` by default. */
  dir?: string;
  /** Progress lines ("loaded set v1 …"); console.log by default. */
  log?: (message: string) => void;
  /** A file that changed after it was loaded, or that clashes with a stored set; console.warn by default. */
  warn?: (message: string) => void;
}

/** What one run of the loader did, by set id. */
export interface LoadReport {
  /** Sets inserted by this run. */
  added: string[];
  /** Sets already stored whose file is unchanged. */
  unchanged: string[];
  /** Files not loaded because a stored set has their id (with other bytes) or their version: the stored set was kept. */
  kept: string[];
  /** Wall time of the whole run. */
  ms: number;
}

/**
 * Loads every `reference-set-*.json` of the folder that the database does not hold yet, each in one
 * transaction. A stored set is never rewritten: when a file's bytes differ from those loaded under
 * the same id, the stored set stays (old readings keep their meaning) and a warning says so.
 */
export async function loadReferenceSets(ds: DataSource, options: LoadOptions = {}): Promise<LoadReport> {
  const started = performance.now();
  const dir = options.dir ?? REFERENCE_COLORS_DIR;
  const log = options.log ?? console.log;
  const warn = options.warn ?? console.warn;
  const report: LoadReport = { added: [], unchanged: [], kept: [], ms: 0 };
  const files = readdirSync(dir).filter((name) => FILE_PATTERN.test(name)).sort();
  const stored = await ds.getRepository(ReferenceSet).find();
  for (const name of files) {
    const fileStarted = performance.now();
    const bytes = readFileSync(path.join(dir, name));
    const sha256 = createHash('sha256').update(bytes).digest('hex');
    // An unchanged file is recognised by its hash alone: no parsing on an ordinary start.
    const same = stored.find((s) => s.fileSha256 === sha256);
    if (same) {
      report.unchanged.push(same.id);
      continue;
    }
    const file = readOnce(bytes, sha256, name);
    const byId = stored.find((s) => s.id === file.id);
    if (byId) {
      report.kept.push(file.id);
      warn(
        `Reference set ${file.id}: ${name} differs from the file loaded on ${byId.loadedAt.toISOString()} ` +
          `(SHA-256 ${sha256.slice(0, 12)}… now, ${byId.fileSha256.slice(0, 12)}… then). Keeping the stored set so old readings keep ` +
          `their meaning; publish a change as a new file with a new id and version.`,
      );
      continue;
    }
    const byVersion = stored.find((s) => s.version === file.version);
    if (byVersion) {
      report.kept.push(file.id);
      warn(`Reference set ${file.id} (${name}) was not loaded: version ${file.version} already belongs to set ${byVersion.id}.`);
      continue;
    }
    stored.push(await ds.transaction((m) => insertSet(m, file, sha256, name)));
    report.added.push(file.id);
    log(`Loaded reference set ${file.id} (${file.chips.length} chips) from ${name} in ${Math.round(performance.now() - fileStarted)} ms (read, checked, stored).`);
  }
  report.ms = performance.now() - started;
  return report;
}

/** Files already read and checked in this process, by SHA-256 (test harnesses load the same file many times). */
const checkedFiles = new Map<string, ReferenceSetFile>();

function readOnce(bytes: Buffer, sha256: string, name: string): ReferenceSetFile {
  let file = checkedFiles.get(sha256);
  if (!file) checkedFiles.set(sha256, (file = readReferenceSetFile(bytes.toString('utf8'), name)));
  return file;
}

/** The chip columns the loader writes, in the order of each row's values. */
const CHIP_COLUMNS = ['setId', 'code', 'parent', 'name', 'l', 'a', 'b', 'hex', 'inGamut', 'kind'] as const;

async function insertSet(m: EntityManager, file: ReferenceSetFile, sha256: string, fileName: string): Promise<ReferenceSet> {
  const set = m.create(ReferenceSet, {
    id: file.id,
    name: file.name,
    version: file.version,
    white: file.white,
    observer: file.observer,
    loadedAt: new Date(),
    fileSha256: sha256,
  });
  await m.insert(ReferenceSet, set);
  const rows = file.chips.map((c) => [file.id, c.code, c.parent, c.name, c.lab[0], c.lab[1], c.lab[2], c.hex, c.inGamut ? 1 : 0, c.parent === null ? 'field' : 'fine']);
  // Multi-row INSERTs with bound values: TypeORM's query builder spends ~1 s preparing 11,700 rows.
  const table = m.connection.getMetadata(Chip).tableName;
  const columns = CHIP_COLUMNS.map((c) => `"${c}"`).join(', ');
  const placeholders = `(${CHIP_COLUMNS.map(() => '?').join(', ')})`;
  for (let i = 0; i < rows.length; i += INSERT_CHUNK) {
    const chunk = rows.slice(i, i + INSERT_CHUNK);
    await m.query(`INSERT INTO "${table}" (${columns}) VALUES ${chunk.map(() => placeholders).join(', ')}`, chunk.flat());
  }
  const fieldChips = file.chips.filter((c) => c.parent === null).length;
  await recordAudit(m, SYSTEM, 'reference-set.loaded', file.id, { file: fileName, sha256, fieldChips, fineChips: rows.length - fieldChips });
  return set;
}
