// What a region's pixels say: which are dropped (clipped, near-black), the trimmed mean in linear
// light, and the spread. Used by the server on the stored sRGB derivative and by the client's
// preview on its canvas, so both follow one set of rules.
import { converter } from 'culori';
import { deltaE00 } from '../colour/delta-e.js';
import { fromCulori, type Lab } from '../colour/lab.js';
import type { RegionMask } from './region.js';
import { CLIPPED_CODE_VALUE, DARK_PIXEL_L, SPREAD_SAMPLE_MAX, TRIM_FRACTION, UNIFORM_SPREAD_MAX_DE00 } from './sampling-rules.js';

/** Linear-light RGB, sRGB primaries and white (culori's `lrgb`); channels may leave [0, 1] after a correction. */
export type LinearRgb = [number, number, number];

/** A 3×3 matrix, row-major: corrected = M · measured (column vectors of linear RGB). */
export type Matrix3 = [[number, number, number], [number, number, number], [number, number, number]];

const toLinear = converter('lrgb');
const toXyz65 = converter('xyz65');
const toLab65 = converter('lab65');

/** Linear value of each 8-bit sRGB code value: the IEC 61966-2-1 decoding, through culori's `lrgb`. */
export const LINEAR_OF_CODE: Float64Array = Float64Array.from({ length: 256 }, (_, v) => toLinear({ mode: 'rgb', r: v / 255, g: 0, b: 0 }).r);

/** Luminance weights of linear R, G, B: the Y of each sRGB primary (culori's `xyz65`, IEC 61966-2-1 matrix row Y). */
const LUMINANCE = [1, 2, 3].map((i) => toXyz65({ mode: 'lrgb', r: i === 1 ? 1 : 0, g: i === 2 ? 1 : 0, b: i === 3 ? 1 : 0 }).y);

/** Each channel's share of Y per code value, so the near-black test is three look-ups. */
const Y_OF_CODE_R = LINEAR_OF_CODE.map((v) => LUMINANCE[0]! * v);
const Y_OF_CODE_G = LINEAR_OF_CODE.map((v) => LUMINANCE[1]! * v);
const Y_OF_CODE_B = LINEAR_OF_CODE.map((v) => LUMINANCE[2]! * v);

/** Relative luminance Y of a grey at `DARK_PIXEL_L` (culori's lab65 → xyz65). */
const DARK_Y = toXyz65({ mode: 'lab65', l: DARK_PIXEL_L, a: 0, b: 0 }).y;

/** What a region's pixels added up to. */
export interface RegionTally {
  /** Pixels inside the region. */
  total: number;
  /** Pixels kept for the mean. */
  kept: number;
  /** Dropped with a channel at or above `CLIPPED_CODE_VALUE`. */
  clipped: number;
  /** Dropped as near-black (below `DARK_PIXEL_L`). */
  dark: number;
  /** Per-channel histograms of kept code values: R at 0–255, G at 256–511, B at 512–767. */
  histogram: Uint32Array;
  /** Code-value triples of kept pixels taken at an even stride, for the spread. */
  samples: Uint8Array;
  sampleCount: number;
}

/** Collects a region's pixels in scan order; `total` is the mask's pixel count, for the spread stride. */
export class RegionAccumulator {
  private readonly histogram = new Uint32Array(768);
  private readonly samples: Uint8Array;
  private readonly stride: number;
  private seen = 0;
  private sampleCount = 0;
  private kept = 0;
  private clipped = 0;
  private dark = 0;

  constructor(private readonly total: number) {
    this.stride = Math.max(1, Math.ceil(total / SPREAD_SAMPLE_MAX));
    this.samples = new Uint8Array(3 * Math.ceil(total / this.stride));
  }

  /** One pixel, as 8-bit sRGB code values. */
  add(r: number, g: number, b: number): void {
    const index = this.seen++;
    if (r >= CLIPPED_CODE_VALUE || g >= CLIPPED_CODE_VALUE || b >= CLIPPED_CODE_VALUE) {
      this.clipped++;
      return;
    }
    if (Y_OF_CODE_R[r]! + Y_OF_CODE_G[g]! + Y_OF_CODE_B[b]! < DARK_Y) {
      this.dark++;
      return;
    }
    this.kept++;
    this.histogram[r]!++;
    this.histogram[256 + g]!++;
    this.histogram[512 + b]!++;
    if (index % this.stride === 0) {
      const o = 3 * this.sampleCount++;
      this.samples[o] = r;
      this.samples[o + 1] = g;
      this.samples[o + 2] = b;
    }
  }

  /** Adds the mask's pixels found in a buffer of code values covering image rows `top` … and columns `left` …. */
  addFrom(mask: RegionMask, buffer: ArrayLike<number>, view: { left: number; top: number; width: number; rows: number; channels: number }): void {
    const { spans } = mask;
    for (let s = 0; s < spans.length; s += 3) {
      const y = spans[s]!;
      if (y < view.top || y >= view.top + view.rows) continue;
      const rowStart = ((y - view.top) * view.width - view.left) * view.channels;
      for (let x = spans[s + 1]!; x < spans[s + 2]!; x++) {
        const o = rowStart + x * view.channels;
        this.add(buffer[o]!, buffer[o + 1]!, buffer[o + 2]!);
      }
    }
  }

