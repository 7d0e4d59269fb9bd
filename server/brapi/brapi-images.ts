// Photos as BrAPI images: metadata, the observations taken from each, and a link to the upright
// display copy that a token holder can fetch through this interface.
import { In, IsNull, type DataSource } from 'typeorm';
import { Photo } from '../photos/photo.entity.js';
import { Reading } from '../readings/reading.entity.js';
import { numericId } from './brapi-collection.js';
import { observationDbId } from './brapi-observations.js';
import { COLOUR_PARTS } from './brapi-variables.js';

/** RFC 3339 date-time (what BrAPI's `format: date-time` asks for) needs an offset; EXIF times without one go to additionalInfo only. */
const WITH_OFFSET = /(Z|[+-]\d{2}:\d{2})$/;

/** The path of an image's display copy under /brapi/v2. */
export function imageContentPath(id: number): string {
  return `/brapi/v2/images/${id}/imagecontent`;
}

/** Photos by id, each with the current observations read from it. */
export async function findImages(ds: DataSource, publicUrl: string, f: { imageDbId?: string; observationUnitDbId?: string }): Promise<Record<string, unknown>[]> {
  const id = numericId(f.imageDbId);
  const unit = numericId(f.observationUnitDbId);
  if (id === null || unit === null) return [];
  let photoIds: number[] | undefined;
  if (unit !== undefined) {
    const rows = await ds.getRepository(Reading).find({ select: { photoId: true }, where: { plantId: unit, supersededById: IsNull() } });
    photoIds = [...new Set(rows.map((r) => r.photoId).filter((p): p is number => p !== null))];
  }
  const where = id !== undefined ? { id } : photoIds ? { id: In(photoIds) } : {};
  const photos = await ds.getRepository(Photo).find({ where, order: { id: 'ASC' } });
  if (!photos.length) return [];
  const readings = await ds.getRepository(Reading).find({ where: { photoId: In(photos.map((p) => p.id)), supersededById: IsNull() }, order: { id: 'ASC' } });
  return photos.map((p) => {
    const own = readings.filter((r) => r.photoId === p.id);
    const plants = [...new Set(own.map((r) => r.plantId))];
    return {
      imageDbId: String(p.id),
      imageName: `Photo ${p.id}`,
      imageFileName: `photo-${p.id}.jpg`,
      mimeType: 'image/jpeg',
      imageURL: `${publicUrl}${imageContentPath(p.id)}`,
      ...(p.capturedAt && WITH_OFFSET.test(p.capturedAt) ? { imageTimeStamp: p.capturedAt } : {}),
      observationDbIds: own.flatMap((r) => COLOUR_PARTS.map((part) => observationDbId({ kind: 'r', id: r.id, part }))),
      ...(plants.length === 1 && plants[0] !== null ? { observationUnitDbId: String(plants[0]) } : {}),
      descriptiveOntologyTerms: [],
      additionalInfo: {
        sha256: p.sha256,
        uploadedMimeType: p.mime,
        uprightWidth: String(p.width),
        uprightHeight: String(p.height),
        sourceProfile: p.sourceProfile,
        ...(p.capturedAt ? { capturedAt: p.capturedAt } : {}),
        note: 'imageURL serves the upright sRGB display copy (longest side at most 2048 px); on-screen colours are approximate.',
      },
    };
  });
}
