import { mulberry32 } from '../random/mulberry32.js';
import { isInSrgbGamut } from './display-hex.js';
import { labToLch, type Lab, type Lch } from './lab.js';

/** A region of CIELAB D65 given in LCh(ab): L* and C*ab ranges, and a hue arc in degrees. */
export interface TissueRegion {
  id: string;
  label: string;
  /** L* from, to (inclusive). */
  l: readonly [number, number];
  /** C*ab from, to (inclusive). */
  c: readonly [number, number];
  /** h°ab arc from, to (to < from wraps through 0°); from inclusive, to exclusive. */
  h: readonly [number, number];
}

/**
 * Where taro tissue colours live, in CIELAB D65 LCh(ab) — the regions the fine chips are densest
 * in and the coverage requirement is tested on (reference-colors/README.md). Our own definitions, drawn wide
 * enough to hold the tissue colours named in docs/colour.md (chlorophyll greens and yellow-greens of
 * leaves and petioles; anthocyanin pinks, reds, red-purples and purples of petioles, skins and
 * flesh flecks; creams and yellows of corm flesh; browns of skins and scars).
 */
export const TISSUE_REGIONS: readonly TissueRegion[] = [
  { id: 'chlorophyll', label: 'chlorophyll greens and yellow-greens', l: [15, 80], c: [5, 55], h: [95, 155] },
  { id: 'anthocyanin', label: 'anthocyanin pinks, reds, red-purples and purples', l: [10, 85], c: [5, 60], h: [290, 45] },
  { id: 'corm-flesh', label: 'creams and yellows of corm flesh', l: [65, 97], c: [3, 50], h: [65, 105] },
  { id: 'skin-scar', label: 'browns of skins and scars', l: [15, 60], c: [5, 45], h: [35, 80] },
];

/**
 * Version 2's tissue regions: v1's, widened where an independent sample of tissue colours fell
 * outside them — near-neutral whites and greys of corm flesh and roots (C*ab below 5, L* 55–98),
 * leaf greens up to C*ab 70, and anthocyanin violets from h°ab 275. Our own definitions.
 */
export const TISSUE_REGIONS_V2: readonly TissueRegion[] = [
  { id: 'near-neutral', label: 'near-neutral whites and greys of corm flesh and roots', l: [55, 98], c: [0, 5], h: [0, 360] },
  { id: 'chlorophyll', label: 'chlorophyll greens and lime greens', l: [15, 80], c: [5, 70], h: [95, 155] },
  { id: 'anthocyanin', label: 'anthocyanin pinks, reds, plums, purples and violets', l: [10, 85], c: [5, 60], h: [275, 45] },
  { id: 'corm-flesh', label: 'creams and yellows of corm flesh', l: [65, 97], c: [3, 50], h: [65, 105] },
  { id: 'skin-scar', label: 'browns of skins and scars', l: [15, 60], c: [5, 45], h: [35, 80] },
];

/** Whether hue `h` lies on the arc [from, to), wrapping through 0° when to < from. */
export function onHueArc(h: number, [from, to]: readonly [number, number]): boolean {
  const x = ((h % 360) + 360) % 360;
  return from <= to ? x >= from && x < to : x >= from || x < to;
}

/** Whether an LCh(ab) colour lies in the region. */
export function inTissueRegion(lch: Lch, region: TissueRegion): boolean {
  return lch.l >= region.l[0] && lch.l <= region.l[1] && lch.c >= region.c[0] && lch.c <= region.c[1] && onHueArc(lch.h, region.h);
}

/**
 * A seeded sample uniform in CIELAB volume over the part of `region` inside the sRGB gamut:
 * L* uniform on the region's range, (a*, b*) uniform on the square around its largest chroma, kept
 * when the colour is in the region and in gamut.
 */
export function sampleRegion(region: TissueRegion, count: number, seed: number): Lab[] {
  const random = mulberry32(seed);
  const samples: Lab[] = [];
  const [l0, l1] = region.l;
  const cMax = region.c[1];
  for (let tries = 0; samples.length < count; tries++) {
    if (tries > count * 1000) throw new Error(`region ${region.id} barely meets the sRGB gamut`);
    const lab = { l: l0 + random() * (l1 - l0), a: (2 * random() - 1) * cMax, b: (2 * random() - 1) * cMax };
    if (inTissueRegion(labToLch(lab), region) && isInSrgbGamut(lab)) samples.push(lab);
  }
  return samples;
}
