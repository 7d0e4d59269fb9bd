// Answer types and limits of the reference-set routes. No zod here, so the client can import the
// values cheaply; the request schemas are in reference-sets.ts.
import type { MatchBody } from './reference-sets.js';
import { MAX_NEIGHBOURS } from '../colour/constants.js';
import type { LabTuple } from '../colour/lab.js';
import type { ReferenceChip } from '../colour/reference-set.js';
import type { Verdict } from '../colour/verdict.js';

/** One reference set as `GET /api/reference-sets` lists it. */
export interface ReferenceSetSummary {
  /** The file's id, e.g. "v1". */
  id: string;
  name: string;
  version: number;
  /** Reference white of every CIELAB value ("D65"). */
  white: string;
  /** Standard observer ("2°"). */
  observer: string;
  fieldChips: number;
  fineChips: number;
  /** Whether this is the set new readings are matched against (the newest version). */
  current: boolean;
}

/** A chip as `GET /api/reference-sets/:id/chips` sends it: the reference-set file's own form. */
export type ChipDto = ReferenceChip;

/** LCh(ab) as it travels: `[L*, C*ab, h°ab]`. */
export type LchTuple = [number, number, number];

/** The colour a match was asked about, in every form a recorder reads. */
export interface MatchInput {
  lab: LabTuple;
  lch: LchTuple;
  /** Display hex, gamut-mapped when out of sRGB. */
  hex: string;
  /** Whether the colour lies inside sRGB (the hex is then the colour itself). */
  inGamut: boolean;
}

/** One chip near the colour, with its ΔE00 and the plain-words verdict. */
export interface MatchedChip {
  code: string;
  parent: string | null;
  name: string;
  hex: string;
  lab: LabTuple;
  deltaE00: number;
  verdict: Verdict;
}

/** Where the colour falls between its two nearest chips: t = 0 at `a`, 1 at `b`. */
export interface MatchBetween {
  /** Code of the nearest chip. */
  a: string;
  /** Code of the second-nearest chip. */
  b: string;
  /** Position of the colour's projection on the CIELAB segment a → b, clamped to [0, 1]. */
  t: number;
}

/** `POST /api/match` answer. */
export interface MatchAnswer {
  input: MatchInput;
  /** Nearest first. */
  matches: MatchedChip[];
  /** Null only for a set of fewer than two chips. */
  between: MatchBetween | null;
  /** The set matched against. */
  setId: string;
}

/** `POST /api/match` body, as the client sends it. */
export type MatchRequest = MatchBody;

/** How many matches `POST /api/match` gives when `k` is not sent (our own choice). */
export const MATCH_K_DEFAULT = 5;
/** The most matches one request may ask for. */
export const MATCH_K_MAX = MAX_NEIGHBOURS;

/**
 * Accepted CIELAB input: L* in [0, 100] by definition (CIE 15:2004 § 8.2.1); |a*|, |b*| ≤ 200,
 * our own bound, well beyond any real surface colour (sRGB reaches about ±128).
 */
export const LAB_INPUT_LIMITS = { lMin: 0, lMax: 100, abMax: 200 } as const;

/** A reference-set id: what the files' `id` field may hold. */
export const REFERENCE_SET_ID_PATTERN = /^[A-Za-z0-9_-]{1,20}$/;

/** Where a set's printable field card is downloaded. */
export function fieldCardUrl(setId: string): string {
  return `/api/reference-sets/${encodeURIComponent(setId)}/card.pdf`;
}

/** Where a set's fine-chip booklet (one page per field chip) is downloaded. */
export function bookletUrl(setId: string): string {
  return `/api/reference-sets/${encodeURIComponent(setId)}/booklet.pdf`;
}

/** Where a set's chips are loaded (one cacheable answer). */
export function chipsUrl(setId: string): string {
  return `/api/reference-sets/${encodeURIComponent(setId)}/chips`;
}
