import { createHash } from 'node:crypto';
import { gzipSync } from 'node:zlib';
import type { LoadedSet } from './reference-sets.js';

/** A set's chips answer, serialised once: the JSON bytes, their gzip, and a strong ETag for each. */
export interface ChipsBody {
  json: Buffer;
  gzip: Buffer;
  /** Strong validator of the JSON bytes. */
  etag: string;
  /** Strong validator of the gzip bytes (another representation, so another tag: RFC 9110 § 8.8.3). */
  gzipEtag: string;
}

const bodies = new WeakMap<LoadedSet, ChipsBody>();

/** The serialised chips of a set; built on first use and kept with the set (its chips never change). */
export function chipsBody(set: LoadedSet): ChipsBody {
  let body = bodies.get(set);
  if (!body) {
    const json = Buffer.from(JSON.stringify(set.chips), 'utf8');
    const hash = createHash('sha256').update(json).digest('base64url').slice(0, 22);
    body = { json, gzip: gzipSync(json, { level: 9 }), etag: `"${set.summary.id}-${hash}"`, gzipEtag: `"${set.summary.id}-${hash}-gzip"` };
    bodies.set(set, body);
  }
  return body;
}
