import { randomBytes } from 'node:crypto';
import { existsSync } from 'node:fs';
import { mkdir, rename, rm } from 'node:fs/promises';
import path from 'node:path';

/** The files kept for one photo, in its folder `<root>/<sha[0..2]>/<sha>/`. */
export const PHOTO_FILES = {
  /** The bytes as uploaded (extension after the sniffed type). */
  original: (ext: string) => `original.${ext}`,
  /** Upright sRGB, 8 bits, tiled and deflate-compressed TIFF: a region is read without decoding the rest. */
  upright: 'upright.tif',
  /** Upright sRGB JPEG for the screen. */
  display: 'display.jpg',
  thumb: 'thumb.jpg',
} as const;

/** File extension of each accepted media type. */
export const EXTENSION_OF: Record<string, string> = {
  'image/jpeg': 'jpg',
  'image/png': 'png',
  'image/webp': 'webp',
  'image/heif': 'heif',
  'image/heic': 'heic',
  'image/avif': 'avif',
  'image/tiff': 'tif',
};

/** Where photos are stored, content-addressed; writes go through a hidden staging folder and one rename. */
export class PhotoFiles {
  constructor(readonly root: string) {}

  /** The folder of a photo with this SHA-256. */
  folder(sha256: string): string {
    if (!/^[0-9a-f]{64}$/.test(sha256)) throw new Error('not a SHA-256');
    return path.join(this.root, sha256.slice(0, 2), sha256);
  }

  file(sha256: string, name: string): string {
    return path.join(this.folder(sha256), name);
  }

  /** A fresh, empty staging folder beside the photos (same file system, so the final rename is atomic). */
  async stage(): Promise<string> {
    const dir = path.join(this.root, '.staging', randomBytes(12).toString('hex'));
    await mkdir(dir, { recursive: true });
    return dir;
  }

  /**
   * Moves a staged folder into place as the photo's folder. Returns false (and removes the staged
   * copy) when the folder already exists: the same bytes were stored before or by a parallel upload.
   */
  async commit(staged: string, sha256: string): Promise<boolean> {
    const target = this.folder(sha256);
    await mkdir(path.dirname(target), { recursive: true });
    if (existsSync(target)) {
      await this.discard(staged);
      return false;
    }
    try {
      await rename(staged, target);
      return true;
    } catch (err) {
      await this.discard(staged);
      if (existsSync(target)) return false;
      throw err;
    }
  }

  async discard(dir: string): Promise<void> {
    await rm(dir, { recursive: true, force: true });
  }

  /** Removes a photo's folder (a row that failed to save after its files were placed). */
  async remove(sha256: string): Promise<void> {
    await rm(this.folder(sha256), { recursive: true, force: true });
  }
}
