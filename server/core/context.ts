import type { DataSource } from 'typeorm';
import type { SqliteSessionStore } from '../auth/session-store.js';
import type { Mailer } from '../mail/mailer.js';
import type { PhotoFiles } from '../photos/photo-files.js';
import type { ReferenceSets } from '../reference-sets/reference-sets.js';

/** What every router is built with. */
export interface AppContext {
  ds: DataSource;
  mailer: Mailer;
  /** Base URL for links in mails, without a trailing slash. */
  publicUrl: string;
  sessions: SqliteSessionStore;
  /** The stored reference sets, each with its index built once; photos, readings and calibration match through it. */
  referenceSets: ReferenceSets;
  /** The photo store under the data folder; null when the server runs without one (photo routes answer 503). */
  photos: PhotoFiles | null;
  /** Where errors that must not fail the request (a mail that could not be sent) and 5xx errors are logged. */
  logError: (err: unknown) => void;
}
