// Uploading photos: type sniffed from the bytes, content-addressed storage, refusals that leave
// nothing behind, the display copies, and who may call each photo route.
import assert from 'node:assert/strict';
import path from 'node:path';
import { after, before, describe, test } from 'node:test';
import sharp from 'sharp';
import { ROLES, type Role } from '../../shared/api/auth.js';
import { PHOTO_DISPLAY_MAX_SIDE, PHOTO_MAX_BYTES, PHOTO_THUMB_MAX_SIDE, type PhotoDto } from '../../shared/api/photo-answers.js';
import { AuditEvent } from '../../server/audit/audit-event.entity.js';
import { assertProblem } from './assert-problem.js';
import { createApp } from '../../server/app.js';
import { Client, PUBLIC_URL, rowCounts, signedInAs, startHarness, TEST_SECRET, type Harness } from './harness.js';
import { filesUnder, fromRaw, paintScene, uploadPhoto } from './photo-fixtures.js';

let h: Harness;
const clients = new Map<Role, Client>();
let photosDir: string;

before(async () => {
  h = await startHarness();
  for (const role of ROLES) clients.set(role, await signedInAs(h, role));
  photosDir = path.join(h.dir, 'photos');
});
after(() => h.close());

const recorder = () => clients.get('recorder')!;

/** A small PNG whose colour depends on `n`, so each call gives new bytes. */
function smallPng(n: number, width = 64, height = 48): Promise<Buffer> {
  return fromRaw(paintScene(width, height, [(n * 37) % 256, (n * 91) % 256, 120], []), width, height).png().toBuffer();
}
let counter = 0;
const fresh = () => smallPng(++counter);

/** Row counts and every file under the photo folder: a refusal must change neither. */
async function stored(): Promise<string> {
  return JSON.stringify([await rowCounts(h.ds), filesUnder(photosDir).sort()]);
}

