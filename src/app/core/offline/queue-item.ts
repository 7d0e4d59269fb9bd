// What the offline queue keeps in the phone's IndexedDB: photos not yet uploaded and readings not
// yet sent, each with the idempotency key that makes a resend harmless.
import type { Region } from '../../../../shared/photo/region.js';
import type { LabTuple } from '../../../../shared/colour/lab.js';
import type { PhotoDto } from '../../../../shared/api/photo-answers.js';
import type { CreateReadingRequest } from '../../../../shared/api/reading-answers.js';
import type { FieldError } from '../../../../shared/api/problem.js';

/** Where an item stands: waiting (to be sent on the next run), being sent, or refused and waiting for the recorder. */
export type QueueState = 'waiting' | 'sending' | 'needs-attention';

/** The server's refusal or the failure of the last attempt, kept for the recorder to read. */
export interface QueueError {
  /** HTTP status; 0 when the server could not be reached. */
  status: number;
  title: string;
  detail: string | null;
  fieldErrors: readonly FieldError[];
}

/** What every queued item carries. */
interface QueuedBase {
  /** Local id (a UUID), never sent. */
  id: string;
  /** Sent as `Idempotency-Key`: a resend of the same request is answered, not stored again. */
  key: string;
  /** Who saved it: only their session sends it. */
  ownerId: number;
  ownerName: string;
  /** ISO 8601, when the recorder saved it. */
  createdAt: string;
  attempts: number;
  state: QueueState;
  lastError: QueueError | null;
  /** Earliest time (ms since epoch) an automatic run tries again; "Send now" ignores it. */
  nextAttemptAt: number;
}

/** A photo taken out of range, with the region drawn on it (the sample request the server will repeat). */
export interface PendingPhoto extends QueuedBase {
  blob: Blob;
  name: string;
  /** Upright size as the browser decoded it: region coordinates refer to it. */
  width: number;
  height: number;
  region: Region | null;
  neutral: Region | null;
  /** The phone's own preview of the region (provisional: the server samples it again). */
  preview?: { lab: LabTuple; hex: string } | null;
  /** Once uploaded: the server's photo, so a later failure of its reading does not upload it again. */
  uploaded: PhotoDto | null;
}

/** A reading's photo that is still on the phone: its local id and the regions on it. */
export interface LocalPhotoRef {
  localPhotoId: string;
  region: Region;
  neutral?: { region: Region; lab?: LabTuple };
}

/** The create-reading body, with a local photo in place of the server's photo id until it is uploaded. */
export type QueuedReadingBody = Omit<CreateReadingRequest, 'photo'> & { photo?: CreateReadingRequest['photo'] | LocalPhotoRef };

/** What the queue screen shows of a reading without asking the server (names may have changed there since). */
export interface ReadingSummary {
  accession: string;
  character: string;
  /** The method in words ("Instrument L*a*b*"). */
  method: string;
  /** The colour as the phone knows it, if it does. */
  hex: string | null;
  lab: LabTuple | null;
  /** The chip code shown under the swatch, if known. */
  code: string | null;
  /** Whether the colour came from the phone's own preview of a photo (the server's sample will replace it). */
  provisional: boolean;
}

/** A reading waiting to be sent. */
export interface PendingReading extends QueuedBase {
  body: QueuedReadingBody;
  summary: ReadingSummary;
}

/** Whether a reading's photo is still on the phone. */
export function isLocalPhoto(photo: QueuedReadingBody['photo']): photo is LocalPhotoRef {
  return !!photo && 'localPhotoId' in photo;
}

/** A fresh key or local id: a UUID where the browser offers one (secure contexts only), else 32 random hex digits. */
export function newQueueKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');
}
