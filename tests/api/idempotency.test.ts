// Resending a photo or a reading with the same Idempotency-Key stores nothing twice: the first
// request runs, a resend replays its answer, another body under the key is refused, keys are per
// user, and a refusal gives the key back. The offline queue on the phones relies on all of this.
import assert from 'node:assert/strict';
import { randomUUID } from 'node:crypto';
import { after, before, describe, test } from 'node:test';
import { IDEMPOTENCY_HEADER, IDEMPOTENCY_PROBLEMS, REPLAYED_HEADER } from '../../shared/api/idempotency.js';
import { ABANDONED_AFTER_MS, purgeExpiredKeys } from '../../server/idempotency/idempotency.js';
import { IdempotencyKey } from '../../server/idempotency/idempotency-key.entity.js';
import { Photo } from '../../server/photos/photo.entity.js';
import { assertProblem } from './assert-problem.js';
import { rowCounts, signedInAs, startHarness, type Client, type Harness } from './harness.js';
import { fromRaw, paintScene, uploadPhoto } from './photo-fixtures.js';

let h: Harness;
let alice: Client;
let bruno: Client;

before(async () => {
  h = await startHarness();
  alice = await signedInAs(h, 'recorder');
  bruno = await signedInAs(h, 'recorder');
});
after(() => h.close());

let counter = 0;
/** A small PNG with new bytes on every call. */
function freshPng(): Promise<Buffer> {
  const n = ++counter;
  return fromRaw(paintScene(24, 16, [(n * 53) % 256, (n * 29) % 256, 90], []), 24, 16).png().toBuffer();
}

const upload = (client: Client, bytes: Buffer, key?: string) => {
  const req = uploadPhoto(client, bytes, 'leaf.png', 'image/png');
  return key === undefined ? req : req.set(IDEMPOTENCY_HEADER, key);
};

const photoCount = () => h.ds.getRepository(Photo).count();
const keyRows = () => h.ds.getRepository(IdempotencyKey).count();

