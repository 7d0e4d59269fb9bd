// Photos made in the tests with sharp: flat patches of known colours, optionally cast, rotated,
// tagged with a profile or sprinkled with highlights. Every truth is computed with culori.
import { readdirSync, statSync } from 'node:fs';
import path from 'node:path';
import { converter, parse } from 'culori';
import sharp, { type Sharp } from 'sharp';
import { fromCulori, type Lab } from '../../shared/colour/lab.js';
import { LINEAR_OF_CODE, type LinearRgb } from '../../shared/photo/region-stats.js';
import type { Client } from './harness.js';

const toRgb = converter('rgb');
const toLab65 = converter('lab65');

/** 8-bit sRGB code values. */
export type Rgb8 = [number, number, number];

/** One flat patch of a test scene. */
export interface Patch {
  /** The colour written into the file (8-bit sRGB). */
  rgb: Rgb8;
  x: number;
  y: number;
  width: number;
  height: number;
}

/** `#rrggbb` → code values. */
export function hexToRgb8(hex: string): Rgb8 {
  const c = toRgb(parse(hex)!);
  return [Math.round(c.r * 255), Math.round(c.g * 255), Math.round(c.b * 255)];
}

/** CIELAB D65 of 8-bit sRGB code values, through culori. */
export function labOfRgb8(rgb: Rgb8): Lab {
  return fromCulori(toLab65({ mode: 'rgb', r: rgb[0] / 255, g: rgb[1] / 255, b: rgb[2] / 255 }));
}

/** Linear RGB → 8-bit sRGB code values (culori's lrgb → rgb), refusing values outside [0, 1]. */
export function linearToRgb8(v: LinearRgb): Rgb8 {
  if (v.some((x) => x < 0 || x > 1)) throw new RangeError(`test colour out of range: ${v.join(', ')}`);
  const c = toRgb({ mode: 'lrgb', r: v[0], g: v[1], b: v[2] });
  return [Math.round(c.r * 255), Math.round(c.g * 255), Math.round(c.b * 255)];
}

/** Code values → linear. */
export function rgb8ToLinear(rgb: Rgb8): LinearRgb {
  return [LINEAR_OF_CODE[rgb[0]]!, LINEAR_OF_CODE[rgb[1]]!, LINEAR_OF_CODE[rgb[2]]!];
}

/** A raw RGB scene: a background and rectangular patches painted over it in order. */
export function paintScene(width: number, height: number, background: Rgb8, patches: readonly Patch[]): Buffer {
  const px = Buffer.alloc(width * height * 3);
  for (let i = 0; i < width * height; i++) px.set(background, i * 3);
  for (const p of patches) {
    for (let y = p.y; y < p.y + p.height; y++) for (let x = p.x; x < p.x + p.width; x++) px.set(p.rgb, (y * width + x) * 3);
  }
  return px;
}

/** A grid of equal patches, `columns` across, with `gap` pixels of background between and around them. */
export function patchGrid(colours: readonly Rgb8[], columns: number, size = 120, gap = 20): { width: number; height: number; patches: Patch[] } {
  const rows = Math.ceil(colours.length / columns);
  const patches = colours.map((rgb, i) => ({ rgb, x: gap + (i % columns) * (size + gap), y: gap + Math.floor(i / columns) * (size + gap), width: size, height: size }));
  return { width: gap + columns * (size + gap), height: gap + rows * (size + gap), patches };
}

/** A sharp pipeline over raw RGB pixels. */
export function fromRaw(px: Buffer, width: number, height: number): Sharp {
  return sharp(px, { raw: { width, height, channels: 3 } });
}

/** A rectangle region inset into a patch, clear of JPEG edge blur. */
export function insetRect(p: Patch, inset = 20) {
  return { shape: 'rect' as const, x: p.x + inset, y: p.y + inset, width: p.width - 2 * inset, height: p.height - 2 * inset };
}

/** Uploads bytes as the `photo` field. */
export function uploadPhoto(client: Client, bytes: Buffer, filename = 'leaf.jpg', contentType = 'image/jpeg') {
  return client.raw('post', '/api/photos').attach('photo', bytes, { filename, contentType });
}

/** Every file (not folder) under a folder, relative; [] when it does not exist. */
export function filesUnder(dir: string): string[] {
  let names: string[];
  try {
    names = readdirSync(dir);
  } catch {
    return [];
  }
  return names.flatMap((name) => {
    const p = path.join(dir, name);
    return statSync(p).isDirectory() ? filesUnder(p).map((f) => path.join(name, f)) : [name];
  });
}

/** Vertical stripes repeating the given colours and widths (pixels) across a raw RGB image, as on a striped petiole. */
export function stripedPixels(width: number, height: number, pattern: readonly { rgb: Rgb8; width: number }[]): Buffer {
  const period = pattern.reduce((n, p) => n + p.width, 0);
  const px = Buffer.alloc(width * height * 3);
  for (let x = 0; x < width; x++) {
    let offset = x % period;
    const band = pattern.find((p) => (offset -= p.width) < 0)!;
    for (let y = 0; y < height; y++) px.set(band.rgb, (y * width + x) * 3);
  }
  return px;
}
