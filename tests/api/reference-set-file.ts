import { readFileSync } from 'node:fs';
import path from 'node:path';
import type { Response } from 'supertest';
import type { ReferenceSetFile } from '../../shared/colour/reference-set.js';
import { REFERENCE_COLORS_DIR } from '../../server/reference-sets/load-reference-sets.js';

/** The committed reference set v1, read straight from its file: what the API must agree with. */
export const SET_V1_FILE = path.join(REFERENCE_COLORS_DIR, 'reference-set-v1.json');

/** The committed set v1 as parsed JSON (a fresh copy each call, safe to change). */
export function readSetV1(): ReferenceSetFile {
  return JSON.parse(readFileSync(SET_V1_FILE, 'utf8')) as ReferenceSetFile;
}

/** The committed set v2. */
export const SET_V2_FILE = path.join(REFERENCE_COLORS_DIR, 'reference-set-v2.json');

/** The committed set v2 as parsed JSON (a fresh copy each call). */
export function readSetV2(): ReferenceSetFile {
  return JSON.parse(readFileSync(SET_V2_FILE, 'utf8')) as ReferenceSetFile;
}

/** A supertest parser that keeps the body as bytes (PDFs). */
export function bytes(res: Response, done: (err: Error | null, body: Buffer) => void): void {
  const parts: Buffer[] = [];
  (res as unknown as NodeJS.ReadableStream).on('data', (chunk: Buffer) => parts.push(chunk));
  (res as unknown as NodeJS.ReadableStream).on('end', () => done(null, Buffer.concat(parts)));
}
