// Answer types and constants of the collection routes (sites, seasons, accessions, plants,
// characters, the MCPD export). No zod here, so the client can import them cheaply; the request
// schemas are in collection.ts, which re-exports everything below.
import type { SchemeIssue } from '../collection/season-scheme.js';
import { ACCEPTABILITY_THRESHOLD_DE00 } from '../colour/constants.js';

export type { DayRun, SchemeCheck, SchemeIssue, SeasonRange } from '../collection/season-scheme.js';

/** A named season as a month-day range; it may wrap the year end (e.g. wet 11-01 … 04-30). */
export interface Season {
  id: number;
  name: string;
  /** "MM-DD", inclusive. */
  start: string;
  /** "MM-DD", inclusive. */
  end: string;
}

/** A plot or garden with its season scheme. */
export interface Site {
  id: number;
  code: string;
  name: string;
  /** IANA time zone, e.g. "Pacific/Fiji". */
  timezone: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  seasons: Season[];
}

/**
 * A site as saved by `POST /api/sites` or `PUT /api/sites/:id/seasons`, with the scheme's
 * warnings (days no season covers; allowed, but readings on them get no season).
 *
 * Readings store the season derived when they were created, so replacing a scheme never rewrites
 * the season of a reading taken before; only readings created afterwards use the new scheme.
 */
export interface SavedSite extends Site {
  warnings: SchemeIssue[];
}

/** One plant of an accession, so plant age is known for each reading. */
export interface Plant {
  id: number;
  accessionId: number;
  siteId: number;
  label: string;
  /** ISO date "YYYY-MM-DD". */
  plantedOn: string;
}

/**
 * A variety held in the collection. Passport fields follow the FAO/Bioversity Multi-Crop Passport
 * Descriptors V.2.1 (Alercia, Diulgheroff & Mackay 2015); the MCPD tag is named beside each.
 */
export interface Accession {
  id: number;
  /** ACCENUMB */
  accessionNumber: string;
  /** ACCENAME (first name) */
  name: string;
  /** ACCENAME (further names, ";"-separated in MCPD) */
  otherNames: string[];
  /** INSTCODE */
  instituteCode: string | null;
  /** GENUS, SPECIES, SPAUTHOR */
  genus: string;
  species: string;
  speciesAuthor: string;
  /** CROPNAME */
  cropName: string;
  /** ORIGCTY, ISO 3166-1 alpha-3 */
  originCountry: string | null;
  /** COLLSITE */
  collectingSite: string | null;
  /** DECLATITUDE, DECLONGITUDE (decimal degrees, WGS 84) and ELEVATION (m) of where it was collected, never the holding site's. */
  collectingLatitude: number | null;
  collectingLongitude: number | null;
  collectingElevationM: number | null;
  /** ACQDATE, "YYYYMMDD" with hyphens for unknown parts */
  acquisitionDate: string | null;
  /** SAMPSTAT code (e.g. 300 traditional cultivar/landrace) */
  sampleStatus: number | null;
  /** DONORNAME */
  donorName: string | null;
  /** REMARKS */
  remarks: string | null;
  /** The site that holds the accession. */
  siteId: number;
  plants: Plant[];
}

/** The organs a colour character can belong to. */
export const ORGANS = ['leaf', 'petiole', 'sheath', 'sap', 'corm', 'cormel', 'root', 'flower'] as const;
export type Organ = (typeof ORGANS)[number];

/** What is being read: an organ and the exact part, with how to read it. */
export interface Character {
  id: number;
  code: string;
  organ: Organ;
  label: string;
  /** Which leaf or part, where on it, how long after cutting (Bioversity TB 13: object, condition, sampling). */
  howToRead: string;
  /** A safety caution shown where the reading is taken, or null. */
  caution: string | null;
  /** Whether this is a colour character (others are non-colour descriptors). */
  colour: boolean;
  /** Whether the character is still offered for new readings. */
  active: boolean;
  /** ΔE00 above which a season-to-season difference counts as drift; default `DEFAULT_DRIFT_THRESHOLD`. */
  driftThreshold: number;
  /** Place in the walk of a plant, shared with descriptors; the plant sheet lists rows by it. */
  sortOrder: number;
}

/** ΔE00 acceptability threshold, Paravina et al. (2015), J. Esthet. Restor. Dent. 27:S1–S9. */
export const DEFAULT_DRIFT_THRESHOLD = ACCEPTABILITY_THRESHOLD_DE00;

/** MCPD date: YYYYMMDD, unknown month/day as hyphens ("2019----", "201903--"). */
export const MCPD_DATE = /^\d{4}(0[1-9]|1[0-2]|--)(0[1-9]|[12]\d|3[01]|--)$/;

/** A character code: lowercase words joined by dots (`petiole.third.upper`); never reused once stored. */
export const CHARACTER_CODE = /^[a-z][a-z0-9]*(\.[a-z0-9]+)*$/;

/** A site code: letters, digits and hyphens (`RDP`, `HTG-2`). */
export const SITE_CODE = /^[A-Za-z0-9][A-Za-z0-9-]*$/;

/** How many seasons a scheme may have (our own cap: more than enough for any tropical calendar). */
export const SEASONS_MAX = 12;

/**
 * The columns of `GET /api/accessions/mcpd.csv`, every MCPD V.2.1 field in the standard's order
 * (Alercia, Diulgheroff & Mackay 2015). Fields Hueledger does not hold are blank.
 */
export const MCPD_FIELDS = [
  'PUID', 'INSTCODE', 'ACCENUMB', 'COLLNUMB', 'COLLCODE', 'COLLNAME', 'COLLINSTADDRESS', 'COLLMISSID',
  'GENUS', 'SPECIES', 'SPAUTHOR', 'SUBTAXA', 'SUBTAUTHOR', 'CROPNAME', 'ACCENAME', 'ACQDATE', 'ORIGCTY',
  'COLLSITE', 'DECLATITUDE', 'LATITUDE', 'DECLONGITUDE', 'LONGITUDE', 'COORDUNCERT', 'COORDDATUM',
  'GEOREFMETH', 'ELEVATION', 'COLLDATE', 'BREDCODE', 'BREDNAME', 'SAMPSTAT', 'ANCEST', 'COLLSRC',
  'DONORCODE', 'DONORNAME', 'DONORNUMB', 'OTHERNUMB', 'DUPLSITE', 'DUPLINSTNAME', 'STORAGE', 'MLSSTAT',
  'ACCEURL', 'REMARKS',
] as const;
export type McpdField = (typeof MCPD_FIELDS)[number];