  tally(): RegionTally {
    return {
      total: this.total,
      kept: this.kept,
      clipped: this.clipped,
      dark: this.dark,
      histogram: this.histogram,
      samples: this.samples.subarray(0, 3 * this.sampleCount),
      sampleCount: this.sampleCount,
    };
  }
}

/** Tallies a region over one buffer of code values that covers the whole mask (the preview's canvas, small server reads). */
export function tallyRegion(mask: RegionMask, buffer: ArrayLike<number>, view: { left: number; top: number; width: number; rows: number; channels: number }): RegionTally {
  const acc = new RegionAccumulator(mask.count);
  acc.addFrom(mask, buffer, view);
  return acc.tally();
}

/**
 * Per-channel trimmed mean in linear light: `TRIM_FRACTION` of the kept pixels cut from each end
 * of each channel's distribution, the rest averaged after decoding to linear. Computed exactly from
 * the histograms, so it is the same number in any pixel order. `null` when nothing was kept.
 */
export function trimmedLinearMean(tally: RegionTally): LinearRgb | null {
  if (tally.kept === 0) return null;
  const cut = Math.floor(tally.kept * TRIM_FRACTION);
  const channel = (offset: number) => {
    const counts = Array.from(tally.histogram.subarray(offset, offset + 256));
    dropFromEnd(counts, cut, 1);
    dropFromEnd(counts, cut, -1);
    let sum = 0;
    let n = 0;
    counts.forEach((c, v) => {
      sum += c * LINEAR_OF_CODE[v]!;
      n += c;
    });
    return sum / n;
  };
  return [channel(0), channel(256), channel(512)];
}

function dropFromEnd(counts: number[], cut: number, direction: 1 | -1): void {
  let left = cut;
  for (let i = direction === 1 ? 0 : counts.length - 1; left > 0 && i >= 0 && i < counts.length; i += direction) {
    const take = Math.min(left, counts[i]!);
    counts[i]! -= take;
    left -= take;
  }
}

/** `m · v`. */
export function applyMatrix(m: Matrix3, v: LinearRgb): LinearRgb {
  return [
    m[0][0] * v[0] + m[0][1] * v[1] + m[0][2] * v[2],
    m[1][0] * v[0] + m[1][1] * v[1] + m[1][2] * v[2],
    m[2][0] * v[0] + m[2][1] * v[1] + m[2][2] * v[2],
  ];
}

/**
 * Von Kries gains in linear RGB: per channel, target / measured, so the measured neutral becomes
 * the target (von Kries; docs/colour.md, Correction). Without a target, the grey of the measured luminance.
 */
export function vonKriesGains(measured: LinearRgb, target?: LinearRgb): LinearRgb {
  const y = luminance(measured);
  const t = target ?? [y, y, y];
  return [t[0] / measured[0], t[1] / measured[1], t[2] / measured[2]];
}

/** A diagonal matrix (von Kries gains). */
export function diagonal(g: LinearRgb): Matrix3 {
  return [
    [g[0], 0, 0],
    [0, g[1], 0],
    [0, 0, g[2]],
  ];
}

/** CIELAB D65 of linear sRGB (culori's lrgb → lab65); unclamped, so out-of-gamut results stay honest. */
export function linearToLab(v: LinearRgb): Lab {
  return fromCulori(toLab65({ mode: 'lrgb', r: v[0], g: v[1], b: v[2] }));
}

/** Linear sRGB of a CIELAB D65 colour (culori's lab65 → lrgb), unclamped. */
export function labToLinear(lab: Lab): LinearRgb {
  const c = toLinear({ mode: 'lab65', l: lab.l, a: lab.a, b: lab.b });
  return [c.r, c.g, c.b];
}

/** Relative luminance Y of linear sRGB. */
export function luminance(v: LinearRgb): number {
  return LUMINANCE[0]! * v[0] + LUMINANCE[1]! * v[1] + LUMINANCE[2]! * v[2];
}

/** The spread of a region: mean ΔE00 of the sampled kept pixels (corrected like the mean) from the mean. */
export function regionSpread(tally: RegionTally, mean: Lab, correction: Matrix3 | null): { spreadDeltaE00: number; spreadPixels: number; uniform: boolean } {
  let sum = 0;
  const s = tally.samples;
  for (let i = 0; i < tally.sampleCount; i++) {
    const raw: LinearRgb = [LINEAR_OF_CODE[s[3 * i]!]!, LINEAR_OF_CODE[s[3 * i + 1]!]!, LINEAR_OF_CODE[s[3 * i + 2]!]!];
    sum += deltaE00(mean, linearToLab(correction ? applyMatrix(correction, raw) : raw));
  }
  const spread = tally.sampleCount ? sum / tally.sampleCount : 0;
  return { spreadDeltaE00: spread, spreadPixels: tally.sampleCount, uniform: spread <= UNIFORM_SPREAD_MAX_DE00 };
}
