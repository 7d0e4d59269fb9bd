// Nothing lost on a crash (needs the built client, as main.ts serves it): the real server is killed with
// SIGKILL in the middle of 100 concurrent photo uploads and reading saves, then started again on
// the same data folder. Every write the server acknowledged must still be there, the database
// must pass PRAGMA integrity_check, no row may point at missing photo files, and no photo folder
// may be left that no row names (the start-up check moves such folders aside and says so).
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import Database from 'better-sqlite3';
import { existsSync, mkdtempSync, readdirSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import path from 'node:path';
import { fromRaw } from '../api/photo-fixtures.js';
import { mulberry32 } from '../../shared/random/mulberry32.js';
import { signInOverHttp } from './http-session.js';
import { copyDemoTemplate, startServerProcess } from './server-process.js';

const DEMO_PASSWORD = 'demo-pass-2026';
const CONCURRENT = 100;

/** A noisy photo (so sharp has real work to do and the kill lands mid-flight), different for each n. */
async function photo(n: number): Promise<Buffer> {
  const random = mulberry32(n + 1);
  const w = 640;
  const h = 480;
  const px = Buffer.alloc(w * h * 3);
  for (let i = 0; i < px.length; i++) px[i] = Math.floor(random() * 256);
  return fromRaw(px, w, h).png({ compressionLevel: 1 }).toBuffer();
}

let dataDir: string;
before(async () => {
  dataDir = mkdtempSync(path.join(tmpdir(), 'hueledger-crash-'));
  await copyDemoTemplate(dataDir);
});
after(() => rmSync(dataDir, { recursive: true, force: true }));

test('a SIGKILL in the middle of 100 concurrent uploads and saves loses no acknowledged write and leaves a consistent store', async (t) => {
  let server = await startServerProcess({ dataDir });
  const session = await signInOverHttp(server.url, 'recorder@demo.test', DEMO_PASSWORD);
  const auth = session.headers();
  const accessions = (await (await fetch(`${server.url}/api/accessions`, { headers: auth })).json()) as { id: number }[];
  const characters = ((await (await fetch(`${server.url}/api/characters`, { headers: auth })).json()) as { id: number; colour: boolean; active: boolean }[]).filter((c) => c.colour && c.active);
  const photos = await Promise.all(Array.from({ length: CONCURRENT / 2 }, (_, i) => photo(i)));

  const acknowledged = { photos: [] as number[], readings: [] as number[] };
  let answered = 0;
  const requests = Array.from({ length: CONCURRENT }, async (_, i) => {
    try {
      if (i % 2 === 0) {
        const form = new FormData();
        form.append('photo', new Blob([new Uint8Array(photos[i / 2]!)], { type: 'image/png' }), `leaf-${i}.png`);
        const res = await fetch(`${server.url}/api/photos`, { method: 'POST', headers: auth, body: form });
        if (res.status === 201) acknowledged.photos.push(((await res.json()) as { id: number }).id);
      } else {
        const body = { method: 'instrument', accessionId: accessions[i % accessions.length]!.id, characterId: characters[i % characters.length]!.id, light: 'overcast', lab: [30 + (i % 50), 25, -10] };
        const res = await fetch(`${server.url}/api/readings`, { method: 'POST', headers: { ...auth, 'content-type': 'application/json' }, body: JSON.stringify(body) });
        if (res.status === 201) acknowledged.readings.push(((await res.json()) as { id: number }).id);
        else assert.fail(`a reading was refused before the crash: ${res.status} ${await res.text()}`);
      }
    } catch (err) {
      // The connection dies with the server: that request was never acknowledged.
      if (err instanceof assert.AssertionError) throw err;
    } finally {
      answered++;
    }
  });
  // Kill once some requests have been answered and many are still in flight.
  while (answered < CONCURRENT / 5) await new Promise((r) => setTimeout(r, 5));
  await server.kill();
  await Promise.all(requests);
  assert.ok(answered === CONCURRENT);
  assert.ok(acknowledged.photos.length + acknowledged.readings.length < CONCURRENT, 'the kill landed while requests were in flight');
  t.diagnostic(`acknowledged before the kill: ${acknowledged.photos.length} photos, ${acknowledged.readings.length} readings of ${CONCURRENT} requests`);

  server = await startServerProcess({ dataDir });
  try {
    const admin = (await signInOverHttp(server.url, 'admin@demo.test', DEMO_PASSWORD)).headers();
    for (const id of acknowledged.photos) assert.equal((await fetch(`${server.url}/api/photos/${id}`, { headers: admin })).status, 200, `acknowledged photo ${id}`);
    t.diagnostic(server.output().split('\n').filter((l) => l.startsWith('Photo store')).join(' ') || 'photo store clean at restart');
    for (const id of acknowledged.readings) assert.equal((await fetch(`${server.url}/api/readings/${id}`, { headers: admin })).status, 200, `acknowledged reading ${id}`);
  } finally {
    await server.stop();
  }

  const db = new Database(path.join(dataDir, 'hueledger.sqlite'), { readonly: true });
  try {
    assert.equal(db.pragma('integrity_check', { simple: true }), 'ok');
    assert.deepEqual(db.pragma('foreign_key_check'), []);
    const shas = db.prepare('SELECT sha256 FROM photo').pluck().all() as string[];
    const store = path.join(dataDir, 'photos');
    for (const sha of shas) assert.ok(existsSync(path.join(store, sha.slice(0, 2), sha, 'upright.tif')), `photo ${sha} has its files`);
    const folders = readdirSync(store).filter((d) => /^[0-9a-f]{2}$/.test(d)).flatMap((d) => readdirSync(path.join(store, d)));
    const named = new Set(shas);
    assert.deepEqual(folders.filter((f) => !named.has(f)), [], 'no photo folder is left that no row names');
    assert.equal(existsSync(path.join(store, '.staging')) && readdirSync(path.join(store, '.staging')).length > 0, false, 'no half-written upload is left');
  } finally {
    db.close();
  }
});
