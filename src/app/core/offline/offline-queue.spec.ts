import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { of } from 'rxjs';

import type { UserSummary } from '../../../../shared/api/auth.js';
import { AuthStore } from '../auth/auth-store';
import { ApiError } from '../http/api-error';
import { IS_ONLINE, OfflineQueue, QUEUE_TRANSPORT, RECONNECT_RETRY_MS } from './offline-queue';
import { MemoryQueueStorage, QUEUE_STORAGE } from './queue-storage';
import { noConnection, pendingReading, refusedAccession, ScriptedTransport } from './testing/queue-fakes';

const recorder: UserSummary = { id: 7, email: 'ana@demo.test', name: 'Ana Field', role: 'recorder' };

describe('OfflineQueue', () => {
  let transport: ScriptedTransport;
  let storage: MemoryQueueStorage;
  let online: boolean;
  let queue: OfflineQueue;
  const user = signal<UserSummary | null>(recorder);
  const { body, summary } = pendingReading();

  beforeEach(() => {
    transport = new ScriptedTransport();
    storage = new MemoryQueueStorage();
    online = true;
    user.set(recorder);
    TestBed.configureTestingModule({
      providers: [
        { provide: QUEUE_STORAGE, useValue: storage },
        { provide: QUEUE_TRANSPORT, useValue: transport },
        { provide: IS_ONLINE, useValue: () => online },
        { provide: AuthStore, useValue: { currentUser: user, load: () => of(user()) } },
      ],
    });
    queue = TestBed.inject(OfflineQueue);
  });

  it('should resolve with the server answer when the reading went through at once, leaving nothing queued', async () => {
    const result = await queue.submitReading(body, summary);
    expect(result).toEqual({ queued: false, reading: expect.objectContaining({ id: 900 }) });
    expect(queue.pending()).toBe(0);
    expect(transport.readingCalls.length).toBe(1);
  });

  it('should store the reading first and resolve {queued: true} when the phone is offline', async () => {
    online = false;
    const result = await queue.submitReading(body, summary);
    expect(result.queued).toBe(true);
    expect(transport.readingCalls).toEqual([]);
    expect(queue.pending()).toBe(1);
    expect(queue.items()[0]).toEqual(expect.objectContaining({ body, summary, ownerId: 7, state: 'waiting', attempts: 0 }));
    expect(queue.items()[0]!.key).toMatch(/^[0-9a-f-]{36}$/);
  });

  it('should keep the reading queued when the attempt at once loses the connection', async () => {
    transport.readingOutcomes = [noConnection()];
    expect((await queue.submitReading(body, summary)).queued).toBe(true);
    expect(queue.pending()).toBe(1);
  });

  it('should throw a fresh reading\'s refusal to the form and not keep it', async () => {
    transport.readingOutcomes = [refusedAccession()];
    await expect(queue.submitReading(body, summary)).rejects.toEqual(expect.objectContaining({ status: 400, fieldErrors: [{ field: 'accessionId', message: 'no such accession' }] }));
    expect(queue.pending()).toBe(0);
  });

  it('should keep a photo with the reading and send it first once online, with the same keys on every resend', async () => {
    online = false;
    const blob = new Blob(['jpeg']);
    await queue.submitReading({ ...body, method: 'photo', lab: undefined }, { ...summary, provisional: true }, { blob, name: 'leaf.jpg', width: 40, height: 30, region: { shape: 'point', x: 5, y: 5, radius: 3 } });
    expect(queue.photos().length).toBe(1);
    online = true;
    transport.readingOutcomes = [noConnection()];
    await queue.sendNow();
    await queue.sendNow();
    expect(transport.photoCalls.length).toBe(1);
    expect(new Set(transport.readingCalls.map((c) => c.key)).size).toBe(1);
    expect(transport.readingCalls[1]!.body.photo).toEqual({ photoId: 500, region: { shape: 'point', x: 5, y: 5, radius: 3 } });
    expect(queue.pending()).toBe(0);
    expect(queue.photos()).toEqual([]);
  });

  it('should resend a refused reading with the recorder\'s change under a new key', async () => {
    const refused = pendingReading({ state: 'needs-attention', lastError: { status: 400, title: 'Bad request', detail: null, fieldErrors: [] } });
    await storage.putReading(refused);
    await queue.refresh();
    expect(queue.needsAttention()).toBe(1);
    await queue.resend(refused.id, { accessionId: 4 }, { accession: 'HL-0918 Amber Ring' });
    expect(transport.readingCalls[0]!.body.accessionId).toBe(4);
    expect(transport.readingCalls[0]!.key).not.toBe(refused.key);
    expect(queue.pending()).toBe(0);
  });

  it('should discard a reading and its photo', async () => {
    online = false;
    await queue.submitReading(body, summary, { blob: new Blob(['x']), name: 'a.jpg', width: 1, height: 1, region: { shape: 'point', x: 0, y: 0, radius: 1 } });
    await queue.discard(queue.items()[0]!.id);
    expect(queue.pending()).toBe(0);
    expect(await storage.photos()).toEqual([]);
  });

  it('should try again seconds after an online event when the server cannot be reached yet, not only on the half-minute tick', async () => {
    vi.useFakeTimers();
    try {
      online = false;
      await queue.submitReading(body, summary);
      online = true;
      transport.online = false;
      queue.start();
      window.dispatchEvent(new Event('online'));
      await vi.advanceTimersByTimeAsync(100);
      expect(transport.readingCalls).toEqual([]);
      // The connection carries requests a moment later: the first quick retry sends the reading.
      transport.online = true;
      await vi.advanceTimersByTimeAsync(RECONNECT_RETRY_MS[0]);
      expect(transport.readingCalls.length).toBe(1);
      expect(queue.pending()).toBe(0);
    } finally {
      TestBed.resetTestingModule();
      vi.useRealTimers();
    }
  });

  it('should refuse to queue when nobody is signed in', async () => {
    user.set(null);
    await expect(queue.submitReading(body, summary)).rejects.toBeInstanceOf(ApiError);
  });
});
