// npm run restore -- <backup folder> [--replace]: stop the server first.
import path from 'node:path';
import { parseArgs } from 'node:util';
import { readConfig } from '../config.js';
import { restoreDataFolder } from './restore.js';

const { values, positionals } = parseArgs({ allowPositionals: true, options: { replace: { type: 'boolean', default: false } } });
if (positionals.length !== 1) {
  console.error('Usage: npm run restore -- <backup folder> [--replace]   (stop the server first)');
  process.exit(2);
}
try {
  const { dataDir } = readConfig();
  const { manifest, previousMovedTo } = await restoreDataFolder(path.resolve(positionals[0]), dataDir, { replace: values.replace });
  console.log(`Restored the backup of ${manifest.createdAt} into ${dataDir} (${manifest.files.length} files checked against the manifest).`);
  if (previousMovedTo) console.log(`The folder's previous contents were moved to ${previousMovedTo}.`);
} catch (err) {
  console.error(`Restore failed: ${err instanceof Error ? err.message : String(err)}`);
  process.exit(1);
}
