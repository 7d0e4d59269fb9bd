import { randomBytes } from 'node:crypto';
import { existsSync, mkdirSync, readFileSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import { createApp } from './app.js';
import { seedCharacterCatalogue, seedDescriptorCatalogue } from './collection/seed-catalogue.js';
import { readConfig } from './config.js';
import { openDatabase } from './data-source.js';
import { seedDemo } from './demo/seed-demo.js';
import { startMailer } from './mail/mailer.js';
import { loadReferenceSets } from './reference-sets/load-reference-sets.js';
import { DATA_FOLDER, databaseFile } from './operations/data-folder.js';
import { PhotoFiles } from './photos/photo-files.js';
import { checkPhotoStore } from './photos/photo-store-check.js';

const root = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '..');

/** The session secret: SESSION_SECRET, else one generated once into the data folder. */
function sessionSecret(dataDir: string, fromEnv: string | null): string {
  if (fromEnv) return fromEnv;
  const file = path.join(dataDir, DATA_FOLDER.secret);
  if (!existsSync(file)) writeFileSync(file, randomBytes(48).toString('base64url'), { mode: 0o600 });
  return readFileSync(file, 'utf8').trim();
}

/** Tidies what a stop mid-upload can leave in the photo store, and says what it found. */
async function reportPhotoStore(ds: Awaited<ReturnType<typeof openDatabase>>, dataDir: string): Promise<void> {
  const report = await checkPhotoStore(ds, new PhotoFiles(path.join(dataDir, DATA_FOLDER.photos)));
  if (report.staged) console.log(`Photo store: removed ${report.staged} half-written upload(s).`);
  if (report.orphaned.length) console.log(`Photo store: ${report.orphaned.length} folder(s) that no photo names were moved to photos/.orphaned/.`);
  if (report.missing.length) console.error(`Photo store: the files of ${report.missing.length} photo(s) are missing: ids ${report.missing.map((m) => m.id).join(', ')}.`);
}

async function main(): Promise<void> {
  const config = readConfig();
  mkdirSync(config.dataDir, { recursive: true });
  const ds = await openDatabase(databaseFile(config.dataDir));
  await reportPhotoStore(ds, config.dataDir);
  await loadReferenceSets(ds);
  await seedCharacterCatalogue(ds);
  await seedDescriptorCatalogue(ds);
  if (config.demo && (await seedDemo(ds))) console.log('Loaded the invented demo scenario (password demo-pass-2026).');
  const mailer = await startMailer(ds, config.smtpUrl, config.mailFrom);
  const app = createApp({
    dataSource: ds,
    mailer,
    sessionSecret: sessionSecret(config.dataDir, config.sessionSecret),
    publicUrl: config.publicUrl,
    clientDir: path.join(root, 'dist/client/browser'),
    dataDir: config.dataDir,
    trustProxy: config.trustProxy,
    secureCookies: config.secureCookies,
  });
  const server = app.listen(config.port, () => {
    console.log(`Hueledger on http://localhost:${config.port} (data in ${config.dataDir}; mail ${mailer.catching ? 'caught in the outbox' : 'sent by SMTP'})`);
  });
  server.on('error', (err) => {
    console.error(`Cannot listen on port ${config.port}: ${err.message}`);
    process.exit(1);
  });
  const stop = () => {
    server.close(() => {
      void mailer.close().then(() => ds.destroy()).then(() => process.exit(0));
    });
    setTimeout(() => process.exit(0), 5000).unref();
  };
  process.once('SIGTERM', stop);
  process.once('SIGINT', stop);
}

main().catch((err: unknown) => {
  console.error(err instanceof Error ? err.message : err);
  process.exit(1);
});
