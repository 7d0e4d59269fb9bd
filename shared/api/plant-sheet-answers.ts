// Answer types of the plant sheet, progress and catalogue-order routes. No zod here, so the client
// can import them cheaply; the request schemas are in plant-sheet.ts, which re-exports these.
import type { Organ } from './collection-answers.js';
import type { DescriptorKind, FormattedValue } from './descriptor-answers.js';
import type { ReadingMethod } from './reading-answers.js';

/** Where one character or descriptor stands for a plant this season. */
export type SheetStatus = 'done' | 'todo' | 'skipped';

/** Why something was set aside for this plant this season. */
export interface SheetSkip {
  id: number;
  reason: string;
  /** ISO 8601 instant. */
  at: string;
}

/** The latest reading of a colour character on the plant this season. */
export interface SheetReading {
  id: number;
  method: ReadingMethod;
  /** Display hex of the reading itself. */
  hex: string;
  bestChipCode: string;
  bestChipName: string;
  bestChipHex: string;
  deltaE00: number;
  observedAt: string;
}

/** The colour half of a sheet row. */
export interface SheetColour {
  characterId: number;
  code: string;
  label: string;
  organ: Organ;
  caution: string | null;
  status: SheetStatus;
  reading: SheetReading | null;
  skip: SheetSkip | null;
}

/** The descriptor half of a sheet row (ratios are computed, so never listed). */
export interface SheetDescriptor {
  descriptorId: number;
  code: string;
  label: string;
  kind: DescriptorKind;
  caution: string | null;
  status: SheetStatus;
  /** The latest value this season, formatted in each system. */
  value: { observationId: number; formatted: FormattedValue; observedAt: string } | null;
  skip: SheetSkip | null;
}

/** One row of the sheet: a colour character, a descriptor, or both when they are read on the same part. */
export interface SheetRow {
  /** "c12", "d5" or "c12+d5": stable within a catalogue. */
  key: string;
  sortOrder: number;
  colour: SheetColour | null;
  descriptor: SheetDescriptor | null;
}

/** How far one kind of row has got: done, set aside, and the catalogue's active count. */
export interface ProgressCount {
  done: number;
  skipped: number;
  total: number;
}

/** Fully characterised (every row done or skipped), partly, or nothing yet this season. */
export const PROGRESS_STATES = ['complete', 'partial', 'not-started'] as const;
export type ProgressState = (typeof PROGRESS_STATES)[number];

/** One plant's progress this season (`GET /api/accessions/:id/progress`, `GET /api/progress`). */
export interface PlantProgress {
  plantId: number;
  plantLabel: string;
  accessionId: number;
  accessionNumber: string;
  accessionName: string;
  siteId: number;
  siteCode: string;
  /** The season of the plant's site the counts are for (null: no season covers the day). */
  season: string | null;
  seasonYear: number;
  /** The season as people say it ("Wet 2024–25" when it wraps the year end); null with no season. */
  seasonLabel: string | null;
  colour: ProgressCount;
  descriptors: ProgressCount;
  state: ProgressState;
}

/** `GET /api/plants/:id/sheet`: every row of the walk for one plant, this season. */
export interface PlantSheet {
  plant: { id: number; label: string; plantedOn: string };
  accession: { id: number; accessionNumber: string; name: string };
  site: { id: number; code: string; name: string };
  rows: SheetRow[];
  progress: PlantProgress;
}

/** `GET /api/progress`: every plant (optionally of one site), with counts by state. */
export interface CollectionProgress {
  plants: PlantProgress[];
  counts: Record<ProgressState, number>;
}

/** One entry of the walk order (`GET /api/catalogue/order`). */
export interface WalkEntry {
  kind: 'character' | 'descriptor';
  id: number;
  code: string;
  label: string;
  sortOrder: number;
  active: boolean;
  /** For a descriptor read with a colour character: that character's id. */
  characterId: number | null;
}

/** Longest skip reason. */
export const SKIP_REASON_MAX = 300;
