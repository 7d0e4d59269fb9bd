// The photo page hands its region to the reading form through the URL (`?method=photo&photo=12&
// region={…}&card={…}`), so a reload in the field keeps it; this reads and writes that form.
import type { Params } from '@angular/router';

import type { Region } from '../../../../../shared/photo/region.js';
import type { PhotoSource } from './reading-draft';

/** The query parameters that carry a photo region to the reading form. */
export function photoSourceParams(source: PhotoSource): Params {
  return {
    method: 'photo',
    photo: source.localPhotoId ? null : source.photoId,
    localPhoto: source.localPhotoId ?? null,
    region: JSON.stringify(source.region),
    card: source.neutral ? JSON.stringify(source.neutral) : null,
  };
}

/** The photo region the URL carries, or null when it carries none or a malformed one. */
export function photoSourceFromParams(params: Params): PhotoSource | null {
  const localPhotoId = params['localPhoto'];
  if (typeof localPhotoId === 'string' && /^[A-Za-z0-9-]{8,64}$/.test(localPhotoId)) {
    const local = regionFrom(params['region']);
    return local ? { photoId: 0, localPhotoId, region: local, neutral: regionFrom(params['card']) } : null;
  }
  const photoId = Number(params['photo']);
  if (!Number.isSafeInteger(photoId) || photoId <= 0) return null;
  const region = regionFrom(params['region']);
  if (!region) return null;
  return { photoId, region, neutral: regionFrom(params['card']) };
}

function regionFrom(text: unknown): Region | null {
  if (typeof text !== 'string') return null;
  let value: unknown;
  try {
    value = JSON.parse(text);
  } catch {
    return null;
  }
  return isRegion(value) ? value : null;
}

const finite = (v: unknown): v is number => typeof v === 'number' && Number.isFinite(v);

/** A shape check only: the server is the judge of whether the region fits the photo. */
export function isRegion(value: unknown): value is Region {
  if (typeof value !== 'object' || value === null) return false;
  const r = value as Record<string, unknown>;
  switch (r['shape']) {
    case 'rect':
      return [r['x'], r['y'], r['width'], r['height']].every(finite);
    case 'ellipse':
      return [r['cx'], r['cy'], r['rx'], r['ry']].every(finite);
    case 'point':
      return [r['x'], r['y'], r['radius']].every(finite);
    case 'polygon':
      return Array.isArray(r['points']) && r['points'].length >= 3 && r['points'].every((p) => Array.isArray(p) && p.length === 2 && p.every(finite));
    default:
      return false;
  }
}
