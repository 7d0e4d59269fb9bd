import { IDEMPOTENCY_PROBLEMS } from '../../../../shared/api/idempotency.js';
import { ApiError } from '../http/api-error';
import { noConnection, pendingReading, refusedAccession, ScriptedTransport } from './testing/queue-fakes';
import type { PendingPhoto } from './queue-item';
import { MemoryQueueStorage } from './queue-storage';
import { backoffMs } from './send-rules';
import { SyncRunner } from './sync-runner';

// The runner's logic over the in-memory storage (jsdom has no IndexedDB; IdbQueueStorage is a
// thin pass-through to idb, exercised by the browser test tests/e2e/offline.test.ts).
describe('SyncRunner', () => {
  let storage: MemoryQueueStorage;
  let transport: ScriptedTransport;
  let now: number;
  let runner: SyncRunner;

  beforeEach(() => {
    storage = new MemoryQueueStorage();
    transport = new ScriptedTransport();
    now = Date.parse('2026-03-01T12:00:00Z');
    runner = new SyncRunner(storage, transport, () => now);
  });

  function localPhoto(over: Partial<PendingPhoto> = {}): PendingPhoto {
    return { ...pendingReading(), blob: new Blob(['jpeg bytes']), name: 'petiole.jpg', width: 400, height: 300, region: { shape: 'rect', x: 10, y: 10, width: 50, height: 40 }, neutral: null, uploaded: null, ...over } as PendingPhoto;
  }

  it('should send a reading with its idempotency key and take it out of the queue', async () => {
    const reading = pendingReading();
    await storage.putReading(reading);
    const report = await runner.run();
    expect(transport.readingCalls).toEqual([{ body: reading.body, key: reading.key }]);
    expect(report.sent.map((s) => s.id)).toEqual([reading.id]);
    expect(await storage.readings()).toEqual([]);
  });

  it('should upload the photo first and send the reading with the server photo id in place of the local one', async () => {
    const photo = localPhoto();
    await storage.putPhoto(photo);
    const reading = pendingReading({ body: { accessionId: 3, characterId: 11, method: 'photo', light: 'overcast', photo: { localPhotoId: photo.id, region: photo.region! } } });
    await storage.putReading(reading);
    const report = await runner.run();
    expect(transport.photoCalls).toEqual([{ name: 'petiole.jpg', key: photo.key }]);
    expect(transport.readingCalls[0]!.body.photo).toEqual({ photoId: 500, region: photo.region });
    expect(report.photosSent).toBe(1);
    expect(await storage.photos()).toEqual([]);
  });

  it('should keep everything queued when the server cannot be reached, without calling it', async () => {
    transport.online = false;
    await storage.putReading(pendingReading());
    const report = await runner.run();
    expect(report.offline).toBe(true);
    expect(transport.readingCalls).toEqual([]);
    expect((await storage.readings()).length).toBe(1);
  });

  it('should keep a reading waiting with a backoff after a lost connection and stop the run', async () => {
    const [first, second] = [pendingReading({ createdAt: '2026-03-01T09:00:00Z' }), pendingReading({ createdAt: '2026-03-01T09:05:00Z' })];
    await storage.putReading(first);
    await storage.putReading(second);
    transport.readingOutcomes = [noConnection()];
    const report = await runner.run();
    expect(report.offline).toBe(true);
    expect(transport.readingCalls.length).toBe(1);
    const kept = (await storage.reading(first.id))!;
    expect(kept.state).toBe('waiting');
    expect(kept.attempts).toBe(1);
    expect(kept.lastError?.status).toBe(0);
    expect(kept.nextAttemptAt).toBe(now + backoffMs(1));
  });

  it('should not retry before the backoff has passed unless forced (Send now)', async () => {
    await storage.putReading(pendingReading({ attempts: 2, nextAttemptAt: now + 60_000 }));
    await runner.run();
    expect(transport.readingCalls.length).toBe(0);
    await runner.run({ force: true });
    expect(transport.readingCalls.length).toBe(1);
  });

  it('should keep a 5xx answer queued for retry', async () => {
    const reading = pendingReading();
    await storage.putReading(reading);
    transport.readingOutcomes = [new ApiError(503, 'Service unavailable')];
    await runner.run();
    expect((await storage.reading(reading.id))!.state).toBe('waiting');
  });

  it('should mark a 400 refusal "needs attention" with the server words and keep it, then go on with the next', async () => {
    const [refused, fine] = [pendingReading({ createdAt: '2026-03-01T09:00:00Z' }), pendingReading({ createdAt: '2026-03-01T09:05:00Z' })];
    await storage.putReading(refused);
    await storage.putReading(fine);
    transport.readingOutcomes = [refusedAccession()];
    const report = await runner.run();
    const kept = (await storage.reading(refused.id))!;
    expect(kept.state).toBe('needs-attention');
    expect(kept.lastError).toEqual({ status: 400, title: 'Bad request', detail: 'No accession 3: it may have been renamed or removed.', fieldErrors: [{ field: 'accessionId', message: 'no such accession' }] });
    expect(report.sent.map((s) => s.id)).toEqual([fine.id]);
    // Not sent again by later runs, forced or not, until the recorder changes or discards it.
    await runner.run({ force: true });
    expect(transport.readingCalls.length).toBe(2);
  });

  it('should treat a 409 "key still in use" as a retry but another 409 as needing attention', async () => {
    const [busy, conflict] = [pendingReading({ createdAt: '2026-03-01T09:00:00Z' }), pendingReading({ createdAt: '2026-03-01T09:05:00Z' })];
    await storage.putReading(busy);
    await storage.putReading(conflict);
    transport.readingOutcomes = [
      new ApiError(409, 'Request still running', null, [], `https://hueledger.invalid/problems/${IDEMPOTENCY_PROBLEMS.inUse}`),
      new ApiError(409, 'Conflict', 'The character was retired.', [], 'https://hueledger.invalid/problems/conflict'),
    ];
    await runner.run();
    expect((await storage.reading(busy.id))!.state).toBe('waiting');
    expect((await storage.reading(conflict.id))!.state).toBe('needs-attention');
  });

  it('should mark the reading of a refused photo "needs attention" without sending it', async () => {
    const photo = localPhoto();
    await storage.putPhoto(photo);
    const reading = pendingReading({ body: { accessionId: 3, characterId: 11, method: 'photo', light: 'overcast', photo: { localPhotoId: photo.id, region: photo.region! } } });
    await storage.putReading(reading);
    transport.photoOutcomes = [new ApiError(415, 'Not a photo', 'The file is not an image the server can read.')];
    await runner.run();
    expect(transport.readingCalls).toEqual([]);
    expect((await storage.photo(photo.id))!.state).toBe('needs-attention');
    const kept = (await storage.reading(reading.id))!;
    expect(kept.state).toBe('needs-attention');
    expect(kept.lastError?.title).toContain('Its photo was refused');
  });

  it('should not upload a photo twice when its reading failed after the upload', async () => {
    const photo = localPhoto();
    await storage.putPhoto(photo);
    const reading = pendingReading({ body: { accessionId: 3, characterId: 11, method: 'photo', light: 'overcast', photo: { localPhotoId: photo.id, region: photo.region! } } });
    await storage.putReading(reading);
    transport.readingOutcomes = [new ApiError(502, 'Bad gateway')];
    await runner.run();
    await runner.run({ force: true });
    expect(transport.photoCalls.length).toBe(1);
    expect(transport.readingCalls.map((c) => c.key)).toEqual([reading.key, reading.key]);
    expect(transport.readingCalls[1]!.body.photo).toEqual({ photoId: 500, region: photo.region });
  });

  it('should send only the signed-in person\'s items on a shared phone', async () => {
    await storage.putReading(pendingReading({ ownerId: 7 }));
    await storage.putReading(pendingReading({ ownerId: 8 }));
    await runner.run({ ownerId: 8 });
    expect(transport.readingCalls.length).toBe(1);
    expect((await storage.readings()).map((r) => r.ownerId)).toEqual([7]);
  });

  it('should double the wait after each failure, up to 15 minutes', () => {
    expect([1, 2, 3, 4, 5, 6, 7].map(backoffMs)).toEqual([30_000, 60_000, 120_000, 240_000, 480_000, 900_000, 900_000]);
  });
});
