import type { DataSource } from 'typeorm';
import type { SqliteSessionStore } from '../auth/session-store.js';
import type { Mailer } from '../mail/mailer.js';

/** What every router is built with. */
export interface AppContext {
  ds: DataSource;
  mailer: Mailer;
  /** Base URL for links in mails, without a trailing slash. */
  publicUrl: string;
  sessions: SqliteSessionStore;
}
