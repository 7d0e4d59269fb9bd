import { openDB, type DBSchema, type IDBPDatabase } from 'idb';

import type { PendingPhoto, PendingReading } from './queue-item';
import type { QueueStorage } from './queue-storage';

/** The database name and schema version; bump the version with an upgrade step when the stores change. */
const DB_NAME = 'hueledger-offline';
const DB_VERSION = 1;

interface QueueDb extends DBSchema {
  readings: { key: string; value: PendingReading };
  photos: { key: string; value: PendingPhoto };
}

/** The queue in the browser's IndexedDB (through idb): it survives reloads, closing the app and a restart of the phone. */
export class IdbQueueStorage implements QueueStorage {
  private readonly db: Promise<IDBPDatabase<QueueDb>> = openDB<QueueDb>(DB_NAME, DB_VERSION, {
    upgrade(db) {
      db.createObjectStore('readings', { keyPath: 'id' });
      db.createObjectStore('photos', { keyPath: 'id' });
    },
  });

  async readings() {
    return (await this.db).getAll('readings');
  }
  async photos() {
    return (await this.db).getAll('photos');
  }
  async reading(id: string) {
    return (await this.db).get('readings', id);
  }
  async photo(id: string) {
    return (await this.db).get('photos', id);
  }
  async putReading(reading: PendingReading) {
    await (await this.db).put('readings', reading);
  }
  async putPhoto(photo: PendingPhoto) {
    await (await this.db).put('photos', photo);
  }
  async deleteReading(id: string) {
    await (await this.db).delete('readings', id);
  }
  async deletePhoto(id: string) {
    await (await this.db).delete('photos', id);
  }
}
