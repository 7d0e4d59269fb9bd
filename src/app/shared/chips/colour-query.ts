import type { MatchRequest } from '../../../../shared/api/reference-set-answers.js';
import { LAB_INPUT_LIMITS } from '../../../../shared/api/reference-set-answers.js';
import { labFromTuple, type Lab } from '../../../../shared/colour/lab.js';
import { parseHex } from '../../../../shared/colour/parse.js';

/** How the colour was given: typed hex, an instrument's L*a*b*, or the screen's colour picker. */
export type EntryMode = 'hex' | 'lab' | 'screen';

/** A colour to match: what to send the server, its CIELAB for matching on this device, and a key telling answers apart. */
export interface ColourQuery {
  request: MatchRequest;
  lab: Lab;
  /** Equal for equal requests, so a late server answer is only shown for the colour it was asked about. */
  key: string;
  /** Whether to ask the server at once (the Match button) rather than after typing pauses. */
  now: boolean;
}

/** The query for a hex text, or null when it is not a hex colour. */
export function hexQuery(text: string, now = false): ColourQuery | null {
  const lab = parseHex(text);
  if (!lab) return null;
  const hex = text.trim().toLowerCase();
  const request = { hex: hex.startsWith('#') ? hex : `#${hex}` };
  return { request, lab, key: JSON.stringify(request), now };
}

/** The query for L*, a*, b* values, or null when one is missing or out of the accepted range. */
export function labQuery(values: readonly (number | null | undefined)[], now = false): ColourQuery | null {
  const [l, a, b] = values;
  if (typeof l !== 'number' || typeof a !== 'number' || typeof b !== 'number') return null;
  if (![l, a, b].every(Number.isFinite)) return null;
  const { lMin, lMax, abMax } = LAB_INPUT_LIMITS;
  if (l < lMin || l > lMax || Math.abs(a) > abMax || Math.abs(b) > abMax) return null;
  const request = { lab: [l, a, b] as [number, number, number] };
  return { request, lab: labFromTuple(request.lab), key: JSON.stringify(request), now };
}
