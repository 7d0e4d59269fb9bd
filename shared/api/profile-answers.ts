// Answers of the characterisation routes (issue 14): an accession's profile, the accessions that
// look like it, and the collection's possible duplicates. No zod here, so the client may import
// them; the query schemas are in profile.ts.
import type { LabTuple } from '../colour/lab.js';
import type { Verdict } from '../colour/verdict.js';
import type { DescriptorKind, FormattedValue } from './descriptor-answers.js';
import type { LchTuple } from './reference-set-answers.js';

/** Which readings a character's accepted colour is the centre of. */
export type ProfileBasis = 'approved' | 'current';

/** The statistic behind every "centre" of the profile, in words the record prints. */
export const CENTRE_STATISTIC =
  'per-channel median of L*, a* and b* (CIELAB D65/2°): half the readings may be wrong before it moves far, and anyone can recompute it from the exported readings';

/** A colour as the profile shows it. */
export interface ProfileColour {
  lab: LabTuple;
  lch: LchTuple;
  /** Display hex, gamut-mapped when out of sRGB. */
  hex: string;
  inGamut: boolean;
}

/** The nearest chip of the reference set to a centre. */
export interface ProfileChip {
  code: string;
  name: string;
  hex: string;
  deltaE00: number;
  verdict: Verdict;
}

/** The nearest chip to a centre in one stored reference set. */
export interface ProfileSetChip {
  setId: string;
  /** Whether this is the set new readings are matched against now. */
  current: boolean;
  /** Whether this is the set the record's `chip` comes from (the one asked for, else the current one). */
  shown: boolean;
  chip: ProfileChip;
}

/** The centre of one season group (a season of one season-year). */
export interface ProfileSeason {
  season: string;
  seasonYear: number;
  /** "Dry 2025", or "Wet 2024–25" for a season that wraps the year end. */
  seasonLabel: string;
  n: number;
  centre: ProfileColour;
  /** ΔE00 from the character's overall centre. */
  deltaE00: number;
}

/** The centre of one site's readings. */
export interface ProfileSite {
  siteId: number;
  siteCode: string;
  n: number;
  centre: ProfileColour;
  deltaE00: number;
}

/** A flagged difference: season drift (between season groups) or a site difference within one season group. */
export interface ProfileFlag {
  kind: 'season-drift' | 'site-difference';
  /** e.g. "Dry 2025 → Wet 2025", or "RDP ↔ HTG in Wet 2025". */
  label: string;
  deltaE00: number;
  pValue: number;
  reason: string;
}

/** A reading further from the centre than the character's threshold. */
export interface ProfileOutlier {
  readingId: number;
  observedAt: string;
  siteCode: string;
  plantLabel: string | null;
  observerName: string;
  status: string;
  hex: string;
  lab: LabTuple;
  deltaE00: number;
}

/** The photo region whose colour lies nearest the centre, to show what the colour looks like on the plant. */
export interface ProfilePhoto {
  readingId: number;
  photoId: number;
  /** Upright image size, in pixels; the region is in these coordinates. */
  width: number;
  height: number;
  /** Bounding box of the sampled region in upright pixels. */
  box: { x: number; y: number; width: number; height: number };
  deltaE00: number;
}

/** One colour character of the accession with readings. */
export interface CharacterProfile {
  characterId: number;
  code: string;
  label: string;
  organ: string;
  caution: string | null;
  /** The character's ΔE00 threshold (drift, site difference, outliers). */
  threshold: number;
  basis: ProfileBasis;
  centre: ProfileColour;
  chip: ProfileChip;
  /** The accepted colour's nearest chip in every stored set, oldest version first, so v1 and v2 codes are both at hand. */
  setChips: ProfileSetChip[];
  /** Mean ΔE00 of the basis readings from the centre. */
  spreadDeltaE00: number;
  nReadings: number;
  nObservers: number;
  nPlants: number;
  /** Readings in force of any status (the basis may be fewer); outliers are looked for among all of them. */
  nCurrent: number;
  /** Per season group and per site, over every reading in force (as the Drift pages), oldest season first, sites by code. */
  seasons: ProfileSeason[];
  sites: ProfileSite[];
  /** Season drift and within-season site differences, by the drift rules over every reading in force; largest ΔE00 first. */
  flags: ProfileFlag[];
  /** Whether any season drift or site difference is flagged. */
  flagged: boolean;
  outliers: ProfileOutlier[];
  photo: ProfilePhoto | null;
}

/** A descriptor summarised over the latest value of each plant. */
export interface DescriptorSummary {
  descriptorId: number;
  code: string;
  label: string;
  kind: DescriptorKind;
  /** Plants (or the accession as a whole) with a value. */
  n: number;
  /** Numbers (SI; the ratio itself): median, least and greatest, each formatted. */
  median: number | null;
  min: number | null;
  max: number | null;
  formatted: { median: FormattedValue; min: FormattedValue; max: FormattedValue } | null;
  /** Categories: the commonest (ties: catalogue order) and its share 0–1. */
  mode: string | null;
  modeLabel: string | null;
  share: number | null;
}

/** `GET /api/accessions/:id/profile`: the accession's characterisation record. */
export interface AccessionProfile {
  accessionId: number;
  accessionNumber: string;
  name: string;
  referenceSet: { id: string; version: number; white: string; observer: string };
  statistic: string;
  characters: CharacterProfile[];
  descriptors: DescriptorSummary[];
  /** ISO 8601: when this record was computed. */
  computedAt: string;
}

/** One character two accessions share, with its part of the distance. */
export interface SharedCharacterDistance {
  code: string;
  label: string;
  kind: 'colour' | DescriptorKind;
  /** Colour: ΔE00 between the centres; descriptor: Gower's per-variable dissimilarity 0–1. */
  distance: number;
  /** Colour: the character's threshold; descriptor: the Gower dissimilarity taken as "the same". */
  threshold: number;
  /** Whether this character alone tells the two apart. */
  separates: boolean;
  /** Each accession's value in words (chip code or descriptor value). */
  mine: string;
  theirs: string;
  mineHex?: string;
  theirsHex?: string;
}

/** Another accession and how far its profile lies from this one. */
export interface SimilarAccession {
  accessionId: number;
  accessionNumber: string;
  name: string;
  /** Mean over shared colour characters of ΔE00 / threshold (1 = at the threshold on average). */
  colourDistance: number | null;
  /** Gower (1971) dissimilarity over shared descriptors, 0–1. */
  gowerDistance: number | null;
  /** The ranking key: colourDistance and gowerDistance, each scaled to its "same" level, averaged by characters. */
  distance: number;
  sharedColour: number;
  sharedDescriptors: number;
  /** Whether every shared character is within its threshold and enough are shared. */
  possibleDuplicate: boolean;
  /** Shared characters, most separating first. */
  characters: SharedCharacterDistance[];
}

/** `GET /api/accessions/:id/similar`. */
export interface SimilarAnswer {
  accessionId: number;
  accessionNumber: string;
  name: string;
  method: string;
  minShared: number;
  items: SimilarAccession[];
}

/** One pair of the collection that may be one variety under two numbers. */
export interface DuplicatePair {
  a: { accessionId: number; accessionNumber: string; name: string };
  b: { accessionId: number; accessionNumber: string; name: string };
  distance: number;
  sharedColour: number;
  sharedDescriptors: number;
  /** The largest ΔE00 / threshold over shared colour characters. */
  worstColourRatio: number;
}

/** `GET /api/accessions/duplicates`. */
export interface DuplicatesAnswer {
  method: string;
  minShared: number;
  pairs: DuplicatePair[];
}
