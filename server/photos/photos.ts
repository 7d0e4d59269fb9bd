// Photos as a business component: store an upload once by content hash, hand out its files,
// and sample regions of it with optional correction. No req/res here.
import { createHash } from 'node:crypto';
import { existsSync } from 'node:fs';
import type { DataSource } from 'typeorm';
import type { PhotoDto, PhotoSample, PixelUse, RegionCluster, SampleCorrection } from '../../shared/api/photo-answers.js';
import type { SampleBody } from '../../shared/api/photos.js';
import type { MatchAnswer } from '../../shared/api/reference-set-answers.js';
import { labFromTuple, labToTuple, type Lab } from '../../shared/colour/lab.js';
import { applyMatrix, diagonal, linearToLab, regionSpread, trimmedLinearMean, type LinearRgb, type Matrix3, type RegionTally } from '../../shared/photo/region-stats.js';
import { rasteriseRegion, RegionError, type Region, type RegionMask } from '../../shared/photo/region.js';
import { PHOTO_PIPELINE_VERSION, REFERENCE_CLIPPED_MAX_FRACTION } from '../../shared/photo/sampling-rules.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { fitPatchMatrix, neutralGains } from './correction.js';
import { inspectUpload, writeDerivatives } from './normalise.js';
import { PHOTO_FILES, PhotoFiles } from './photo-files.js';
import { Photo, toPhotoDto } from './photo.entity.js';
import { tallyFromFile } from './region-reader.js';
import { colourClusters } from './colour-clusters.js';

/** Matches a CIELAB colour against the current reference set (the app's `ReferenceSets.match`). */
export type MatchColour = (lab: Lab, k: number) => Promise<MatchAnswer>;

/** Nearest chips in a sample answer when `k` is not sent (our own; the strip on a phone shows five). */
const SAMPLE_K_DEFAULT = 5;

/**
 * Stores an upload: sniffs and checks it, writes the original and its upright sRGB copies through
 * a staging folder, then saves the row. The same bytes again return the stored photo
 * (`created: false`). On any refusal nothing remains: no row, no file, no staging folder.
 */
export async function storePhoto(ds: DataSource, files: PhotoFiles, actor: Actor, bytes: Buffer): Promise<{ photo: PhotoDto; created: boolean }> {
  const sha256 = createHash('sha256').update(bytes).digest('hex');
  const existing = await ds.getRepository(Photo).findOneBy({ sha256 });
  if (existing && existsSync(files.file(sha256, PHOTO_FILES.upright))) return { photo: toPhotoDto(existing), created: false };

  const facts = await inspectUpload(bytes);
  const staged = await files.stage();
  try {
    await writeDerivatives(bytes, facts, staged);
  } catch (err) {
    await files.discard(staged);
    throw err;
  }
  const placed = await files.commit(staged, sha256);
  if (existing) return { photo: toPhotoDto(existing), created: false };
  try {
    const photo = await ds.transaction(async (m) => {
      const row = await m.save(
        m.create(Photo, {
          sha256,
          mime: facts.mime,
          width: facts.width,
          height: facts.height,
          sourceProfile: facts.sourceProfile,
          capturedAt: facts.capturedAt,
          orientation: facts.orientation,
          byteSize: bytes.length,
          uploadedBy: { id: actor.id! },
        }),
      );
      await recordAudit(m, actor, 'photo.uploaded', `photo:${row.id}`, { sha256, mime: facts.mime, width: facts.width, height: facts.height, sourceProfile: facts.sourceProfile });
      return row;
    });
    return { photo: toPhotoDto(await findPhotoRow(ds, photo.id)), created: true };
  } catch (err) {
    // A parallel upload of the same bytes won the unique sha256: answer with its row.
    const winner = await ds.getRepository(Photo).findOneBy({ sha256 });
    if (winner) return { photo: toPhotoDto(winner), created: false };
    if (placed) await files.remove(sha256);
    throw err;
  }
}

/** A photo's row; 404 when there is none. */
export async function findPhotoRow(ds: DataSource, id: number): Promise<Photo> {
  const photo = await ds.getRepository(Photo).findOneBy({ id });
  if (!photo) throw AppError.notFound(`There is no photo ${id}.`);
  return photo;
}

/** The path of one of a photo's files (display copy or thumbnail). */
export async function photoFile(ds: DataSource, files: PhotoFiles, id: number, which: 'display' | 'thumb'): Promise<{ path: string; sha256: string }> {
  const photo = await findPhotoRow(ds, id);
  const path = files.file(photo.sha256, PHOTO_FILES[which]);
  if (!existsSync(path)) throw AppError.notFound(`The files of photo ${id} are missing from the data folder.`);
  return { path, sha256: photo.sha256 };
}

/**
 * Samples a region of a photo (docs/colour.md, Photo sampling): clipped and near-black pixels dropped, the trimmed
 * mean in linear light, corrected by a neutral card or a patch fit when given, CIELAB D65, spread,
 * and the nearest chips. The same photo and body always give the same numbers.
 */