describe('uploading a photo', () => {
  test('should store a JPEG and answer its upright size, hash, profile and capture time', async () => {
    const bytes = await fromRaw(paintScene(120, 80, [90, 140, 60], []), 120, 80)
      .jpeg({ quality: 90 })
      .withExif({ IFD0: { Make: 'Field phone' }, IFD2: { DateTimeOriginal: '2026:03:14 09:30:05', OffsetTimeOriginal: '+10:00' } })
      .toBuffer();
    const res = await uploadPhoto(recorder(), bytes);
    assert.equal(res.status, 201, res.text);
    const photo = res.body as PhotoDto;
    assert.equal(res.headers['location'], `/api/photos/${photo.id}`);
    assert.deepEqual([photo.width, photo.height, photo.mime, photo.sourceProfile, photo.orientation, photo.byteSize], [120, 80, 'image/jpeg', 'none', 1, bytes.length]);
    assert.match(photo.sha256, /^[0-9a-f]{64}$/);
    assert.equal(photo.capturedAt, '2026-03-14T09:30:05+10:00');
    const files = filesUnder(path.join(photosDir, photo.sha256.slice(0, 2), photo.sha256)).sort();
    assert.deepEqual(files, ['display.jpg', 'original.jpg', 'thumb.jpg', 'upright.tif']);
    const audit = await h.ds.getRepository(AuditEvent).findOneBy({ action: 'photo.uploaded', subject: `photo:${photo.id}` });
    assert.ok(audit, 'the upload is audited');
  });

  test('should return the same photo (200) when the same bytes come again, under any name', async () => {
    const bytes = await fresh();
    const first = await uploadPhoto(recorder(), bytes, 'one.png', 'image/png');
    assert.equal(first.status, 201);
    const rows = (await rowCounts(h.ds))['photo'];
    const again = await uploadPhoto(clients.get('trainer')!, bytes, 'other-name.jpg', 'image/jpeg');
    assert.equal(again.status, 200, again.text);
    assert.equal((again.body as PhotoDto).id, (first.body as PhotoDto).id);
    assert.equal((await rowCounts(h.ds))['photo'], rows);
  });

  test('should take the type from the bytes, not the name or the declared type', async () => {
    const res = await uploadPhoto(recorder(), await fresh(), 'leaf.jpg', 'image/jpeg');
    assert.equal(res.status, 201);
    assert.equal((res.body as PhotoDto).mime, 'image/png');
  });

  test('should ignore the name a file arrives with: path tricks write nothing outside the photo store', async () => {
    const outside = () => filesUnder(h.dir).filter((f) => !f.startsWith(`photos${path.sep}`)).sort();
    const before = outside();
    for (const name of ['../../../escaped.jpg', '..\\..\\escaped.jpg', '/etc/escaped.jpg', '%2e%2e%2fescaped.jpg', 'CON.jpg', `${'x'.repeat(300)}.jpg`]) {
      const res = await uploadPhoto(recorder(), await fresh(), name, 'image/png');
      assert.equal(res.status, 201, `${JSON.stringify(name)}: ${res.text}`);
    }
    // A NUL inside the name breaks the multipart header itself: refused as a broken body.
    assertProblem(await uploadPhoto(recorder(), await fresh(), 'a\u0000b.jpg', 'image/png'), 400);
    assert.deepEqual(outside(), before);
    // Every stored file has one of the store's own names inside a folder named by the content's SHA-256.
    for (const f of filesUnder(photosDir)) assert.match(f.split(path.sep).join('/'), /^[0-9a-f]{2}\/[0-9a-f]{64}\/(original\.(jpg|png|webp|heif|heic|avif|tif)|upright\.tif|display\.jpg|thumb\.jpg)$/);
  });

  test('should name the embedded profile of a Display P3 photo', async () => {
    const bytes = await fromRaw(paintScene(40, 40, [200, 40, 120], []), 40, 40).withIccProfile('p3').jpeg().toBuffer();
    const photo = (await uploadPhoto(recorder(), bytes)).body as PhotoDto;
    // sharp's built-in Display P3 profile calls itself "sP3C"; phones write "Display P3".
    assert.equal(photo.sourceProfile, 'sP3C');
  });

  test('should serve an upright display copy and a thumbnail, cacheable, within their sizes', async () => {
    const bytes = await fromRaw(paintScene(3000, 1000, [60, 110, 50], []), 3000, 1000).jpeg().withMetadata({ orientation: 6 }).toBuffer();
    const photo = (await uploadPhoto(recorder(), bytes)).body as PhotoDto;
    assert.deepEqual([photo.width, photo.height], [1000, 3000]);
    const image = await recorder().get(photo.imageUrl).expect(200);
    assert.match(String(image.headers['content-type']), /^image\/jpeg/);
    assert.match(String(image.headers['cache-control']), /immutable/);
    const shown = await sharp(image.body as Buffer).metadata();
    assert.deepEqual([shown.width, shown.height], [Math.round((PHOTO_DISPLAY_MAX_SIDE * 1000) / 3000), PHOTO_DISPLAY_MAX_SIDE]);
    const thumb = await sharp((await recorder().get(photo.thumbUrl).expect(200)).body as Buffer).metadata();
    assert.equal(Math.max(thumb.width, thumb.height), PHOTO_THUMB_MAX_SIDE);
    const meta = await recorder().get(`/api/photos/${photo.id}`).expect(200);
    assert.deepEqual(meta.body, photo);
  });
});

describe('refused uploads leave nothing behind', () => {
  const cases: [string, () => Promise<{ bytes: Buffer; name?: string; type?: string }>, number, RegExp][] = [
    ['a text file named like a photo', async () => ({ bytes: Buffer.from('Not a photo, only words about a leaf.\n'.repeat(50)), name: 'leaf.jpg' }), 415, /not an image/i],
    ['an SVG drawing', async () => ({ bytes: Buffer.from('<svg xmlns="http://www.w3.org/2000/svg" width="40" height="40"><rect width="40" height="40" fill="#7b3f6e"/></svg>'), name: 'chip.svg', type: 'image/svg+xml' }), 415, /SVG/],
    ['a GIF', async () => ({ bytes: await fromRaw(paintScene(20, 20, [10, 200, 30], []), 20, 20).gif().toBuffer(), name: 'leaf.gif', type: 'image/gif' }), 415, /GIF/],
    ['a truncated JPEG', async () => {
      const noisy = paintScene(600, 400, [120, 60, 90], []).map((v, i) => (v + i) % 256);
      const whole = await fromRaw(Buffer.from(noisy), 600, 400).jpeg().toBuffer();
      return { bytes: whole.subarray(0, Math.floor(whole.length / 2)) };
    }, 400, /damaged or incomplete/],
    ['a pixel bomb (120 megapixels in a few hundred kilobytes)', async () => ({
      bytes: await sharp({ create: { width: 12000, height: 10000, channels: 3, background: '#808080' } }).png({ compressionLevel: 9 }).toBuffer(),
      name: 'bomb.png',
      type: 'image/png',
    }), 413, /megapixels/],
    ['a file over 25 MB', async () => {
      const bytes = Buffer.alloc(PHOTO_MAX_BYTES + 1024 * 1024, 0x41);
      bytes.set([0xff, 0xd8, 0xff, 0xe0]);
      return { bytes };
    }, 413, /larger than 25 MB/],
  ];
  for (const [what, make, status, detail] of cases) {
    test(`should refuse ${what} with ${status} problem+json, storing no row and no file`, async () => {
      const { bytes, name, type } = await make();
      const before = await stored();
      const problem = assertProblem(await uploadPhoto(recorder(), bytes, name, type), status);
      assert.match(problem.detail ?? '', detail);
      assert.equal(await stored(), before);
      assert.deepEqual(filesUnder(path.join(photosDir, '.staging')), [], 'no staged file is left');
    });
  }

  test('should refuse a body that is not multipart with 415, and a multipart body without the photo field with 400', async () => {
    const before = await stored();
    assertProblem(await recorder().post('/api/photos', { photo: 'abc' }), 415);
    assertProblem(await recorder().raw('post', '/api/photos').field('note', 'no file here'), 400);
    assertProblem(await recorder().raw('post', '/api/photos').attach('picture', await fresh(), 'leaf.png'), 400);
    assert.equal(await stored(), before);
  });
});

