import { DestroyRef, Injectable, InjectionToken, computed, inject, signal } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { ApiError } from '../http/api-error';
import { AuthStore } from '../auth/auth-store';
import type { ReadingDetail } from '../../../../shared/api/reading-answers.js';
import { HttpQueueTransport } from './http-queue-transport';
import { newQueueKey, type LocalPhotoRef, type PendingPhoto, type PendingReading, type QueuedReadingBody, type ReadingSummary } from './queue-item';
import { QUEUE_STORAGE } from './queue-storage';
import { SyncRunner, type QueueTransport, type RunOptions, type RunReport } from './sync-runner';

/** How the queue reaches the server; HttpClient in the app. */
export const QUEUE_TRANSPORT = new InjectionToken<QueueTransport>('QUEUE_TRANSPORT', { providedIn: 'root', factory: () => inject(HttpQueueTransport) });

/** Whether the browser believes it is online; a function so specs can decide. */
export const IS_ONLINE = new InjectionToken<() => boolean>('IS_ONLINE', { providedIn: 'root', factory: () => () => typeof navigator === 'undefined' || navigator.onLine !== false });

/** How often due items are retried while the app is open (our own: each item's backoff decides whether it goes). */
const TICK_MS = 30_000;

/**
 * After the browser's `online` event, when the server cannot be reached yet, try again after these
 * waits before leaving it to the half-minute tick (our own: a phone that re-joins a network often
 * reports "online" a few seconds before requests get through).
 */
export const RECONNECT_RETRY_MS = [2_000, 5_000, 10_000] as const;

/** What `submitReading` resolves with: the server's answer, or word that it waits in the queue. */
export type SubmitResult = { queued: false; reading: ReadingDetail } | { queued: true; id: string };

/** A photo taken out of range, to keep until it can be uploaded. */
export interface NewPhoto {
  blob: Blob;
  name: string;
  width: number;
  height: number;
}

/**
 * The offline queue: readings and photos saved on the phone first, sent when the server can be
 * reached (at start, on the browser's `online` event and again 2, 5 and 10 s later while the server
 * is not reachable yet, every half minute while items are due, and
 * on "Send now"), each with its idempotency key so a resend never stores a reading twice.
 */
@Injectable({ providedIn: 'root' })
export class OfflineQueue {
  private readonly storage = inject(QUEUE_STORAGE);
  private readonly auth = inject(AuthStore);
  private readonly online = inject(IS_ONLINE);
  private readonly runner = new SyncRunner(this.storage, inject(QUEUE_TRANSPORT));
  private readonly readingList = signal<PendingReading[]>([]);
  private readonly photoList = signal<PendingPhoto[]>([]);
  private readonly busy = signal(false);
  private current: Promise<RunReport> | null = null;
  private started = false;
  /** Answers of readings sent by any run, so a save that raced a background run still gets its answer. */
  private readonly answers = new Map<string, ReadingDetail>();

  /** Readings waiting to be sent, oldest first (including those that need the recorder). */
  readonly items = this.readingList.asReadonly();
  /** Photos on the phone not yet uploaded. */
  readonly photos = this.photoList.asReadonly();
  /** How many readings wait to be sent. */
  readonly pending = computed(() => this.readingList().length);
  /** How many of them the server refused and wait for the recorder. */
  readonly needsAttention = computed(() => this.readingList().filter((r) => r.state === 'needs-attention').length);
  /** Whether a run is sending now. */
  readonly sending = this.busy.asReadonly();

  constructor() {
    inject(DestroyRef).onDestroy(() => this.stop());
  }

  /** Loads the queue and starts sending: now, on every `online` event and on a slow tick. */
  start(): void {
    if (this.started) return;
    this.started = true;
    window.addEventListener('online', this.onOnline);
    this.tick = setInterval(() => void this.sendDue(), TICK_MS);
    // After the session is known (app start asks for it in parallel), send what waits.
    void Promise.all([this.refresh(), firstValueFrom(this.auth.load()).catch(() => null)]).then(() => this.sendDue());
  }

  /**
   * Saves a reading in the queue, then tries to send it at once when online. Resolves with the
   * server's answer when it went through, or `{queued: true}` when it waits (no connection, server
   * trouble). A refusal of this fresh reading (400, 409 …) is thrown as the server's ApiError and
   * the reading leaves the queue: the form shows it beside the fields, as without the queue.
   */
  async submitReading(body: QueuedReadingBody, summary: ReadingSummary, photo?: NewPhoto & Omit<LocalPhotoRef, 'localPhotoId'>): Promise<SubmitResult> {
    const owner = this.owner();
    let queuedBody = body;
    if (photo) {
      const localPhotoId = await this.queuePhoto(photo);
      queuedBody = { ...body, photo: { localPhotoId, region: photo.region, ...(photo.neutral ? { neutral: photo.neutral } : {}) } };
    }
    const reading: PendingReading = { ...this.fresh(owner), body: queuedBody, summary };
    await this.storage.putReading(reading);
    await this.refresh();
    if (!this.online()) return { queued: true, id: reading.id };
    await this.send({ only: [reading.id], force: true, probe: false });
    const answer = this.answers.get(reading.id);
    if (answer) return { queued: false, reading: answer };
    const left = await this.storage.reading(reading.id);
    if (left?.state === 'needs-attention' && left.lastError) {
      await this.storage.deleteReading(reading.id);
      await this.refresh();
      const e = left.lastError;
      throw new ApiError(e.status, e.title, e.detail, e.fieldErrors);
    }
    return { queued: true, id: reading.id };
  }

