// Every number Hueledger's colour code relies on, with its source beside it. Values marked
// "our own" are project choices, not published figures.

/** Culori's colour mode for CIELAB with the D65 white (CIE 15:2004 formulas, white from xy below). */
export const LAB_MODE = 'lab65';

/** Culori's colour mode for CIE LCh(ab) derived from `LAB_MODE`. */
export const LCH_MODE = 'lch65';

/**
 * Reference white of Hueledger's CIELAB: D65, CIE 1931 2° observer, chromaticity
 * x = 0.3127, y = 0.3290 (IEC 61966-2-1, the white of sRGB; CSS Color 4 § 10.3). Culori's `lab65`
 * derives X = x/y, Y = 1, Z = (1 − x − y)/y from the same pair, i.e. (0.95046, 1, 1.08906).
 */
export const WHITE_D65_XY = { x: 0.3127, y: 0.329 } as const;

/** Names of the white and observer as written into reference-set files. */
export const WHITE_NAME = 'D65';
export const OBSERVER_NAME = '2°';

/**
 * CIEDE2000 parametric factors at the reference conditions, kL = kC = kH = 1 (CIE 142-2001;
 * Sharma, Wu & Dalal 2005, Color Res. Appl. 30(1):21–30, eq. 10).
 */
export const CIEDE2000_K = { l: 1, c: 1, h: 1 } as const;

/**
 * Constants of the CIEDE2000 weighting functions, as printed in Sharma, Wu & Dalal (2005),
 * eqs. 2–22 (= CIE 142-2001). Only the chip index's lower bound reads them; the difference
 * itself is culori's `differenceCiede2000`.
 */
export const CIEDE2000_FORMULA = {
  /** G = ½(1 − √(C̄⁷/(C̄⁷ + 25⁷))), eq. 3. */
  chromaPivot: 25,
  /** S_L = 1 + 0.015(L̄′ − 50)² / √(20 + (L̄′ − 50)²), eq. 18. */
  slSlope: 0.015,
  slOffset: 20,
  slCentre: 50,
  /** S_C = 1 + 0.045 C̄′, eq. 19. */
  scSlope: 0.045,
  /** S_H = 1 + 0.015 C̄′ T, eq. 20. */
  shSlope: 0.015,
  /** T = 1 − 0.17 cos(h̄′ − 30°) + 0.24 cos 2h̄′ + 0.32 cos(3h̄′ + 6°) − 0.20 cos(4h̄′ − 63°), eq. 15. */
  tCoefficients: [0.17, 0.24, 0.32, 0.2],
  /** Δθ = 30° exp(−((h̄′ − 275°)/25°)²), eq. 16: its largest value is 30°. */
  deltaThetaMaxDeg: 30,
} as const;

/**
 * Plain-words bands for ΔE00, borrowed from dental colour science: Paravina et al. (2015),
 * "Color difference thresholds in dentistry", J. Esthet. Restor. Dent. 27:S1–S9 — 50:50 %
 * perceptibility threshold ΔE00 = 0.8 and 50:50 % acceptability threshold ΔE00 = 1.8
 * (175 observers, viewing booth). "ΔE00 ≈ 1 is just noticeable" is common practice, not a standard.
 */
export const PERCEPTIBILITY_THRESHOLD_DE00 = 0.8;
export const ACCEPTABILITY_THRESHOLD_DE00 = 1.8;

/**
 * Gamut mapping for display: CSS Color 4 § 13.2 "CSS gamut mapping to an RGB destination"
 * (binary search on OKLCh chroma with a just-noticeable ΔEOK of 0.02), which is culori's
 * `toGamut('rgb', 'oklch')` with its default arguments.
 */
export const DISPLAY_GAMUT_MAPPING = { destination: 'rgb', space: 'oklch' } as const;

/** Largest k the matcher hands out; the API caps `k` at this (our own limit). */
export const MAX_NEIGHBOURS = 50;

/** Chips per leaf of the chip index's k-d tree: a speed setting (our own), not a correctness one. */
export const CHIP_INDEX_LEAF_SIZE = 8;

/**
 * Relative slack taken off every lower bound before the index prunes with it, so that the last
 * bits of floating-point rounding in the bound can never discard a chip (our own, conservative:
 * the bound's own rounding error is about 1e-15 relative).
 */
export const CHIP_INDEX_BOUND_SLACK = 1e-9;

/** Below this C*ab a colour is named "ash" and belongs to no hue sector (our own). */
export const NEUTRAL_CHROMA = 5;

/**
 * Hue sectors by h°ab (CIELAB D65), named with words from plants, in the order the field card
 * lists them; each runs from its `from` angle up to the next sector's, and the last wraps past
 * 360° to the first. Words and boundaries are our own (reference-colors/README.md gives the
 * reasoning), placed from where tissue colours and sRGB primaries fall: sRGB red at 40°, orange
 * at 60°, yellow at 103°, green at 136°, cyan at 196°, blue at 306°, magenta at 328° (culori).
 */
export const HUE_SECTORS = [
  { id: 'wine', from: 350 },
  { id: 'chilli', from: 30 },
  { id: 'rust', from: 50 },
  { id: 'straw', from: 72 },
  { id: 'lemon', from: 95 },
  { id: 'lime', from: 112 },
  { id: 'leaf', from: 130 },
  { id: 'agave', from: 160 },
  { id: 'flax', from: 215 },
  { id: 'indigo', from: 270 },
  { id: 'violet', from: 300 },
  { id: 'plum', from: 322 },
] as const;