export async function samplePhoto(ds: DataSource, files: PhotoFiles, match: MatchColour, id: number, body: SampleBody): Promise<PhotoSample> {
  const photo = await findPhotoRow(ds, id);
  const upright = files.file(photo.sha256, PHOTO_FILES.upright);
  if (!existsSync(upright)) throw AppError.notFound(`The files of photo ${id} are missing from the data folder.`);
  const read = async (region: Region, field: string) => tallyFromFile(upright, maskOf(region, photo, field));

  const tally = await read(body.region, 'region');
  const measured = trimmedLinearMean(tally);
  if (!measured) throw AppError.badRequest(`Every pixel of the region is clipped or near-black (${tally.clipped} clipped, ${tally.dark} dark); draw it on lit tissue.`, [{ field: 'region', message: 'no usable pixels' }]);

  const { matrix, correction } = await correctionFor(body, read);
  const mean = matrix ? applyMatrix(matrix, measured) : measured;
  const lab = linearToLab(mean);
  const spread = regionSpread(tally, lab, matrix);
  const matched = await match(lab, body.k ?? SAMPLE_K_DEFAULT);
  const clusters = spread.uniform ? [] : await clustersOf(tally, matrix, match);
  return {
    photoId: photo.id,
    region: body.region,
    lab: matched.input.lab,
    lch: matched.input.lch,
    hex: matched.input.hex,
    inGamut: matched.input.inGamut,
    ...pixelUse(tally),
    ...spread,
    clusters,
    correction,
    matches: matched.matches,
    between: matched.between,
    setId: matched.setId,
    pipeline: PHOTO_PIPELINE_VERSION,
  };
}

/** The colours of a region that is not uniform, each matched to its nearest chip (`colourClusters`). */
async function clustersOf(tally: RegionTally, matrix: Matrix3 | null, match: MatchColour): Promise<RegionCluster[]> {
  const answers: RegionCluster[] = [];
  for (const c of colourClusters(tally, matrix)) {
    const matched = await match(c.lab, 1);
    answers.push({ ...matched.input, share: c.share, spreadDeltaE00: c.spreadDeltaE00, chip: matched.matches[0]! });
  }
  return answers;
}

async function correctionFor(body: SampleBody, read: (region: Region, field: string) => Promise<RegionTally>): Promise<{ matrix: Matrix3 | null; correction: SampleCorrection }> {
  if (body.neutral) {
    const tally = await read(body.neutral.region, 'neutral.region');
    const measured = referenceMean(tally, 'neutral', 'The neutral card');
    const { gains, target } = neutralGains(measured, body.neutral.lab ? labFromTuple(body.neutral.lab) : undefined);
    return {
      matrix: diagonal(gains),
      correction: { kind: 'neutral', gains, measuredLab: labToTuple(linearToLab(measured)), targetLab: labToTuple(target), pixels: pixelUse(tally) },
    };
  }
  if (body.patches) {
    const measured: LinearRgb[] = [];
    for (const [i, patch] of body.patches.entries()) {
      measured.push(referenceMean(await read(patch.region, `patches.${i}.region`), `patches.${i}`, `Patch ${i + 1}`));
    }
    const { matrix, residuals, max } = fitPatchMatrix(measured, body.patches.map((p) => labFromTuple(p.lab)));
    return { matrix, correction: { kind: 'patches', matrix, residuals, maxResidualDeltaE00: max } };
  }
  return { matrix: null, correction: { kind: 'none' } };
}

/** The trimmed mean of a reference region, refused when it is clipped or has nothing usable. */
function referenceMean(tally: RegionTally, field: string, what: string): LinearRgb {
  if (tally.clipped / tally.total > REFERENCE_CLIPPED_MAX_FRACTION) {
    const detail = `${what} is over-exposed: ${Math.round((100 * tally.clipped) / tally.total)} % of its pixels are clipped (at most ${REFERENCE_CLIPPED_MAX_FRACTION * 100} %). Take the photo with less light on the card, or expose for it.`;
    throw new AppError(400, 'Correction refused', detail, [{ field, message: 'clipped' }], 'correction-refused');
  }
  const mean = trimmedLinearMean(tally);
  if (!mean) throw new AppError(400, 'Correction refused', `${what} has no usable pixels (all near-black).`, [{ field, message: 'too dark' }], 'correction-refused');
  return mean;
}

function maskOf(region: Region, photo: Photo, field: string): RegionMask {
  try {
    return rasteriseRegion(region, photo.width, photo.height);
  } catch (err) {
    if (err instanceof RegionError) throw AppError.badRequest(err.message, [{ field, message: err.message }]);
    throw err;
  }
}

function pixelUse(t: RegionTally): PixelUse {
  return { pixelCount: t.kept, pixelsDropped: t.clipped + t.dark, clipped: t.clipped, dark: t.dark };
}