  /** Keeps a photo taken out of range; returns its local id for the reading that samples it. */
  async queuePhoto(photo: NewPhoto & { region?: LocalPhotoRef['region'] | null; neutral?: LocalPhotoRef['neutral'] | null }): Promise<string> {
    const owner = this.owner();
    const pending: PendingPhoto = {
      ...this.fresh(owner),
      blob: photo.blob,
      name: photo.name,
      width: photo.width,
      height: photo.height,
      region: photo.region ?? null,
      neutral: photo.neutral?.region ?? null,
      uploaded: null,
    };
    await this.storage.putPhoto(pending);
    await this.refresh();
    return pending.id;
  }

  /** Notes the region drawn on a queued photo and the phone's preview of it. */
  async notePhoto(id: string, note: Pick<PendingPhoto, 'region' | 'neutral' | 'preview'>): Promise<void> {
    const photo = await this.storage.photo(id);
    if (photo) await this.storage.putPhoto({ ...photo, ...note });
  }

  /** A queued photo (with its Blob), e.g. to show it again. */
  photo(id: string): Promise<PendingPhoto | undefined> {
    return this.storage.photo(id);
  }

  /** "Send now": everything of the signed-in person, ignoring backoff; refused items stay until changed or discarded. */
  sendNow(): Promise<RunReport> {
    return this.send({ force: true });
  }

  /** Sends again a reading the server refused, with the recorder's changes; it gets a new key, since it is a new request. */
  async resend(id: string, changes: Partial<QueuedReadingBody> = {}, summary: Partial<ReadingSummary> = {}): Promise<RunReport> {
    const item = await this.storage.reading(id);
    if (!item) return { sent: [], photosSent: 0, failed: 0, offline: false };
    await this.storage.putReading({ ...item, body: { ...item.body, ...changes }, summary: { ...item.summary, ...summary }, key: newQueueKey(), state: 'waiting', lastError: null, nextAttemptAt: 0 });
    await this.refresh();
    return this.send({ only: [id], force: true });
  }

  /** Removes a reading from the queue for good (the screen asks first), and its photo when nothing else needs it. */
  async discard(id: string): Promise<void> {
    const item = await this.storage.reading(id);
    if (item) {
      await this.storage.deleteReading(id);
      const photo = item.body.photo;
      if (photo && 'localPhotoId' in photo) {
        const others = (await this.storage.readings()).some((r) => r.body.photo && 'localPhotoId' in r.body.photo && r.body.photo.localPhotoId === photo.localPhotoId);
        if (!others) await this.storage.deletePhoto(photo.localPhotoId);
      }
    } else {
      await this.storage.deletePhoto(id);
    }
    await this.refresh();
  }

  /** Re-reads the queue from storage into the signals. */
  async refresh(): Promise<void> {
    const [readings, photos] = await Promise.all([this.storage.readings(), this.storage.photos()]);
    this.readingList.set(readings.sort((a, b) => a.createdAt.localeCompare(b.createdAt)));
    this.photoList.set(photos.filter((p) => !p.uploaded).sort((a, b) => a.createdAt.localeCompare(b.createdAt)));
  }

  private tick: ReturnType<typeof setInterval> | null = null;
  private readonly onOnline = () => void this.sendAfterReconnect();

  /** Sends at once on `online`; if the server is not reachable yet, again a few seconds later. */
  private async sendAfterReconnect(): Promise<void> {
    if ((await this.send({ force: true })).offline === false) return;
    for (const wait of RECONNECT_RETRY_MS) {
      await new Promise((resolve) => setTimeout(resolve, wait));
      if (!this.started || this.readingList().length + this.photoList().length === 0) return;
      if ((await this.send({ force: true })).offline === false) return;
    }
  }

  private stop(): void {
    if (typeof window !== 'undefined') window.removeEventListener('online', this.onOnline);
    if (this.tick) clearInterval(this.tick);
    this.started = false;
  }

  /** Sends what is due, if anything is and somebody is signed in. */
  private async sendDue(): Promise<void> {
    if (this.readingList().length === 0 && this.photoList().length === 0) return;
    if (!this.online()) return;
    await this.send({});
  }

  /** One run at a time; a request during a run waits for it and then runs itself. */
  private async send(options: RunOptions): Promise<RunReport> {
    const user = this.auth.currentUser();
    if (!user) return { sent: [], photosSent: 0, failed: 0, offline: false };
    while (this.current) await this.current.catch(() => undefined);
    this.busy.set(true);
    this.current = this.runner.run({ ...options, ownerId: user.id });
    try {
      const report = await this.current;
      for (const { id, answer } of report.sent) this.answers.set(id, answer);
      return report;
    } finally {
      this.current = null;
      this.busy.set(false);
      await this.refresh();
    }
  }

  private owner(): { id: number; name: string } {
    const user = this.auth.currentUser();
    if (!user) throw new ApiError(401, 'Please sign in.');
    return { id: user.id, name: user.name };
  }

  private fresh(owner: { id: number; name: string }) {
    return {
      id: newQueueKey(),
      key: newQueueKey(),
      ownerId: owner.id,
      ownerName: owner.name,
      createdAt: new Date().toISOString(),
      attempts: 0,
      state: 'waiting' as const,
      lastError: null,
      nextAttemptAt: 0,
    };
  }
}
