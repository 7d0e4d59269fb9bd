import { z } from 'zod';

import { checkSeasonScheme } from '../collection/season-scheme.js';
import { CHARACTER_CODE, MCPD_DATE, ORGANS, SEASONS_MAX, SITE_CODE } from './collection-answers.js';

export * from './collection-answers.js';

const id = (what: string) =>
  z.number({ message: `must be the number of a ${what}` }).int({ message: 'must be a whole number' }).positive({ message: 'must be a positive whole number' });

const text = (max: number) =>
  z.string({ message: 'must be text' }).trim().min(1, { message: 'is required' }).max(max, { message: `must be at most ${max} characters` });

const optionalText = (max: number) => z.string({ message: 'must be text' }).trim().max(max, { message: `must be at most ${max} characters` }).nullish();

const monthDay = z.string({ message: 'must be a month-day "MM-DD"' }).regex(/^\d{2}-\d{2}$/, { message: 'must be a month-day "MM-DD"' });

/** Whether the runtime knows the IANA time zone (Intl throws a RangeError for an unknown one). */
function isTimeZone(zone: string): boolean {
  try {
    new Intl.DateTimeFormat('en', { timeZone: zone });
    return true;
  } catch {
    return false;
  }
}

const timezone = z
  .string({ message: 'must be an IANA time zone like Pacific/Fiji' })
  .max(64, { message: 'must be an IANA time zone like Pacific/Fiji' })
  // Names only (Area/Location, or UTC): offsets like "+05:00" carry no daylight-saving rules.
  .regex(/^[A-Za-z][A-Za-z0-9_+-]*(\/[A-Za-z0-9_+-]+)*$/, { message: 'must be an IANA time zone like Pacific/Fiji' })
  .refine(isTimeZone, { message: 'is not a time zone this server knows (IANA names like Pacific/Fiji)' });

const latitude = z.number({ message: 'must be a number of degrees' }).min(-90, { message: 'must be from −90 to 90 degrees' }).max(90, { message: 'must be from −90 to 90 degrees' });
const longitude = z.number({ message: 'must be a number of degrees' }).min(-180, { message: 'must be from −180 to 180 degrees' }).max(180, { message: 'must be from −180 to 180 degrees' });
/** Metres above sea level: from the Dead Sea shore to above any cropland (our own bounds). */
const elevationM = z.number({ message: 'must be a number of metres' }).min(-500, { message: 'must be from −500 to 9000 metres' }).max(9000, { message: 'must be from −500 to 9000 metres' });

const seasonInput = z.object({ name: text(40), start: monthDay, end: monthDay }, { message: 'must be {name, start, end}' });

/** A season scheme: at most SEASONS_MAX seasons, unique names, real month-days, no shared days (gaps allowed). */
export const seasonScheme = z
  .array(seasonInput, { message: 'must be a list of seasons {name, start, end}' })
  .min(1, { message: 'needs at least one season' })
  .max(SEASONS_MAX, { message: `may have at most ${SEASONS_MAX} seasons` })
  .superRefine((seasons, ctx) => {
    for (const e of checkSeasonScheme(seasons).errors) {
      // `field` is "seasons.1.start"; the path is relative to this array.
      ctx.addIssue({ code: 'custom', path: e.field.split('.').slice(1).map((p) => (/^\d+$/.test(p) ? Number(p) : p)), message: e.message });
    }
  });

/** `POST /api/sites` (admin) → 201 `SavedSite`; 409 when the code is taken. */
export const createSiteBody = z.object({
  code: z.string({ message: 'is required' }).trim().min(1, { message: 'is required' }).max(20, { message: 'must be at most 20 characters' }).regex(SITE_CODE, { message: 'may hold only letters, digits and hyphens' }),
  name: text(120),
  timezone,
  latitude: latitude.nullish(),
  longitude: longitude.nullish(),
  elevationM: elevationM.nullish(),
  seasons: seasonScheme,
});
export type CreateSiteBody = z.infer<typeof createSiteBody>;

/** `PATCH /api/sites/:id` (admin) → 200 `Site`; seasons change only through `PUT /api/sites/:id/seasons`. */
export const updateSiteBody = createSiteBody
  .omit({ seasons: true })
  .partial()
  .extend({ seasons: z.never({ message: 'change seasons with PUT /api/sites/:id/seasons' }).optional() });
export type UpdateSiteBody = z.infer<typeof updateSiteBody>;

