// The readings API's types and constants, without zod so the client may import
// them; the request schemas are in readings.ts.
import type { CreateReadingBody, CreateReadingsBody, ListReadingsQuery, SupersedeReadingBody } from './readings.js';
import type { LabTuple } from '../colour/lab.js';
import type { FieldError } from './problem.js';
import type { Region } from '../photo/region.js';
import type { LchTuple, MatchBetween, MatchedChip } from './reference-set-answers.js';
import type { SampleCorrection } from './photo-answers.js';

/** How a reading's colour was taken: a photo region, an instrument's L*a*b*, a chip picked by eye, an on-screen swatch. */
export const READING_METHODS = ['photo', 'instrument', 'chip', 'swatch'] as const;
export type ReadingMethod = (typeof READING_METHODS)[number];

/** The light the tissue was read under. */
export const LIGHTS = ['direct-sun', 'open-shade', 'overcast', 'indoor-lamp', 'viewing-booth'] as const;
export type Light = (typeof LIGHTS)[number];

/** Plain labels of the lights, our own words. */
export const LIGHT_LABELS: Readonly<Record<Light, string>> = {
  'direct-sun': 'Direct sun',
  'open-shade': 'Open shade',
  overcast: 'Overcast',
  'indoor-lamp': 'Indoor lamp',
  'viewing-booth': 'Viewing booth',
};

/**
 * The illuminant/observer an instrument reports its CIELAB under. D50/2° is adapted to D65/2° by
 * Bradford before matching; D65/10° and "other" are kept as reported, since a 10° reading cannot
 * be turned into a 2° one exactly without the spectrum.
 */
export const INSTRUMENT_ILLUMINANTS = ['D65/10', 'D65/2', 'D50/2', 'other'] as const;
export type InstrumentIlluminant = (typeof INSTRUMENT_ILLUMINANTS)[number];

/** Plain labels of the illuminant/observer choices. */
export const ILLUMINANT_LABELS: Readonly<Record<InstrumentIlluminant, string>> = {
  'D65/10': 'D65 / 10°',
  'D65/2': 'D65 / 2°',
  'D50/2': 'D50 / 2°',
  other: 'Other',
};

/** Review states: every reading starts submitted; a reviewer approves, flags or asks for a re-read. Superseded is `supersededById !== null`, not a status. */
export const READING_STATUSES = ['submitted', 'approved', 'flagged', 'reread-requested'] as const;
export type ReadingStatus = (typeof READING_STATUSES)[number];

/** Seconds after cutting past which corm flesh and sap are warned about browning (our own threshold, not a standard; browning of fresh-cut flesh: Xiao et al. 2022, Scientia Horticulturae 291:110613). */
export const CUT_SECONDS_WARN = 60;
export const CUT_SECONDS_MAX = 86_400;
export const READINGS_PAGE_SIZE_MAX = 100;
export const READINGS_PAGE_SIZE_DEFAULT = 25;
export const READING_NOTES_MAX = 2000;
export const LEAF_POSITION_MAX = 80;
export const SUPERSEDE_REASON_MAX = 500;
/** An observation time may run ahead of the server's clock by this much (phones drift). */
export const OBSERVED_AT_FUTURE_SLACK_MS = 5 * 60 * 1000;

/** The photo region a photo reading samples; the server samples it itself (authoritative). */
export interface ReadingPhotoSource {
  photoId: number;
  region: Region;
  neutral?: { region: Region; lab?: LabTuple };
  /** One colour of a region that is not even: the index into the sample's `clusters` (0 = the largest share). */
  cluster?: number;
}

/** The most readings one batch saves together (a region splits into at most three colours). */
export const READINGS_BATCH_MAX = 3;

/** `POST /api/readings/batch` answer: every reading saved, in the order sent. */
export interface CreatedReadings {
  readings: ReadingDetail[];
}

/** Which colour of a region a photo reading took, when the region held several (`ReadingPhotoSource.cluster`). */
export interface ReadingCluster {
  /** Index among the region's colours, largest share first (0 = the ground of a striped petiole). */
  index: number;
  /** How many colours the region split into. */
  of: number;
  /** Share of the region's kept pixels in this colour, 0–1. */
  share: number;
  /** Mean ΔE00 of the colour's pixels from it. */
  spreadDeltaE00: number;
}

/** Which colour of its region a reading took, in words for exports: "2 of 2" (1 = the largest share). */
export function clusterWords(cluster: ReadingCluster): string {
  return `${cluster.index + 1} of ${cluster.of}`;
}

/** `POST /api/readings` body. Which colour field is needed depends on `method`. */
export type CreateReadingRequest = CreateReadingBody;

/** `POST /api/readings/batch` body: up to READINGS_BATCH_MAX readings, saved all or nothing. */
export type CreateReadingsRequest = CreateReadingsBody;

/** `POST /api/readings/:id/supersede` body: the corrected reading and why. */
export type SupersedeReadingRequest = SupersedeReadingBody;