describe('unknown photos', () => {
  for (const suffix of ['', '/image', '/thumb']) {
    test(`should answer 404 problem+json for GET /api/photos/:id${suffix} of a photo that does not exist`, async () => {
      assertProblem(await recorder().get(`/api/photos/999999${suffix}`), 404);
      assertProblem(await recorder().get(`/api/photos/not-a-number${suffix}`), 404);
    });
  }
  test('should answer 404 for sampling a photo that does not exist', async () => {
    assertProblem(await recorder().post('/api/photos/999999/sample', { region: { shape: 'rect', x: 0, y: 0, width: 5, height: 5 } }), 404);
  });
});

describe('who may call the photo routes', () => {
  const UPLOADERS: readonly Role[] = ['recorder', 'trainer', 'admin'];
  let photo: PhotoDto;
  before(async () => {
    photo = (await uploadPhoto(clients.get('admin')!, await fresh())).body as PhotoDto;
  });
  const region = { shape: 'rect', x: 5, y: 5, width: 10, height: 10 };

  for (const role of ROLES) {
    if (UPLOADERS.includes(role)) {
      test(`should let a ${role} upload (201)`, async () => {
        assert.equal((await uploadPhoto(clients.get(role)!, await fresh())).status, 201);
      });
    } else {
      test(`should refuse a ${role} an upload with 403, storing nothing`, async () => {
        const before = await stored();
        assertProblem(await uploadPhoto(clients.get(role)!, await fresh()), 403);
        assert.equal(await stored(), before);
      });
    }
    test(`should let a ${role} view and sample a photo`, async () => {
      const c = clients.get(role)!;
      await c.get(`/api/photos/${photo.id}`).expect(200);
      await c.get(photo.imageUrl).expect(200);
      await c.get(photo.thumbUrl).expect(200);
      assert.equal((await c.post(`/api/photos/${photo.id}/sample`, { region })).status, 200);
    });
  }

  test('should answer 401 to every photo route when signed out, storing nothing', async () => {
    const visitor = await new Client(h.app).prime();
    const before = await stored();
    assertProblem(await uploadPhoto(visitor, await fresh()), 401);
    assertProblem(await visitor.get(`/api/photos/${photo.id}`), 401);
    assertProblem(await visitor.get(photo.imageUrl), 401);
    assertProblem(await visitor.get(photo.thumbUrl), 401);
    assertProblem(await visitor.post(`/api/photos/${photo.id}/sample`, { region }), 401);
    assert.equal(await stored(), before);
  });
});

describe('an app started without a data folder', () => {
  test('should answer 503 problem+json on the photo routes instead of writing somewhere unplanned', async () => {
    const app = createApp({ dataSource: h.ds, mailer: h.mailer, sessionSecret: TEST_SECRET, publicUrl: PUBLIC_URL, logError: () => {} });
    const client = await new Client(app).prime();
    assertProblem(await uploadPhoto(client, await fresh()), 503);
    assertProblem(await client.get('/api/photos/1'), 503);
  });
});
