// Reading an upload with sharp: what it is (sniffed from the bytes), and the upright sRGB copies
// made once at upload so that sampling never decodes the original again.
import { writeFile } from 'node:fs/promises';
import path from 'node:path';
import sharp, { type Metadata, type Sharp } from 'sharp';
import { PHOTO_DISPLAY_MAX_SIDE, PHOTO_FORMATS, PHOTO_MAX_PIXELS, PHOTO_THUMB_MAX_SIDE } from '../../shared/api/photo-answers.js';
import { AppError } from '../core/app-error.js';
import { exifCaptureTime } from './exif.js';
import { iccProfileName } from './icc.js';
import { EXTENSION_OF, PHOTO_FILES } from './photo-files.js';

/** What an upload is, read from its header alone (no pixels decoded). */
export interface PhotoFacts {
  format: (typeof PHOTO_FORMATS)[number];
  mime: string;
  /** Upright size. */
  width: number;
  height: number;
  orientation: number;
  sourceProfile: string;
  capturedAt: string | null;
  /** Whether the original has 16 bits per channel and an embedded profile (see `uprightPipeline`). */
  wideWithProfile: boolean;
}

/** JPEG quality of the display copy and thumbnail (our own: no visible blocking at phone sizes). */
const DISPLAY_QUALITY = 85;
const THUMB_QUALITY = 75;

/**
 * Reads the header of an upload: 415 for anything that is not a photo in an accepted format,
 * 413 for more pixels than `PHOTO_MAX_PIXELS` (decompression bombs), checked before any decoding.
 */
export async function inspectUpload(bytes: Buffer): Promise<PhotoFacts> {
  let md: Metadata;
  try {
    // Header only; the pixel limit is applied by the decoding pipelines below.
    md = await sharp(bytes, { limitInputPixels: false }).metadata();
  } catch {
    throw unsupported('The file is not an image the server can read.');
  }
  const format = PHOTO_FORMATS.find((f) => f === md.format);
  if (!format) throw unsupported(`${md.format.toUpperCase()} files are not accepted as photos.`);
  const mime = md.mediaType ?? `image/${format}`;
  if (!EXTENSION_OF[mime]) throw unsupported(`${mime} files are not accepted as photos.`);
  if (!(md.width > 0 && md.height > 0)) throw unsupported('The image has no size.');
  if (md.width * md.height > PHOTO_MAX_PIXELS) {
    throw new AppError(
      413,
      'Too many pixels',
      `The image is ${md.width} × ${md.height} pixels; the server takes at most ${PHOTO_MAX_PIXELS / 1e6} megapixels. Use the camera's normal photo size.`,
      undefined,
      'too-many-pixels',
    );
  }
  return {
    format,
    mime,
    width: md.autoOrient.width,
    height: md.autoOrient.height,
    orientation: md.orientation ?? 1,
    sourceProfile: iccProfileName(md.hasProfile ? md.icc : undefined),
    capturedAt: exifCaptureTime(md.exif),
    wideWithProfile: md.hasProfile && (md.depth === 'ushort' || md.space === 'rgb16'),
  };
}

/**
 * Writes the original, the upright sRGB derivative for sampling, the display copy and the
 * thumbnail into `dir`. A decoding failure (a damaged or truncated file) is a 400.
 */
export async function writeDerivatives(bytes: Buffer, facts: PhotoFacts, dir: string): Promise<void> {
  await writeFile(path.join(dir, PHOTO_FILES.original(EXTENSION_OF[facts.mime]!)), bytes);
  const upright = path.join(dir, PHOTO_FILES.upright);
  try {
    const info = await uprightPipeline(bytes, facts)
      .tiff({ compression: 'deflate', predictor: 'horizontal', tile: true, tileWidth: 256, tileHeight: 256 })
      .toFile(upright);
    if (info.width !== facts.width || info.height !== facts.height || info.channels !== 3) throw new Error(`unexpected derivative ${info.width}×${info.height}×${info.channels}`);
  } catch (err) {
    if (err instanceof AppError) throw err;
    if (facts.format === 'heif') throw unsupported('This HEIF/HEIC photo cannot be decoded here (the server reads AVIF-coded HEIF only). Share it as JPEG, or set the camera to its most compatible format.');
    throw new AppError(400, 'Unreadable image', 'The image is damaged or incomplete (was the upload cut off?). Take or choose the photo again.', undefined, 'unreadable-image');
  }
  await resized(upright, PHOTO_DISPLAY_MAX_SIDE, DISPLAY_QUALITY).toFile(path.join(dir, PHOTO_FILES.display));
  await resized(upright, PHOTO_THUMB_MAX_SIDE, THUMB_QUALITY).toFile(path.join(dir, PHOTO_FILES.thumb));
}

/**
 * The original decoded upright (EXIF orientation applied) and in 8-bit sRGB without alpha.
 * sharp converts an embedded profile to sRGB on input — except for 16-bit images, which it takes
 * into Display P3 and then relabels as sRGB without converting (sharp 0.35 pipeline.cc); for those
 * an explicit output transform to sRGB is added. `failOn: 'error'` refuses truncated data.
 */
function uprightPipeline(bytes: Buffer, facts: PhotoFacts): Sharp {
  const pipeline = sharp(bytes, { limitInputPixels: PHOTO_MAX_PIXELS, failOn: 'error', autoOrient: true }).removeAlpha().toColourspace('srgb');
  return facts.wideWithProfile ? pipeline.withIccProfile('srgb', { attach: false }) : pipeline;
}

function resized(upright: string, side: number, quality: number): Sharp {
  return sharp(upright, { limitInputPixels: false })
    .resize({ width: side, height: side, fit: 'inside', withoutEnlargement: true })
    .jpeg({ quality });
}

function unsupported(detail: string): AppError {
  return new AppError(415, 'Not a photo', `${detail} Send a JPEG, PNG, WebP, HEIF (AVIF) or TIFF photo.`, undefined, 'unsupported-media-type');
}