/** A reading as listed. */
export interface ReadingDto {
  id: number;
  accessionId: number;
  accessionNumber: string;
  accessionName: string;
  plantId: number | null;
  plantLabel: string | null;
  characterId: number;
  characterCode: string;
  characterLabel: string;
  siteId: number;
  siteCode: string;
  observerId: number;
  observerName: string;
  /** ISO 8601 (UTC). */
  observedAt: string;
  method: ReadingMethod;
  lab: LabTuple;
  lch: LchTuple;
  hex: string;
  inGamut: boolean;
  /** The nearest chip of the set current when the reading was taken. */
  bestChip: string;
  bestChipName: string;
  bestChipHex: string;
  deltaE00: number;
  verdict: MatchedChip['verdict'];
  eyeChipCode: string | null;
  /** ΔE00 from the reading to the eye-picked chip. */
  eyeDeltaE00: number | null;
  setId: string;
  season: string | null;
  seasonYear: number | null;
  /** The season as people say it: "Dry 2025", or "Wet 2024–25" for a season that wraps the year end; null without a season. */
  seasonLabel: string | null;
  plantAgeMonths: number | null;
  /** The ambient light; null for an instrument reading (the instrument lights the sample itself). */
  light: Light | null;
  secondsSinceCut: number | null;
  leafPosition: string | null;
  notes: string | null;
  status: ReadingStatus;
  supersedesId: number | null;
  supersededById: number | null;
  /** ISO 8601. */
  createdAt: string;
}

/** Where a reading's colour came from. Fields that do not apply to its method are null. */
export interface ReadingProvenance {
  photoId: number | null;
  photoWidth: number | null;
  photoHeight: number | null;
  region: Region | null;
  neutralRegion: Region | null;
  pixelCount: number | null;
  pixelsDropped: number | null;
  spreadDeltaE00: number | null;
  uniform: boolean | null;
  correction: SampleCorrection | null;
  pipeline: string | null;
  /** A photo reading of one colour of a region that held several; null for a reading of the whole region. */
  cluster: ReadingCluster | null;
  instrument: string | null;
  /** instrument: the illuminant/observer it reported (null when not said). */
  illuminant: InstrumentIlluminant | null;
  /** instrument: L*a*b* as it reported them, before adaptation to D65/2° (only when adapted: D50/2°). */
  reportedLab: LabTuple | null;
  /** chip: the chip picked; swatch: the hex tapped. */
  source: string | null;
}

/** One version in a reading's supersede chain. */
export interface ReadingVersion {
  id: number;
  observedAt: string;
  createdAt: string;
  /** Why this version replaced the one before it (null for the first). */
  reason: string | null;
  /** Whether this is the version in force (not superseded). */
  current: boolean;
}

/** One audit event about a reading. */
export interface ReadingHistoryEvent {
  id: number;
  at: string;
  actorName: string | null;
  action: string;
  detail: Record<string, unknown> | null;
  /** The event in plain words. */
  sentence: string;
}

/** `GET /api/readings/:id`. */
/** A reading's colour matched against a reference set other than the one it was stored with. */
export interface OtherSetMatch {
  setId: string;
  /** Whether that set is the current one. */
  current: boolean;
  /** Nearest first. */
  matches: MatchedChip[];
  between: MatchBetween | null;
}

export interface ReadingDetail extends ReadingDto {
  /** Nearest chips in the set the reading was stored with (`setId`). */
  matches: MatchedChip[];
  between: MatchBetween | null;
  /** The same colour in every other stored set, so a v1 reading also shows its v2 chips and back. */
  otherSets: OtherSetMatch[];
  provenance: ReadingProvenance;
  /** The whole supersede chain, oldest first (this reading included). */
  versions: ReadingVersion[];
  history: ReadingHistoryEvent[];
  /** The latest reviewer's decision and comment, shown to the recorder at the top of the reading; null when never reviewed. */
  latestReview: LatestReview | null;
  /** The same plant's earlier readings of the same character (without a plant: the same accession at the same site), newest first, at most EARLIER_READINGS_MAX. */
  earlier: EarlierReading[];
}

/** How many earlier readings a reading's detail lists (our own: enough to see a trend on a phone). */
export const EARLIER_READINGS_MAX = 6;

/** One earlier reading beside the one under review. */
export interface EarlierReading {
  id: number;
  /** ISO 8601. */
  observedAt: string;
  observerName: string;
  hex: string;
  bestChip: string;
  status: ReadingStatus;
}

/** A reading's latest review, as its recorder sees it. */
export interface LatestReview {
  decision: 'approve' | 'flag' | 'reread';
  comment: string | null;
  reviewerName: string;
  /** ISO 8601. */
  createdAt: string;
}

export const READING_SORTS = ['observedAt', 'accession', 'character', 'site', 'observer', 'deltaE00', 'status', 'method'] as const;
export type ReadingSort = (typeof READING_SORTS)[number];

/** `GET /api/readings` (and the exports) query. */
export type ReadingListQuery = Partial<ListReadingsQuery>;

export interface ReadingList {
  items: ReadingDto[];
  total: number;
}

/** The columns of the instrument-reading CSV import, in this order; accessionNumber … b are required, the rest optional (light too: the instrument lights the sample). */
export const IMPORT_COLUMNS = ['accessionNumber', 'characterCode', 'observedAt', 'L', 'a', 'b', 'illuminant', 'light', 'plantLabel', 'siteCode', 'instrument', 'eyeChipCode', 'secondsSinceCut', 'leafPosition', 'notes'] as const;
export const IMPORT_ROWS_MAX = 5000;

/** One row of an import's report (row 1 is the header, so data start at row 2). */
export interface ImportRowReport {
  row: number;
  ok: boolean;
  errors: FieldError[];
}

/** `POST /api/readings/import`: 201 with every row imported, or 422 problem+json whose `rows` lists every bad row (nothing imported). */
export interface ImportReport {
  imported: number;
  readingIds: number[];
  rows: ImportRowReport[];
}

export function readingUrl(id: number): string {
  return `/readings/${id}`;
}
