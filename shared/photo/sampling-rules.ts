// Every number photo sampling and correction rely on, with the reason beside it. Values marked
// "our own" are project choices, not published figures; the server and the client's preview use
// the same ones.
import { ACCEPTABILITY_THRESHOLD_DE00 } from '../colour/constants.js';

/** Version of the sampling pipeline, stored with a reading so a later change of rules is traceable. */
export const PHOTO_PIPELINE_VERSION = 'photo-sample/1';

/**
 * A pixel with any channel at or above this 8-bit sRGB code value counts as clipped or specular
 * and is dropped (our own). At 255 the sensor or the encoder has lost the real value; the margin
 * down to 250 catches the JPEG ringing around blown highlights and the near-white glints of the
 * waxy taro leaf surface, which would otherwise pull a mean towards white.
 */
export const CLIPPED_CODE_VALUE = 250;

/**
 * A pixel darker than this CIELAB L* (computed from its relative luminance Y) is near-black and
 * dropped (our own). There the few code values left carry more sensor and JPEG noise than colour;
 * L* 5 is a grey of 8-bit sRGB code value 17, far below the darkest tissue a recorder reads (the
 * deepest purple-black petioles photograph at about L* 15–25).
 */
export const DARK_PIXEL_L = 5;

/**
 * Fraction cut from each end of every channel's distribution before averaging (our own). A 10 %
 * trimmed mean performed best of the estimators Stigler compared on real measurement data
 * ("Do robust estimators deal with real data?", Ann. Statist. 5(6):1055–1098, 1977 — from memory);
 * it resists the veins, spots and small shadows inside a drawn region without discarding most of it.
 */
export const TRIM_FRACTION = 0.1;

/**
 * At most this many of a region's kept pixels enter the spread (our own): ΔE00 per pixel is the
 * expensive step, and 5,000 pixels, taken at an even stride in scan order, pin the mean ΔE00 to
 * well under 0.1 on any region.
 */
export const SPREAD_SAMPLE_MAX = 5000;

/**
 * A region is uniform when its pixels' mean ΔE00 from the region's mean is at most this (our own):
 * twice the acceptability threshold ΔE00 1.8 of Paravina et al. (2015), J. Esthet. Restor. Dent.
 * 27:S1–S9. Pixel noise of an evenly lit matt surface in a phone JPEG stays below it; veins,
 * stripes, spots or a shadow inside the region push it above.
 */
export const UNIFORM_SPREAD_MAX_DE00 = 2 * ACCEPTABILITY_THRESHOLD_DE00;

/**
 * A neutral card or target patch with more than this fraction of clipped pixels is refused (our
 * own): one pixel in twenty at the clipping level means the patch's true level is lost, and gains
 * or a matrix fitted to it would be wrong.
 */
export const REFERENCE_CLIPPED_MAX_FRACTION = 0.05;

/**
 * A neutral card darker than this L* is refused (our own): a grey card three stops under-exposed
 * still reads about L* 17; below 15 the gains would multiply noise more than they correct light.
 */
export const NEUTRAL_MIN_L = 15;

/**
 * Largest per-channel von Kries gain (and its reciprocal the smallest) accepted from a neutral
 * card (our own): even a tungsten lamp against daylight white needs gains within about 2.5; beyond
 * 4 the region marked is not a neutral card.
 */
export const NEUTRAL_GAIN_MAX = 4;

/**
 * A multi-patch fit whose worst patch lies further than this ΔE00 from its known value is refused
 * (our own): about three times the acceptability threshold 1.8 (Paravina et al. 2015). A worse fit
 * means a region is on the wrong patch, the patches were in different light, or the camera's
 * response is not linear enough for a 3×3 matrix; applying it would move readings more than it
 * corrects them.
 */
export const PATCH_RESIDUAL_MAX_DE00 = 5;

/** Fewest patches of a multi-patch fit: a 3×3 matrix has 9 unknowns, 3 per patch; 4 leave residuals to judge it by. */
export const PATCHES_MIN = 4;
/** Most patches of one fit (our own; common targets carry 24). */
export const PATCHES_MAX = 30;
/** Most vertices of a polygon region (our own). */
export const POLYGON_POINTS_MAX = 200;

/**
 * A region that is not uniform is split into this many colour clusters at most (our own): a
 * petiole stripe on its ground, or a variegated or mottled blade, holds two or three colours.
 */
export const CLUSTER_COUNTS = [2, 3] as const;

/** Seed of the k-means++ start, so the same region always splits the same way (our own). */
export const CLUSTER_SEED = 0x43_4c_55_53;

/**
 * Three clusters are kept instead of two only when they bring the pixels' mean ΔE00 from their
 * cluster's colour down to at most this fraction of what two give (our own): a third colour must
 * explain much of what two leave over, not just split JPEG noise.
 */
export const THIRD_CLUSTER_GAIN = 0.7;

/**
 * Every two clusters kept must be at least this far apart in ΔE00 (our own: the spread above which
 * a region counts as not uniform). Closer clusters are one colour split by noise or shading, and
 * the split with one cluster fewer is answered.
 */
export const CLUSTER_MIN_SEPARATION_DE00 = UNIFORM_SPREAD_MAX_DE00;

/** A cluster holding less than this share of the kept pixels is not answered as a colour (our own: edge pixels between stripes). */
export const CLUSTER_MIN_SHARE = 0.05;
