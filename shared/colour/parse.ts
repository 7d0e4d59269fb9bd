import { converter, parse } from 'culori';
import { LAB_MODE } from './constants.js';
import { fromCulori, type Lab } from './lab.js';

const toLab65 = converter(LAB_MODE);

/** `#rgb` or `#rrggbb`, the `#` optional; eight- and four-digit forms carry alpha and are refused. */
const HEX_PATTERN = /^#?(?:[0-9a-f]{3}|[0-9a-f]{6})$/i;

/** Whether `text` is a hex colour `parseHex` accepts. */
export function isHex(text: string): boolean {
  return HEX_PATTERN.test(text.trim());
}

/**
 * A hex sRGB colour (`#rgb` or `#rrggbb`, `#` optional) as CIELAB D65, or `undefined` when the
 * text is not one. Parsing and conversion are culori's.
 */
export function parseHex(text: string): Lab | undefined {
  const trimmed = text.trim();
  if (!HEX_PATTERN.test(trimmed)) return undefined;
  return parseColour(trimmed.startsWith('#') ? trimmed : `#${trimmed}`);
}

/**
 * Any CSS colour culori parses (hex, `rgb()`, `hsl()`, named colours, `lab()`, `lch()`, `color()` …)
 * as CIELAB D65, or `undefined`. CSS `lab()`/`lch()` are D50 (CSS Color 4 § 9.1), so culori adapts
 * them to D65 on the way. A translucent colour is refused: it has no single CIELAB value.
 */
export function parseColour(text: string): Lab | undefined {
  const colour = parse(text.trim());
  if (colour === undefined) return undefined;
  if (colour.alpha !== undefined && colour.alpha < 1) return undefined;
  const lab = fromCulori(toLab65(colour));
  return Number.isFinite(lab.l) && Number.isFinite(lab.a) && Number.isFinite(lab.b) ? lab : undefined;
}
