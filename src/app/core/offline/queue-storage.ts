import { InjectionToken } from '@angular/core';

import type { PendingPhoto, PendingReading } from './queue-item';

/**
 * Where the queue keeps its items. The app uses IndexedDB (`IdbQueueStorage`); the specs use
 * `MemoryQueueStorage`, because jsdom has no IndexedDB and the runner's logic is what they test.
 */
export interface QueueStorage {
  readings(): Promise<PendingReading[]>;
  photos(): Promise<PendingPhoto[]>;
  reading(id: string): Promise<PendingReading | undefined>;
  photo(id: string): Promise<PendingPhoto | undefined>;
  putReading(reading: PendingReading): Promise<void>;
  putPhoto(photo: PendingPhoto): Promise<void>;
  deleteReading(id: string): Promise<void>;
  deletePhoto(id: string): Promise<void>;
}

/** The queue's storage; provided in root by the IndexedDB implementation. */
export const QUEUE_STORAGE = new InjectionToken<QueueStorage>('QUEUE_STORAGE', {
  providedIn: 'root',
  // Without IndexedDB (jsdom in specs, very old browsers) the queue lives as long as the page.
  factory: () => (typeof indexedDB === 'undefined' ? new MemoryQueueStorage() : new IdbQueueStorageLazy()),
});

/** Loads idb (and opens the database) on first use, so the initial download stays small. */
class IdbQueueStorageLazy implements QueueStorage {
  private store: Promise<QueueStorage> | null = null;
  private get(): Promise<QueueStorage> {
    this.store ??= import('./idb-queue-storage').then((m) => new m.IdbQueueStorage());
    return this.store;
  }
  readings = () => this.get().then((s) => s.readings());
  photos = () => this.get().then((s) => s.photos());
  reading = (id: string) => this.get().then((s) => s.reading(id));
  photo = (id: string) => this.get().then((s) => s.photo(id));
  putReading = (r: PendingReading) => this.get().then((s) => s.putReading(r));
  putPhoto = (p: PendingPhoto) => this.get().then((s) => s.putPhoto(p));
  deleteReading = (id: string) => this.get().then((s) => s.deleteReading(id));
  deletePhoto = (id: string) => this.get().then((s) => s.deletePhoto(id));
}

/** A queue storage in memory: for specs, and as the fallback where IndexedDB is missing. */
export class MemoryQueueStorage implements QueueStorage {
  private readonly readingMap = new Map<string, PendingReading>();
  private readonly photoMap = new Map<string, PendingPhoto>();

  async readings() {
    return [...this.readingMap.values()].map((r) => structuredClone(r));
  }
  async photos() {
    return [...this.photoMap.values()].map((p) => ({ ...structuredClone({ ...p, blob: null }), blob: p.blob }));
  }
  async reading(id: string) {
    const r = this.readingMap.get(id);
    return r && structuredClone(r);
  }
  async photo(id: string) {
    const p = this.photoMap.get(id);
    return p && { ...structuredClone({ ...p, blob: null }), blob: p.blob };
  }
  async putReading(reading: PendingReading) {
    this.readingMap.set(reading.id, structuredClone(reading));
  }
  async putPhoto(photo: PendingPhoto) {
    this.photoMap.set(photo.id, photo);
  }
  async deleteReading(id: string) {
    this.readingMap.delete(id);
  }
  async deletePhoto(id: string) {
    this.photoMap.delete(id);
  }
}
