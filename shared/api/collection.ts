import { z } from 'zod';

/** A named season as a month-day range; it may wrap the year end (e.g. wet 11-01 … 04-30). */
export interface Season {
  id: number;
  name: string;
  /** "MM-DD", inclusive. */
  start: string;
  /** "MM-DD", inclusive. */
  end: string;
}

/** A plot or garden with its season scheme (DESIGN §4). */
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

/** What is being read: an organ and the exact part, with how to read it (DESIGN §4). */
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
}

/** MCPD date: YYYYMMDD, unknown month/day as hyphens ("2019----", "201903--"). */
export const MCPD_DATE = /^\d{4}(0[1-9]|1[0-2]|--)(0[1-9]|[12]\d|3[01]|--)$/;

const plantInput = z.object({
  label: z.string().trim().min(1).max(40),
  plantedOn: z.iso.date({ message: 'must be a date YYYY-MM-DD' }),
  siteId: z.number().int().positive().optional(),
});

export const createAccessionBody = z.object({
  accessionNumber: z.string().trim().min(1, { message: 'is required' }).max(40),
  name: z.string().trim().min(1, { message: 'is required' }).max(120),
  siteId: z.number().int().positive(),
  otherNames: z.array(z.string().trim().min(1).max(120)).max(20).optional(),
  instituteCode: z.string().trim().max(20).nullish(),
  originCountry: z.string().regex(/^[A-Z]{3}$/, { message: 'must be an ISO 3166-1 alpha-3 code' }).nullish(),
  collectingSite: z.string().trim().max(200).nullish(),
  acquisitionDate: z.string().regex(MCPD_DATE, { message: 'must be YYYYMMDD, hyphens for unknown parts' }).nullish(),
  sampleStatus: z.number().int().min(100).max(999).nullish(),
  donorName: z.string().trim().max(200).nullish(),
  remarks: z.string().trim().max(2000).nullish(),
  plants: z.array(plantInput).max(200).optional(),
});
export type CreateAccessionBody = z.infer<typeof createAccessionBody>;
