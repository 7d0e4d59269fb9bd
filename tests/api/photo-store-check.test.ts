// The start-up check of the photo store: what a stop in the middle of an upload can leave behind
// (a staging folder, a placed folder whose row never committed) is cleaned up or moved aside, and
// a row whose files are gone is reported.
import { after, before, test } from 'node:test';
import assert from 'node:assert/strict';
import { cpSync, existsSync, mkdirSync, rmSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { PhotoFiles } from '../../server/photos/photo-files.js';
import { checkPhotoStore, ORPHANED_DIR } from '../../server/photos/photo-store-check.js';
import { signedInAs, startHarness, type Harness } from './harness.js';
import { fromRaw, paintScene, uploadPhoto } from './photo-fixtures.js';

let h: Harness;
let files: PhotoFiles;
const ids: { id: number; sha256: string }[] = [];

before(async () => {
  h = await startHarness();
  files = new PhotoFiles(path.join(h.dir, 'photos'));
  const recorder = await signedInAs(h, 'recorder');
  for (const n of [1, 2]) {
    const png = await fromRaw(paintScene(16, 16, [60 * n, 90, 120], []), 16, 16).png().toBuffer();
    const res = await uploadPhoto(recorder, png, 'leaf.png', 'image/png');
    assert.equal(res.status, 201, res.text);
    ids.push({ id: res.body.id, sha256: res.body.sha256 });
  }
});
after(() => h.close());

test('a clean store reports nothing and changes nothing', async () => {
  assert.deepEqual(await checkPhotoStore(h.ds, files), { missing: [], orphaned: [], staged: 0 });
});

test('removes staging leftovers, moves an unreferenced folder aside, and reports a row without files', async () => {
  const [keep, lose] = ids as [{ id: number; sha256: string }, { id: number; sha256: string }];
  // A half-written upload.
  mkdirSync(path.join(files.root, '.staging', 'abc123'), { recursive: true });
  writeFileSync(path.join(files.root, '.staging', 'abc123', 'original.jpg'), 'partial');
  // A folder placed whose row never committed: a copy of a real one under another hash.
  const orphan = 'f'.repeat(64);
  cpSync(files.folder(keep.sha256), files.folder(orphan), { recursive: true });
  // A row whose files are gone.
  rmSync(files.folder(lose.sha256), { recursive: true });

  const report = await checkPhotoStore(h.ds, files);
  assert.equal(report.staged, 1);
  assert.deepEqual(report.orphaned, [orphan]);
  assert.deepEqual(report.missing, [lose]);
  assert.equal(existsSync(path.join(files.root, '.staging')), false);
  assert.equal(existsSync(files.folder(orphan)), false);
  assert.ok(existsSync(path.join(files.root, ORPHANED_DIR, orphan, 'upright.tif')), 'the orphan is kept, aside');
  assert.ok(existsSync(files.folder(keep.sha256)), 'a referenced folder stays');
});
