import { labToLch, type Lab, type Lch } from '../shared/colour/lab.js';

/*
 * The names written into the published reference-set-v1.json, kept here only so that the v1
 * generator still reproduces that file byte for byte. They are never shown: every screen, export
 * and card names chips with shared/colour/chip-name.ts, computed from the chip's CIELAB. Nothing
 * outside the v1 generator and its determinism test may import this file.
 */

const V1_NEUTRAL_CHROMA = 5;

const V1_HUE_FAMILIES = [
  { id: 'red', from: 5 },
  { id: 'orange', from: 42 },
  { id: 'yellow-orange', from: 70 },
  { id: 'yellow', from: 85 },
  { id: 'yellow-green', from: 105 },
  { id: 'green', from: 128 },
  { id: 'blue-green', from: 165 },
  { id: 'blue', from: 215 },
  { id: 'purple', from: 305 },
  { id: 'red-purple', from: 335 },
] as const;

const V1_LIGHTNESS_WORDS = [
  { below: 20, word: 'very deep' },
  { below: 35, word: 'deep' },
  { below: 50, word: 'mid' },
  { below: 65, word: 'light' },
  { below: 80, word: 'pale' },
  { below: Infinity, word: 'very pale' },
] as const;

const V1_CHROMA_WORDS = [
  { below: 15, word: 'greyish' },
  { below: 30, word: 'muted' },
  { below: 50, word: 'moderate' },
  { below: 70, word: 'strong' },
  { below: Infinity, word: 'vivid' },
] as const;

const V1_DARK_HUE_WORDS = [
  { families: ['orange', 'yellow-orange'], lightnessBelow: 50, chromaBelow: 50, word: 'brown' },
  { families: ['yellow'], lightnessBelow: 50, chromaBelow: 50, word: 'olive' },
] as const;

const V1_NEAR_BLACK_L = 10;
const V1_NEAR_WHITE_L = 96;

/** v1's grouping of hues, used by the v1 generator's card order. */
export type V1HueFamily = (typeof V1_HUE_FAMILIES)[number]['id'] | 'neutral';

/** v1's family order: the families by angle, then the greys. */
export const V1_HUE_FAMILY_ORDER: readonly V1HueFamily[] = [...V1_HUE_FAMILIES.map((f) => f.id), 'neutral'];

/** v1's family of an LCh(ab) colour. */
export function v1HueFamilyOfLch(lch: Lch): V1HueFamily {
  if (lch.c < V1_NEUTRAL_CHROMA) return 'neutral';
  const h = ((lch.h % 360) + 360) % 360;
  let family: V1HueFamily = V1_HUE_FAMILIES[V1_HUE_FAMILIES.length - 1].id;
  for (const f of V1_HUE_FAMILIES) if (h >= f.from) family = f.id;
  return family;
}

/** The name v1's file stores for a chip (not shown anywhere; see the note above). */
export function v1StoredName(lab: Lab): string {
  const lch = labToLch(lab);
  const family = v1HueFamilyOfLch(lch);
  const lightness = V1_LIGHTNESS_WORDS.find((w) => lch.l < w.below)!.word;
  if (family === 'neutral') {
    if (lch.l < V1_NEAR_BLACK_L) return 'near-black';
    if (lch.l >= V1_NEAR_WHITE_L) return 'near-white';
    return `${lightness} grey`;
  }
  const chroma = V1_CHROMA_WORDS.find((w) => lch.c < w.below)!.word;
  const dark = V1_DARK_HUE_WORDS.find(
    (rule) => (rule.families as readonly string[]).includes(family) && lch.l < rule.lightnessBelow && lch.c < rule.chromaBelow,
  );
  return `${lightness} ${chroma} ${dark ? dark.word : family}`;
}
