import type { PhotoDto } from '../../../../shared/api/photo-answers.js';
import type { CreateReadingRequest, ReadingDetail } from '../../../../shared/api/reading-answers.js';
import { isLocalPhoto, type PendingPhoto, type PendingReading, type QueueError } from './queue-item';
import type { QueueStorage } from './queue-storage';
import { backoffMs, queueErrorOf, verdictOf } from './send-rules';

/** How the runner reaches the server; the app's goes through HttpClient (HttpQueueTransport). */
export interface QueueTransport {
  /** Whether the server answers at all (and hands out a fresh XSRF cookie). */
  reachable(): Promise<boolean>;
  uploadPhoto(blob: Blob, name: string, key: string): Promise<PhotoDto>;
  createReading(body: CreateReadingRequest, key: string): Promise<ReadingDetail>;
}

/** What one run did. */
export interface RunReport {
  /** Each reading sent, by its local id, with the server's answer. */
  sent: { id: string; answer: ReadingDetail }[];
  photosSent: number;
  /** Items that failed and stay queued (to retry, or for the recorder). */
  failed: number;
  /** Whether the run stopped because the server could not be reached. */
  offline: boolean;
}

/** What a run may skip: `force` (Send now) ignores each item's backoff. */
export interface RunOptions {
  force?: boolean;
  /** Only these readings (and their photos). */
  only?: readonly string[];
  /** Whether to ask the server first if it is there (default); a save sent at once just tries. */
  probe?: boolean;
  /** Only items saved by this user: a shared phone never sends one person's readings as another's. */
  ownerId?: number;
}

/**
 * Sends the queue: photos first (so readings can name the server's photo id), then readings,
 * oldest first. A lost connection stops the run and leaves everything queued; a refusal marks
 * that one item "needs attention" and the run goes on; a sent item leaves the queue.
 */
export class SyncRunner {
  constructor(
    private readonly storage: QueueStorage,
    private readonly transport: QueueTransport,
    private readonly now: () => number = Date.now,
  ) {}

  async run(options: RunOptions = {}): Promise<RunReport> {
    const report: RunReport = { sent: [], photosSent: 0, failed: 0, offline: false };
    if (options.probe !== false && !(await this.transport.reachable())) return { ...report, offline: true };
    const readings = (await this.storage.readings()).filter((r) => this.due(r, options) && (!options.only || options.only.includes(r.id)));
    const neededPhotos = new Set(readings.flatMap((r) => (isLocalPhoto(r.body.photo) ? [r.body.photo.localPhotoId] : [])));
    const photos = (await this.storage.photos()).filter((p) => !p.uploaded && p.state !== 'needs-attention' && (neededPhotos.has(p.id) || (!options.only && this.due(p, options))));
    for (const photo of byAge(photos)) {
      const ok = await this.sendPhoto(photo, report);
      if (report.offline) return report;
      if (ok) report.photosSent++;
    }
    for (const reading of byAge(readings)) {
      await this.sendReading(reading, report);
      if (report.offline) return report;
    }
    await this.dropUnneededPhotos();
    return report;
  }

  private due(item: PendingPhoto | PendingReading, options: RunOptions): boolean {
    if (item.state === 'needs-attention') return false;
    if (options.ownerId !== undefined && item.ownerId !== options.ownerId) return false;
    return options.force || item.nextAttemptAt <= this.now();
  }

  private async sendPhoto(photo: PendingPhoto, report: RunReport): Promise<boolean> {
    await this.storage.putPhoto({ ...photo, state: 'sending' });
    try {
      const uploaded = await this.transport.uploadPhoto(photo.blob, photo.name, photo.key);
      await this.storage.putPhoto({ ...photo, state: 'waiting', uploaded, lastError: null, attempts: photo.attempts + 1 });
      return true;
    } catch (error) {
      await this.failed(report, error, photo, (p) => this.storage.putPhoto(p));
      return false;
    }
  }

  private async sendReading(reading: PendingReading, report: RunReport): Promise<void> {
    const body = await this.serverBody(reading);
    if (!body.ok) {
      if (body.error) await this.storage.putReading({ ...reading, state: 'needs-attention', lastError: body.error });
      report.failed++;
      return;
    }
    await this.storage.putReading({ ...reading, state: 'sending' });
    try {
      const answer = await this.transport.createReading(body.value, reading.key);
      await this.storage.deleteReading(reading.id);
      report.sent.push({ id: reading.id, answer });
    } catch (error) {
      await this.failed(report, error, reading, (r) => this.storage.putReading(r));
    }
  }

  /** The body as the server takes it: the uploaded photo's id in place of the local one. */
  private async serverBody(reading: PendingReading): Promise<{ ok: true; value: CreateReadingRequest } | { ok: false; error: QueueError | null }> {
    const { photo, ...rest } = reading.body;
    if (!isLocalPhoto(photo)) return { ok: true, value: { ...rest, ...(photo ? { photo } : {}) } };
    const stored = await this.storage.photo(photo.localPhotoId);
    if (!stored) return { ok: false, error: { status: 0, title: 'Photo missing', detail: 'The photo of this reading is no longer on this phone. Discard the reading, or record it again.', fieldErrors: [] } };
    if (stored.state === 'needs-attention') return { ok: false, error: { ...(stored.lastError ?? { status: 400, title: 'Photo refused', detail: null, fieldErrors: [] }), title: `Its photo was refused: ${stored.lastError?.title ?? ''}`.trim() } };
    if (!stored.uploaded) return { ok: false, error: null }; // the photo failed to go this run; it retries with it
    return { ok: true, value: { ...rest, photo: { photoId: stored.uploaded.id, region: photo.region, ...(photo.neutral ? { neutral: photo.neutral } : {}) } } };
  }

  private async failed<T extends PendingPhoto | PendingReading>(report: RunReport, error: unknown, item: T, put: (item: T) => Promise<void>): Promise<void> {
    const { error: lastError, type } = queueErrorOf(error);
    const attempts = item.attempts + 1;
    report.failed++;
    if (lastError.status === 0) report.offline = true;
    const state = verdictOf(lastError, type) === 'retry' ? 'waiting' : 'needs-attention';
    await put({ ...item, state, lastError, attempts, nextAttemptAt: this.now() + backoffMs(attempts) });
  }

  /** Uploaded photos whose readings have all gone, and that no reading names, are done. */
  private async dropUnneededPhotos(): Promise<void> {
    const named = new Set((await this.storage.readings()).flatMap((r) => (isLocalPhoto(r.body.photo) ? [r.body.photo.localPhotoId] : [])));
    for (const photo of await this.storage.photos()) {
      if (photo.uploaded && !named.has(photo.id)) await this.storage.deletePhoto(photo.id);
    }
  }
}

function byAge<T extends { createdAt: string }>(items: T[]): T[] {
  return [...items].sort((a, b) => a.createdAt.localeCompare(b.createdAt));
}
