import { formatHex, inGamut, toGamut } from 'culori';
import { DISPLAY_GAMUT_MAPPING } from './constants.js';
import { toCulori, type Lab } from './lab.js';

const inSrgb = inGamut('rgb');
const mapToSrgb = toGamut(DISPLAY_GAMUT_MAPPING.destination, DISPLAY_GAMUT_MAPPING.space);

/** How a CIELAB colour is shown on a screen. */
export interface DisplayColour {
  /** `#rrggbb`, gamut-mapped when the colour lies outside sRGB. */
  hex: string;
  /** Whether the colour lies inside the sRGB gamut, so the hex is its own colour and not a stand-in. */
  inGamut: boolean;
}

/** Whether a CIELAB D65 colour lies inside the sRGB gamut (culori's `inGamut('rgb')`). */
export function isInSrgbGamut(lab: Lab): boolean {
  return inSrgb(toCulori(lab));
}

/**
 * The display hex of a CIELAB D65 colour. Inside sRGB it is the colour rounded to 8 bits; outside,
 * CSS Color 4 § 13.2 gamut mapping (culori's `toGamut('rgb', 'oklch')`) picks the stand-in.
 */
export function displayHex(lab: Lab): DisplayColour {
  const colour = toCulori(lab);
  const inside = inSrgb(colour);
  return { hex: formatHex(inside ? colour : mapToSrgb(colour)), inGamut: inside };
}
