// Test doubles for the queue's specs: a scripted transport (the runner's only way out). Storage
// is the real MemoryQueueStorage (jsdom has no IndexedDB; the idb class is a thin pass-through).
import type { PhotoDto } from '../../../../../shared/api/photo-answers.js';
import type { CreateReadingRequest, ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import { ApiError } from '../../http/api-error';
import type { PendingReading } from '../queue-item';
import type { QueueTransport } from '../sync-runner';

/** One scripted outcome: an answer, or an error to throw. */
type Outcome<T> = T | ApiError;

/** A transport whose answers the spec scripts; it records every call. */
export class ScriptedTransport implements QueueTransport {
  online = true;
  readonly photoCalls: { name: string; key: string }[] = [];
  readonly readingCalls: { body: CreateReadingRequest; key: string }[] = [];
  photoOutcomes: Outcome<PhotoDto>[] = [];
  readingOutcomes: Outcome<ReadingDetail>[] = [];
  private nextPhotoId = 500;
  private nextReadingId = 900;

  async reachable() {
    return this.online;
  }
  async uploadPhoto(_blob: Blob, name: string, key: string) {
    this.photoCalls.push({ name, key });
    const outcome = this.photoOutcomes.shift() ?? photoDto(this.nextPhotoId++);
    if (outcome instanceof ApiError) throw outcome;
    return outcome;
  }
  async createReading(body: CreateReadingRequest, key: string) {
    this.readingCalls.push({ body, key });
    const outcome = this.readingOutcomes.shift() ?? readingDetail(this.nextReadingId++);
    if (outcome instanceof ApiError) throw outcome;
    return outcome;
  }
}

/** A stored photo as the server answers it (only what the queue reads matters). */
export function photoDto(id: number): PhotoDto {
  return { id, width: 400, height: 300, sha256: 'f'.repeat(64), sourceProfile: 'none', mime: 'image/jpeg', capturedAt: null, orientation: 1, byteSize: 1000, uploadedById: 7, createdAt: '2026-03-01T10:00:00.000Z', imageUrl: `/api/photos/${id}/image`, thumbUrl: `/api/photos/${id}/thumb` };
}

/** A created reading as the server answers it (the fields the queue passes on). */
export function readingDetail(id: number): ReadingDetail {
  return { id, accessionNumber: 'HL-0917' } as unknown as ReadingDetail;
}

/** An instrument reading waiting in the queue. */
export function pendingReading(over: Partial<PendingReading> = {}): PendingReading {
  return {
    id: crypto.randomUUID(),
    key: crypto.randomUUID(),
    ownerId: 7,
    ownerName: 'Ana Field',
    createdAt: '2026-03-01T10:00:00.000Z',
    attempts: 0,
    state: 'waiting',
    lastError: null,
    nextAttemptAt: 0,
    body: { accessionId: 3, characterId: 11, method: 'instrument', lab: [42, 18, -6], light: 'overcast' },
    summary: { accession: 'HL-0917 Dusk Purple', character: 'Petiole, middle third', method: 'Instrument L*a*b*', hex: '#7a5a6e', lab: [42, 18, -6], code: null, provisional: false },
    ...over,
  };
}

/** A 400 refusal naming a field, as the error interceptor delivers it. */
export const refusedAccession = () => new ApiError(400, 'Bad request', 'No accession 3: it may have been renamed or removed.', [{ field: 'accessionId', message: 'no such accession' }]);
/** What HttpClient gives when the phone is out of range. */
export const noConnection = () => new ApiError(0, 'The server cannot be reached. Check the connection and try again.');
