import {
  CHROMA_WORDS,
  DARK_HUE_WORDS,
  HUE_FAMILIES,
  LIGHTNESS_WORDS,
  NEAR_BLACK_L,
  NEAR_WHITE_L,
  NEUTRAL_CHROMA,
} from './constants.js';
import { labToLch, type Lab, type Lch } from './lab.js';

/** A hue family of the field card, or `neutral` for the greys. */
export type HueFamily = (typeof HUE_FAMILIES)[number]['id'] | 'neutral';

/** Every family in card order: the hue families by angle, then the greys. */
export const HUE_FAMILY_ORDER: readonly HueFamily[] = [...HUE_FAMILIES.map((f) => f.id), 'neutral'];

/** The hue family of an LCh(ab) colour (sectors in `HUE_FAMILIES`, greys below `NEUTRAL_CHROMA`). */
export function hueFamilyOfLch(lch: Lch): HueFamily {
  if (lch.c < NEUTRAL_CHROMA) return 'neutral';
  const h = ((lch.h % 360) + 360) % 360;
  // Sectors run from each `from` to the next; the last one wraps past 360° to the first.
  let family: HueFamily = HUE_FAMILIES[HUE_FAMILIES.length - 1].id;
  for (const f of HUE_FAMILIES) if (h >= f.from) family = f.id;
  return family;
}

/** The hue family of a CIELAB D65 colour. */
export function hueFamily(lab: Lab): HueFamily {
  return hueFamilyOfLch(labToLch(lab));
}

function lightnessWord(l: number): string {
  return LIGHTNESS_WORDS.find((w) => l < w.below)!.word;
}

/**
 * A plain-words name of our own: lightness word, chroma word, hue word — e.g. "deep muted
 * red-purple", "mid moderate brown", "pale grey". Names describe; they are not unique (codes are).
 */
export function colourName(lab: Lab): string {
  const lch = labToLch(lab);
  const family = hueFamilyOfLch(lch);
  if (family === 'neutral') {
    if (lch.l < NEAR_BLACK_L) return 'near-black';
    if (lch.l >= NEAR_WHITE_L) return 'near-white';
    return `${lightnessWord(lch.l)} grey`;
  }
  const chroma = CHROMA_WORDS.find((w) => lch.c < w.below)!.word;
  const dark = DARK_HUE_WORDS.find(
    (rule) => (rule.families as readonly string[]).includes(family) && lch.l < rule.lightnessBelow && lch.c < rule.chromaBelow,
  );
  return `${lightnessWord(lch.l)} ${chroma} ${dark ? dark.word : family}`;
}
