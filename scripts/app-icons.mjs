// Draws Hueledger's home-screen icons: a peltate taro leaf blade (tip up, two rounded basal lobes,
// the petiole joined inside the blade above the notch, veins fanning from that point) in light leaf
// green on the brand's deep leaf green. Writes public/icons/*.png and the SVG they come from.
// Run: node scripts/app-icons.mjs (the PNGs are committed; rerun after changing the drawing).
import { mkdirSync, writeFileSync } from 'node:fs';
import path from 'node:path';
import { fileURLToPath } from 'node:url';
import sharp from 'sharp';

const OUT = path.resolve(path.dirname(fileURLToPath(import.meta.url)), '../public/icons');
const LEAF_DEEP = '#23501e'; // toolbar and primary green (src/styles.scss)
const LEAF_LIGHT = '#8cc07e';
const CREAM = '#f7edda'; // the corm-cream surface

/** The leaf on a 512 × 512 canvas, scaled by `k` about the centre (maskable icons keep to the middle 80 %). */
function leaf(k) {
  return `<g transform="translate(256 262) scale(${k}) translate(-256 -262)">
    <path d="M256 352 L300 500" stroke="${CREAM}" stroke-width="26" stroke-linecap="round"/>
    <path d="M256 64 C334 116 434 190 424 292 C416 372 382 428 330 432 C294 435 270 402 256 352 C242 402 218 435 182 432 C130 428 96 372 88 292 C78 190 178 116 256 64 Z" fill="${LEAF_LIGHT}"/>
    <g stroke="${LEAF_DEEP}" stroke-width="9" stroke-linecap="round" fill="none" opacity="0.85">
      <path d="M256 300 L256 96"/>
      <path d="M256 300 C220 260 180 225 138 200"/><path d="M256 300 C292 260 332 225 374 200"/>
      <path d="M256 300 C226 300 180 290 120 300"/><path d="M256 300 C286 300 332 290 392 300"/>
      <path d="M256 300 C230 340 200 380 178 410"/><path d="M256 300 C282 340 312 380 334 410"/>
    </g>
    <circle cx="256" cy="300" r="13" fill="${CREAM}"/>
  </g>`;
}

/** The icon as SVG: rounded tile for "any", full bleed with a smaller leaf for "maskable". */
function icon(maskable) {
  const background = maskable ? `<rect width="512" height="512" fill="${LEAF_DEEP}"/>` : `<rect width="512" height="512" rx="112" fill="${LEAF_DEEP}"/>`;
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 512 512">${background}${leaf(maskable ? 0.72 : 0.9)}</svg>\n`;
}

mkdirSync(OUT, { recursive: true });
writeFileSync(path.join(OUT, 'icon.svg'), icon(false));
const outputs = [
  ['icon-192.png', false, 192],
  ['icon-512.png', false, 512],
  ['maskable-192.png', true, 192],
  ['maskable-512.png', true, 512],
  // iOS draws its own rounded corners and ignores transparency: full bleed, like the maskable one.
  ['apple-touch-icon.png', true, 180],
];
for (const [name, maskable, size] of outputs) {
  await sharp(Buffer.from(icon(maskable)), { density: 72 * (size / 512) * 2 })
    .resize(size, size)
    .png({ compressionLevel: 9 })
    .toFile(path.join(OUT, name));
}
console.log(`icons written to ${OUT}`);
