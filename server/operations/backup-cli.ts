// npm run backup [-- --out <folder>]: copies HUELEDGER_DATA_DIR (default ./data) while the server may run.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { readConfig } from '../config.js';
import { backupDataFolder } from './backup.js';

const { values } = parseArgs({ options: { out: { type: 'string' } } });
const stamp = new Date().toISOString().replace(/[-:]/g, '').replace('T', '-').slice(0, 15);
const out = path.resolve(values.out ?? path.join('backups', `hueledger-${stamp}`));
try {
  const { dataDir } = readConfig();
  const manifest = await backupDataFolder(dataDir, out);
  const bytes = manifest.files.reduce((s, f) => s + f.bytes, 0);
  const rows = Object.values(manifest.tables).reduce((s, n) => s + n, 0);
  console.log(`Backed up ${dataDir} to ${out}: ${manifest.files.length} files, ${(bytes / 1e6).toFixed(1)} MB, ${rows} rows in ${Object.keys(manifest.tables).length} tables.`);
} catch (err) {
  console.error(`Backup failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
}
