import { HUE_SECTORS, NEUTRAL_CHROMA } from './constants.js';
import { labToLch, type Lab, type Lch } from './lab.js';

/** A hue sector of our own (`HUE_SECTORS`), or `ash` for colours below `NEUTRAL_CHROMA`. */
export type HueSector = (typeof HUE_SECTORS)[number]['id'] | 'ash';

/** Every sector in card order: the hue sectors by angle from the reds, then ash. */
export const HUE_SECTOR_ORDER: readonly HueSector[] = [...HUE_SECTORS.map((s) => s.id), 'ash'];

const byAngle = [...HUE_SECTORS].sort((p, q) => p.from - q.from);

/** The hue sector of an LCh(ab) colour. */
export function hueSectorOfLch(lch: Lch): HueSector {
  if (lch.c < NEUTRAL_CHROMA) return 'ash';
  const h = ((lch.h % 360) + 360) % 360;
  // The sector with the largest start at or below h; below the smallest start, the arc that wraps.
  let sector: HueSector = byAngle[byAngle.length - 1].id;
  for (const s of byAngle) if (h >= s.from) sector = s.id;
  return sector;
}

/** The hue sector of a CIELAB D65 colour. */
export function hueSector(lab: Lab): HueSector {
  return hueSectorOfLch(labToLch(lab));
}

/** A sector's h°ab arc, from (inclusive) to (exclusive); null for ash, which has no hue. */
export function sectorArc(sector: HueSector): { from: number; to: number } | null {
  const i = byAngle.findIndex((s) => s.id === sector);
  if (i < 0) return null;
  return { from: byAngle[i].from, to: byAngle[(i + 1) % byAngle.length].from };
}

/** A sector's heading with its range, as the card and pickers print it: "leaf h° 130–160", "ash C* < 5". */
export function sectorLabel(sector: HueSector): string {
  const arc = sectorArc(sector);
  return arc ? `${sector} h° ${arc.from}–${arc.to}` : `${sector} C* < ${NEUTRAL_CHROMA}`;
}

function baseName(lch: Lch): string {
  return `${hueSectorOfLch(lch)} L${Math.round(lch.l)} C${Math.round(lch.c)}`;
}

/**
 * A chip's name, derived from its CIELAB and never stored as its identity: the hue sector, then
 * L* and C*ab rounded to whole numbers, e.g. "leaf L45 C32". A fine chip whose name would equal its
 * field chip's (they round alike) adds its hue angle, "leaf L45 C32 h131", so that a fine chip is
 * never named like the chip it refines. Names describe; codes identify.
 */
export function chipName(lab: Lab, parentLab: Lab | null = null): string {
  const lch = labToLch(lab);
  const name = baseName(lch);
  if (parentLab === null || name !== baseName(labToLch(parentLab))) return name;
  return `${name} h${Math.round(lch.h)}`;
}

/**
 * Names every chip of a set from its CIELAB and its parent's (see `chipName`), in list order. A
 * chip whose parent is not in the list is named on its own.
 */
export function chipNames<T extends { code: string; parent: string | null; lab: readonly [number, number, number] }>(chips: readonly T[]): string[] {
  const labs = new Map(chips.map((c) => [c.code, { l: c.lab[0], a: c.lab[1], b: c.lab[2] }]));
  return chips.map((c) => chipName(labs.get(c.code)!, c.parent === null ? null : (labs.get(c.parent) ?? null)));
}

/**
 * Picker and card order: hue sector (`HUE_SECTOR_ORDER`), then lightness from light to dark, then
 * chroma from strongest to greyest, then hue angle, then the raw numbers so that no two chips tie.
 * Choosing among a field chip's fine chips is then a scan down one sector's lightness steps.
 */
export function pickerOrder(p: readonly [number, number, number], q: readonly [number, number, number]): number {
  const lp = labToLch({ l: p[0], a: p[1], b: p[2] });
  const lq = labToLch({ l: q[0], a: q[1], b: q[2] });
  return (
    HUE_SECTOR_ORDER.indexOf(hueSectorOfLch(lp)) - HUE_SECTOR_ORDER.indexOf(hueSectorOfLch(lq)) ||
    q[0] - p[0] ||
    lq.c - lp.c ||
    lp.h - lq.h ||
    p[1] - q[1] ||
    p[2] - q[2]
  );
}
