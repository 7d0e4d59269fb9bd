import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { CreateReadingRequest, ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import type { LabTuple } from '../../../../../shared/colour/lab.js';
import { OfflineQueue } from '../../../core/offline/offline-queue';
import type { QueuedReadingBody } from '../../../core/offline/queue-item';
import { ChipCatalogue } from '../../../shared/chips/chip-catalogue';
import { ReadingsApi, newIdempotencyKey } from '../../../shared/readings/readings-api';
import { readingSummary, type SummaryNames } from '../../../shared/readings/reading-summary';
import type { PhotoSource } from './reading-draft';

/** How a new reading left the form: answered by the server, or kept on the phone to send later. */
export type NewReadingOutcome = { queued: false; reading: ReadingDetail } | { queued: true; body: QueuedReadingBody; preview: LabTuple | null };

/**
 * Where the reading form's answers go once they pass its checks: a new reading through the
 * offline queue (sent at once when online, kept on the phone when not), a correction straight to
 * the server under one idempotency key per set of answers. One per form (provided by the form).
 */
@Injectable()
export class ReadingSaveFlow {
  private readonly queue = inject(OfflineQueue);
  private readonly readings = inject(ReadingsApi);
  private readonly chips = inject(ChipCatalogue);

  /** The key of the correction being sent: kept across retries of the same answers, new once they change. */
  private correctionKey: string | null = null;

  /** The answers changed: a retry is a new request, under a new key. */
  answersChanged(): void {
    this.correctionKey = null;
  }

  /**
   * Saves a new reading. A photo still on the phone goes by its local id (the queue uploads it
   * first) and its preview is the provisional colour until the server matches.
   */
  async saveNew(body: CreateReadingRequest, photo: PhotoSource | null, names: SummaryNames): Promise<NewReadingOutcome> {
    const local = body.method === 'photo' ? photo?.localPhotoId : undefined;
    const queued: QueuedReadingBody = local && photo ? { ...body, photo: { localPhotoId: local, region: photo.region, ...(photo.neutral ? { neutral: { region: photo.neutral } } : {}) } } : body;
    const preview = local ? ((await this.queue.photo(local))?.preview ?? null) : null;
    const result = await this.queue.submitReading(queued, readingSummary(queued, names, this.chips.set(), preview));
    return result.queued ? { queued: true, body: queued, preview: preview?.lab ?? null } : { queued: false, reading: result.reading };
  }

  /** Sends a correction of reading `id`, which it supersedes. */
  saveCorrection(id: number, body: CreateReadingRequest, reason: string): Observable<ReadingDetail> {
    this.correctionKey ??= newIdempotencyKey();
    return this.readings.supersede(id, { ...body, reason }, this.correctionKey);
  }

  /** The last save went through: the next one starts a new request. */
  done(): void {
    this.correctionKey = null;
  }
}