describe('POST /api/photos with an Idempotency-Key', () => {
  test('a resend answers the same body with Idempotent-Replayed and stores nothing new', async () => {
    const key = randomUUID();
    const bytes = await freshPng();
    const first = await upload(alice, bytes, key).expect(201);
    assert.equal(first.headers[REPLAYED_HEADER.toLowerCase()], undefined, 'the first answer is not a replay');
    const before = await rowCounts(h.ds);
    const again = await upload(alice, bytes, key).expect(201);
    assert.equal(again.headers[REPLAYED_HEADER.toLowerCase()], 'true');
    assert.deepEqual(again.body, first.body);
    assert.equal(again.headers['location'], first.headers['location']);
    assert.deepEqual(await rowCounts(h.ds), before, 'a replay writes nothing, not even an audit event');
  });

  test('the same key with another photo is refused with 422 naming the header', async () => {
    const key = randomUUID();
    await upload(alice, await freshPng(), key).expect(201);
    const before = await rowCounts(h.ds);
    const problem = assertProblem(await upload(alice, await freshPng(), key), 422);
    assert.ok(problem.type.endsWith(IDEMPOTENCY_PROBLEMS.reused), problem.type);
    assert.equal(problem.errors?.[0]?.field, IDEMPOTENCY_HEADER);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('keys are per user: two recorders may send the same key', async () => {
    const key = `shared-${randomUUID()}`;
    const a = await upload(alice, await freshPng(), key).expect(201);
    const b = await upload(bruno, await freshPng(), key).expect(201);
    assert.notEqual(a.body.id, b.body.id);
    assert.equal(b.headers[REPLAYED_HEADER.toLowerCase()], undefined);
  });

  for (const bad of ['has space', 'x'.repeat(101), 'semi;colon', 'ünïcode', '']) {
    test(`a bad key ${JSON.stringify(bad.length > 20 ? `${bad.slice(0, 5)}… (${bad.length} chars)` : bad)} is a 400 problem naming the header, with nothing written`, async () => {
      const before = await rowCounts(h.ds);
      const problem = assertProblem(await upload(alice, await freshPng(), bad), 400);
      assert.ok(problem.type.endsWith(IDEMPOTENCY_PROBLEMS.invalid), problem.type);
      assert.equal(problem.errors?.[0]?.field, IDEMPOTENCY_HEADER);
      assert.deepEqual(await rowCounts(h.ds), before);
    });
  }

  test('without the header the route behaves as before (the same bytes are the same photo, 200)', async () => {
    const bytes = await freshPng();
    const keysBefore = await keyRows();
    const first = await upload(alice, bytes).expect(201);
    const second = await upload(alice, bytes).expect(200);
    assert.equal(second.body.id, first.body.id);
    assert.equal(second.headers[REPLAYED_HEADER.toLowerCase()], undefined);
    assert.equal(await keyRows(), keysBefore, 'no key is stored without the header');
  });

  test('a refused upload gives the key back: nothing is written and a corrected resend runs', async () => {
    const key = randomUUID();
    const before = await rowCounts(h.ds);
    assertProblem(await uploadPhoto(alice, Buffer.from('not a picture at all'), 'leaf.png', 'image/png').set(IDEMPOTENCY_HEADER, key), 415);
    assert.deepEqual(await rowCounts(h.ds), before, 'neither a photo nor a key row');
    await upload(alice, await freshPng(), key).expect(201);
  });

  test('a resend while the first is still running is a 409 to retry; one abandoned long ago runs again', async () => {
    const bytes = await freshPng();
    const user = await h.ds.query(`SELECT id FROM "user" ORDER BY id DESC LIMIT 1`) as { id: number }[];
    // bruno is the newest user; his key's first request is "running" (a reservation without an answer).
    const bodyHashOf = async (key: string) => {
      // Learn the body hash the server computes by letting a throwaway key run, then reading it back.
      await upload(bruno, bytes, key).expect((res) => assert.ok(res.status === 201 || res.status === 200));
      const row = await h.ds.getRepository(IdempotencyKey).findOneByOrFail({ userId: user[0]!.id, key });
      return row.bodyHash;
    };
    const hash = await bodyHashOf(randomUUID());
    const running = randomUUID();
    const repo = h.ds.getRepository(IdempotencyKey);
    await repo.insert({ key: running, userId: user[0]!.id, method: 'POST', path: '/api/photos', bodyHash: hash, status: null, location: null, createdAt: new Date() });
    const problem = assertProblem(await upload(bruno, bytes, running), 409);
    assert.ok(problem.type.endsWith(IDEMPOTENCY_PROBLEMS.inUse), problem.type);

    const abandoned = randomUUID();
    await repo.insert({ key: abandoned, userId: user[0]!.id, method: 'POST', path: '/api/photos', bodyHash: hash, status: null, location: null, createdAt: new Date(Date.now() - ABANDONED_AFTER_MS - 60_000) });
    const res = await upload(bruno, bytes, abandoned);
    assert.equal(res.status, 200, 'it ran again (the photo already exists, so 200)');
    assert.equal((await repo.findOneByOrFail({ userId: user[0]!.id, key: abandoned })).status, 200);
  });
});

describe('keeping keys', () => {
  test('keys older than 7 days are purged, younger ones kept', async () => {
    const repo = h.ds.getRepository(IdempotencyKey);
    const [{ id: userId }] = (await h.ds.query(`SELECT id FROM "user" ORDER BY id LIMIT 1`)) as { id: number }[];
    const now = new Date('2026-06-15T12:00:00Z');
    const day = 24 * 60 * 60 * 1000;
    const row = (key: string, age: number) => ({ key, userId, method: 'POST', path: '/api/photos', bodyHash: 'a'.repeat(64), status: 201, location: null, createdAt: new Date(now.getTime() - age) });
    await repo.insert([row('old-8d', 8 * day), row('old-7d1m', 7 * day + 60_000), row('young-6d', 6 * day)]);
    assert.equal(await purgeExpiredKeys(h.ds, now), 2);
    assert.deepEqual((await repo.findBy({ userId })).map((r) => r.key).filter((k) => k.startsWith('old') || k.startsWith('young')), ['young-6d']);
  });
});

describe('concurrent duplicates', () => {
  test('ten identical photo uploads at once store one photo and one key; each answer is that photo or a 409 to retry', async () => {
    const key = randomUUID();
    const bytes = await freshPng();
    const before = await photoCount();
    const answers = await Promise.all(Array.from({ length: 10 }, () => upload(alice, bytes, key)));
    for (const res of answers) assert.ok(res.status === 201 || res.status === 409, `${res.status}: ${res.text}`);
    const ids = new Set(answers.filter((r) => r.status === 201).map((r) => r.body.id));
    assert.equal(ids.size, 1, 'every success names the same photo');
    assert.equal(await photoCount(), before + 1);
    assert.equal(await h.ds.getRepository(IdempotencyKey).countBy({ key }), 1);
  });
});

describe('POST /api/readings with an Idempotency-Key', () => {
  let hd: Harness;
  let ana: Client;
  let body: Record<string, unknown>;

  before(async () => {
    hd = await startHarness({ demo: true });
    ana = await signedInAs(hd, 'recorder');
    const [accession] = (await hd.ds.query(`SELECT id FROM accession ORDER BY id LIMIT 1`)) as { id: number }[];
    const [character] = (await hd.ds.query(`SELECT id FROM character WHERE colour = 1 AND active = 1 ORDER BY id LIMIT 1`)) as { id: number }[];
    // An instrument reading (CIELAB D65 typed in); the values are an invented petiole purple.
    body = { accessionId: accession!.id, characterId: character!.id, method: 'instrument', lab: [38.5, 24.2, -9.6], light: 'overcast', observedAt: '2026-03-01T10:00:00+10:00' };
  });
  after(() => hd.close());

  const readings = () => hd.ds.query(`SELECT COUNT(*) AS n FROM reading`).then((r: { n: number }[]) => r[0]!.n);
  const post = (client: Client, b: object, key?: string) => (key === undefined ? client.post('/api/readings', b) : client.post('/api/readings', b).set(IDEMPOTENCY_HEADER, key));

  test('a resend creates no second reading and answers the same body, marked as replayed', async () => {
    const key = randomUUID();
    const before = await readings();
    const first = await post(ana, body, key).expect(201);
    const again = await post(ana, body, key).expect(201);
    assert.equal(again.headers[REPLAYED_HEADER.toLowerCase()], 'true');
    assert.deepEqual(again.body, first.body);
    assert.equal(await readings(), before + 1);
  });

  test('the same key with another body is a 422 and stores nothing', async () => {
    const key = randomUUID();
    await post(ana, body, key).expect(201);
    const counts = await rowCounts(hd.ds);
    const problem = assertProblem(await post(ana, { ...body, lab: [40, 20, -5] }, key), 422);
    assert.ok(problem.type.endsWith(IDEMPOTENCY_PROBLEMS.reused));
    assert.deepEqual(await rowCounts(hd.ds), counts);
  });

  test('keys are per user: another recorder with the same key gets a reading of their own', async () => {
    const key = randomUUID();
    const other = await signedInAs(hd, 'recorder');
    const a = await post(ana, body, key).expect(201);
    const b = await post(other, body, key).expect(201);
    assert.notEqual(a.body.id, b.body.id);
  });

  test('ten identical requests at once store exactly one reading', async () => {
    const key = randomUUID();
    const before = await readings();
    const answers = await Promise.all(Array.from({ length: 10 }, () => post(ana, body, key)));
    for (const res of answers) assert.ok(res.status === 201 || res.status === 409, `${res.status}: ${res.text}`);
    const ids = new Set(answers.filter((r) => r.status === 201).map((r) => r.body.id));
    assert.equal(ids.size, 1, 'every success names the one reading');
    assert.equal(await readings(), before + 1);
    // Once the first has finished, a resend is answered with it.
    const late = await post(ana, body, key).expect(201);
    assert.equal(late.body.id, [...ids][0]);
  });

  test('a refused reading writes nothing, not even its key, and a corrected resend with the key runs', async () => {
    const key = randomUUID();
    const counts = await rowCounts(hd.ds);
    assertProblem(await post(ana, { ...body, accessionId: 999_999 }, key), 400);
    assert.deepEqual(await rowCounts(hd.ds), counts, 'neither a reading, an audit event nor a key');
    await post(ana, body, key).expect(201);
  });

  test('a bad key is a 400 problem naming the header, with nothing written', async () => {
    const counts = await rowCounts(hd.ds);
    const problem = assertProblem(await post(ana, body, 'not a key!'), 400);
    assert.equal(problem.errors?.[0]?.field, IDEMPOTENCY_HEADER);
    assert.deepEqual(await rowCounts(hd.ds), counts);
  });

  test('without the header each request stores a reading, as before', async () => {
    const before = await readings();
    await post(ana, body).expect(201);
    await post(ana, body).expect(201);
    assert.equal(await readings(), before + 2);
  });
});
