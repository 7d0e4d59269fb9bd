import { existsSync, mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';

/**
 * scripts/node-tests.mjs gives the test files of one run a shared folder under this variable.
 * Migrating a database, loading the reference sets and seeding the demo is the slowest part of
 * starting an app, and its result is the same for every file of the run, so the first file that
 * needs a seeded folder makes it there and every later file copies it. Unset when a file runs alone,
 * and then each file seeds its own.
 */
export const TEMPLATE_ENV = 'HUELEDGER_TEST_TEMPLATE_DIR';

/**
 * The folder named `name` in the run's shared template folder, made once per run by `make` in
 * whichever process asks first (mkdir is the lock; the others wait for its ready or failed mark).
 * Null when there is no shared folder, when making it failed, or after `limitMs` of waiting: the
 * caller then seeds its own, so a broken template costs time, never a wrong result.
 */
export async function sharedTemplate(name: string, make: (into: string) => Promise<void>, limitMs = 180_000): Promise<string | null> {
  const base = process.env[TEMPLATE_ENV];
  if (!base) return null;
  const data = path.join(base, name, 'data');
  const ready = path.join(base, name, 'ready');
  const failed = path.join(base, name, 'failed');
  try {
    mkdirSync(path.join(base, name), { recursive: false });
  } catch {
    const deadline = Date.now() + limitMs;
    while (!existsSync(ready) && !existsSync(failed) && Date.now() < deadline) await new Promise((r) => setTimeout(r, 100));
    return existsSync(ready) ? data : null;
  }
  try {
    mkdirSync(data);
    await make(data);
    writeFileSync(ready, '');
    return data;
  } catch (err) {
    writeFileSync(failed, String(err));
    return null;
  }
}
