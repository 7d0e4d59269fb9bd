import path from 'node:path';

/** What lives in a Hueledger data folder (README.md, Configuration); the server, backup and restore agree on these names. */
export const DATA_FOLDER = {
  /** The SQLite database (WAL mode: `-wal` and `-shm` files sit beside it while open). */
  database: 'hueledger.sqlite',
  /** Uploaded photos, content-addressed (server/photos/photo-files.ts). */
  photos: 'photos',
  /** The generated session secret, when SESSION_SECRET is not set. */
  secret: 'session-secret',
} as const;

/** Path of the database file in a data folder. */
export function databaseFile(dataDir: string): string {
  return path.join(dataDir, DATA_FOLDER.database);
}
