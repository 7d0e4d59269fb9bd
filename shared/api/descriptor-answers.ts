// Answer types and constants of the non-colour descriptor routes (the descriptor catalogue and
// observations against it). No zod here, so the client can import them cheaply; the request
// schemas are in descriptors.ts, which re-exports everything below.
import type { Quantity, Unit } from '../units/units.js';

export type { Quantity, Unit, UnitSystem } from '../units/units.js';
export { UNITS } from '../units/units.js';

/** What a descriptor measures: a length (m), a mass (kg), a count, one of its own categories, or a ratio of two others. */
export const DESCRIPTOR_KINDS = ['length', 'mass', 'count', 'category', 'ratio'] as const;
export type DescriptorKind = (typeof DESCRIPTOR_KINDS)[number];

/** The quantity of each measured kind (categories and ratios have none). */
export const KIND_QUANTITY: Readonly<Partial<Record<DescriptorKind, Quantity>>> = { length: 'length', mass: 'mass', count: 'count' };

/** One category of a category descriptor; the id is stored with each observation and never reused. */
export interface DescriptorCategory {
  /** Lowercase words joined by hyphens, e.g. "long-oval". */
  id: string;
  /** Our own plain words. */
  label: string;
}

/** A non-colour descriptor of the catalogue (`GET /api/descriptors`). */
export interface Descriptor {
  id: number;
  /** Lowercase words joined by dots, never reused (`petiole.length`). */
  code: string;
  label: string;
  /** Which part is measured (Bioversity TB 13: the object), e.g. "petiole of the third fully opened leaf". */
  object: string;
  kind: DescriptorKind;
  /** The categories, for kind "category"; empty otherwise. */
  categories: DescriptorCategory[];
  /** For kind "ratio": the codes of the numerator and denominator descriptors (same kind); null otherwise. */
  numeratorCode: string | null;
  denominatorCode: string | null;
  /** Condition and sampling: growth stage, where to put the tape, how many to average. */
  howToMeasure: string;
  /** A safety caution shown where the measurement is taken (corm: raw tissue), or null. */
  caution: string | null;
  /** Whether the descriptor is still offered for new observations. */
  active: boolean;
  /** Place in the walk of a plant, shared with colour characters; the plant sheet lists rows by it. */
  sortOrder: number;
  /** The colour character read on the same part, shown with it as one row of the plant sheet; or null. */
  characterId: number | null;
}

/** One observation of a descriptor (`POST /api/observations`, `GET /api/observations`). Never edited in place. */
export interface Observation {
  id: number;
  accessionId: number;
  plantId: number | null;
  descriptorId: number;
  descriptorCode: string;
  /** ISO 8601 instant. */
  observedAt: string;
  observerId: number;
  observerName: string;
  /** The value in SI: metres, kilograms or the count; null for a category. */
  valueSi: number | null;
  /** The category id, for a category descriptor; null otherwise. */
  category: string | null;
  /** What was typed and in which unit, kept for provenance (null for a category). */
  enteredValue: number | null;
  enteredUnit: Unit | null;
  notes: string | null;
  /** The observation this one corrects, and the one that corrected this (null while current). */
  supersedesId: number | null;
  supersededById: number | null;
  /** ISO 8601 instant the row was stored. */
  createdAt: string;
}

/** A page of observations, newest observed first. */
export interface ObservationPage {
  items: Observation[];
  total: number;
}

/** Largest page of `GET /api/observations`. */
export const OBSERVATIONS_PAGE_MAX = 200;

/** A value formatted in each system, so the client shows the person's choice without converting. */
export interface FormattedValue {
  /** e.g. "101.6 cm", "850 g", "3", "0.70", "Long oval". */
  metric: string;
  /** e.g. "40.0 in", "1.87 lb", "3", "0.70", "Long oval". */
  imperial: string;
}

/** The latest value of one descriptor for one plant (or derived from two such values). */
export interface DescriptorValue {
  descriptorId: number;
  code: string;
  label: string;
  kind: DescriptorKind;
  /** SI value (m, kg, count) or the ratio itself; null for a category. */
  valueSi: number | null;
  category: string | null;
  categoryLabel: string | null;
  formatted: FormattedValue;
  observedAt: string;
  /** The observation behind the value; null for a derived ratio. */
  observationId: number | null;
  /** Whether the value was computed (a ratio), never typed. */
  derived: boolean;
  /** For a derived ratio: the observations of numerator and denominator it was computed from. */
  from: { numeratorId: number; denominatorId: number } | null;
}

/** The latest descriptor values of one plant of an accession (plantId null: observations of no particular plant). */
export interface PlantDescriptors {
  plantId: number | null;
  plantLabel: string | null;
  values: DescriptorValue[];
}

/** `GET /api/accessions/:id/descriptors`: latest values per plant, plus ratios derived within each plant. */
export interface AccessionDescriptors {
  accessionId: number;
  plants: PlantDescriptors[];
}

/** A category id: lowercase words joined by hyphens. */
export const CATEGORY_ID = /^[a-z0-9]+(-[a-z0-9]+)*$/;

/** A descriptor code: lowercase words joined by dots. */
export const DESCRIPTOR_CODE = /^[a-z][a-z0-9]*(\.[a-z0-9]+)*$/;
