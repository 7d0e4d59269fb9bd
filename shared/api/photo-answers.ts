// Answer types and limits of the photo routes. No zod here, so the client can import them
// cheaply; the request schemas are in photos.ts.
import type { SampleBody } from './photos.js';
import type { LabTuple } from '../colour/lab.js';
import type { Matrix3 } from '../photo/region-stats.js';
import type { Region } from '../photo/region.js';
import type { LchTuple, MatchBetween, MatchedChip } from './reference-set-answers.js';

export type { Region, RegionShape } from '../photo/region.js';
export type { Matrix3 } from '../photo/region-stats.js';

/** Largest upload accepted: a full-resolution phone JPEG is 3–12 MB (our own cap). */
export const PHOTO_MAX_BYTES = 25 * 1024 * 1024;

/** Most pixels a photo may have, against decompression bombs: 100 MP covers every phone camera mode short of 200 MP sensors (our own). */
export const PHOTO_MAX_PIXELS = 100_000_000;

/** The multipart field that carries the photo. */
export const PHOTO_FIELD = 'photo';

/** Photo formats accepted, by sharp's format name: what phones and cameras write. */
export const PHOTO_FORMATS = ['jpeg', 'png', 'webp', 'heif', 'tiff'] as const;

/** One stored photo (`POST /api/photos`, `GET /api/photos/:id`). */
export interface PhotoDto {
  id: number;
  /** Upright size (EXIF orientation applied): region coordinates refer to it. */
  width: number;
  height: number;
  /** SHA-256 of the uploaded bytes, hex. */
  sha256: string;
  /** The embedded ICC profile's description ("Display P3", "sRGB IEC61966-2.1"), or "none" (read as sRGB). */
  sourceProfile: string;
  /** Media type sniffed from the bytes. */
  mime: string;
  /** EXIF capture time as written by the camera, ISO 8601 local time with its offset when the camera gave one. */
  capturedAt: string | null;
  /** EXIF orientation of the original (1–8; 1 when absent). */
  orientation: number;
  byteSize: number;
  uploadedById: number;
  createdAt: string;
  /** Upright sRGB JPEG for display (longest side at most `PHOTO_DISPLAY_MAX_SIDE`). */
  imageUrl: string;
  thumbUrl: string;
}

/** Longest side of the display copy, in pixels (our own: sharp enough to zoom into on a phone, small enough to load in a field). */
export const PHOTO_DISPLAY_MAX_SIDE = 2048;
/** Longest side of the thumbnail. */
export const PHOTO_THUMB_MAX_SIDE = 320;

/** Which pixels of a region were used. */
export interface PixelUse {
  /** Pixels averaged (inside the region and kept). */
  pixelCount: number;
  /** Pixels inside the region but dropped: `clipped + dark`. */
  pixelsDropped: number;
  clipped: number;
  dark: number;
}

/** The correction applied to a sample. */
export type SampleCorrection =
  | { kind: 'none' }
  | {
      kind: 'neutral';
      /** Per-channel gains in linear RGB (von Kries). */
      gains: [number, number, number];
      /** The neutral region as measured, before correction. */
      measuredLab: LabTuple;
      /** What it was made to read. */
      targetLab: LabTuple;
      pixels: PixelUse;
    }
  | {
      kind: 'patches';
      /** Row-major 3×3, corrected linear RGB = matrix · measured linear RGB. */
      matrix: Matrix3;
      /** One per patch, in the order sent. */
      residuals: PatchResidual[];
      maxResidualDeltaE00: number;
    };

/** How well the fitted matrix reproduces one patch. */
export interface PatchResidual {
  /** The patch's known CIELAB. */
  lab: LabTuple;
  /** What the corrected photo says it is. */
  fittedLab: LabTuple;
  deltaE00: number;
}

/** One colour of a region that is not uniform (a stripe and its ground, the patches of a mottle). */
export interface RegionCluster {
  /** The cluster's pixels averaged in linear light, corrected like the region's mean. */
  lab: LabTuple;
  lch: LchTuple;
  hex: string;
  inGamut: boolean;
  /** Share of the region's kept pixels, 0–1 (over the pixels the spread was computed on). */
  share: number;
  /** Mean ΔE00 of the cluster's pixels from its colour. */
  spreadDeltaE00: number;
  /** The nearest chip of the set matched against. */
  chip: MatchedChip;
}

/** `POST /api/photos/:id/sample` answer. */
export interface PhotoSample extends PixelUse {
  photoId: number;
  region: Region;
  lab: LabTuple;
  lch: LchTuple;
  hex: string;
  inGamut: boolean;
  /** Mean ΔE00 of the region's kept pixels from `lab`. */
  spreadDeltaE00: number;
  /** How many pixels the spread was computed over (an even stride of the kept ones on big regions). */
  spreadPixels: number;
  /** Whether the spread is at most `UNIFORM_SPREAD_MAX_DE00`. */
  uniform: boolean;
  /**
   * When the region is not uniform: its two or three colours (k-means in CIELAB), largest share
   * first; empty when it is uniform or its pixels hold no separate colours. The region's `lab` is
   * their mixture, a colour that may not be on the plant.
   */
  clusters: RegionCluster[];
  correction: SampleCorrection;
  matches: MatchedChip[];
  between: MatchBetween | null;
  /** The reference set matched against. */
  setId: string;
  /** Sampling rules version (`PHOTO_PIPELINE_VERSION`). */
  pipeline: string;
}

/** `POST /api/photos/:id/sample` body as the client sends it. */
export type SampleRequest = SampleBody;

/** Where a photo's display copy and thumbnail are served. */
export function photoImageUrl(id: number): string {
  return `/api/photos/${id}/image`;
}
export function photoThumbUrl(id: number): string {
  return `/api/photos/${id}/thumb`;
}