/** `PUT /api/sites/:id/seasons` (admin) → 200 `SavedSite`: replaces the whole scheme. */
export const replaceSeasonsBody = z.object({ seasons: seasonScheme });
export type ReplaceSeasonsBody = z.infer<typeof replaceSeasonsBody>;

const plantedOn = z.iso.date({ message: 'must be a date YYYY-MM-DD' });

const plantInput = z.object({
  label: z.string().trim().min(1).max(40),
  plantedOn,
  siteId: z.number().int().positive().optional(),
});

const passportFields = {
  accessionNumber: z.string().trim().min(1, { message: 'is required' }).max(40),
  name: z.string().trim().min(1, { message: 'is required' }).max(120),
  siteId: z.number().int().positive(),
  otherNames: z.array(z.string().trim().min(1).max(120)).max(20).optional(),
  instituteCode: z.string().trim().max(20).nullish(),
  originCountry: z.string().regex(/^[A-Z]{3}$/, { message: 'must be an ISO 3166-1 alpha-3 code' }).nullish(),
  collectingSite: z.string().trim().max(200).nullish(),
  collectingLatitude: latitude.nullish(),
  collectingLongitude: longitude.nullish(),
  collectingElevationM: elevationM.nullish(),
  acquisitionDate: z.string().regex(MCPD_DATE, { message: 'must be YYYYMMDD, hyphens for unknown parts' }).nullish(),
  sampleStatus: z.number().int().min(100).max(999).nullish(),
  donorName: z.string().trim().max(200).nullish(),
  remarks: z.string().trim().max(2000).nullish(),
};

export const createAccessionBody = z.object({
  ...passportFields,
  plants: z.array(plantInput).max(200).optional(),
});
export type CreateAccessionBody = z.infer<typeof createAccessionBody>;

/** `PATCH /api/accessions/:id` (admin) → 200 `Accession`: any passport field; null clears an optional one; 409 for a taken number. */
export const updateAccessionBody = z
  .object({
    ...passportFields,
    otherNames: z.array(z.string().trim().min(1).max(120)).max(20),
    genus: text(40),
    species: text(40),
    speciesAuthor: text(40),
    cropName: text(40),
  })
  .partial();
export type UpdateAccessionBody = z.infer<typeof updateAccessionBody>;

/** `POST /api/accessions/:id/plants` (admin) → 201 `Plant`; the site defaults to the accession's; 409 for a taken label. */
export const createPlantBody = z.object({ label: text(40), plantedOn, siteId: id('site').optional() });
export type CreatePlantBody = z.infer<typeof createPlantBody>;

/** `PATCH /api/plants/:id` (admin) → 200 `Plant`. */
export const updatePlantBody = createPlantBody.partial();
export type UpdatePlantBody = z.infer<typeof updatePlantBody>;

const characterCode = z
  .string({ message: 'is required' })
  .max(60, { message: 'must be at most 60 characters' })
  .regex(CHARACTER_CODE, { message: 'must be lowercase words joined by dots, like petiole.third.upper' });

/** ΔE00 threshold: above 0, at most 100. */
const driftThreshold = z.number({ message: 'must be a ΔE00 number' }).gt(0, { message: 'must be greater than 0' }).max(100, { message: 'must be at most 100' });

/** `POST /api/characters` (admin) → 201 `Character`; 409 for a taken code. */
export const createCharacterBody = z.object({
  code: characterCode,
  organ: z.enum(ORGANS, { message: `must be one of ${ORGANS.join(', ')}` }),
  label: text(120),
  howToRead: text(2000),
  caution: optionalText(1000),
  colour: z.boolean({ message: 'must be true or false' }).optional(),
  driftThreshold: driftThreshold.optional(),
});
export type CreateCharacterBody = z.infer<typeof createCharacterBody>;

/** `PATCH /api/characters/:id` (admin) → 200 `Character`; code and organ never change (readings refer to them). */
export const updateCharacterBody = z
  .object({
    label: text(120),
    howToRead: text(2000),
    caution: optionalText(1000),
    active: z.boolean({ message: 'must be true or false' }),
    driftThreshold,
  })
  .partial()
  .extend({
    code: z.never({ message: 'never changes: readings refer to it' }).optional(),
    organ: z.never({ message: 'never changes: readings refer to it' }).optional(),
  });
export type UpdateCharacterBody = z.infer<typeof updateCharacterBody>;
