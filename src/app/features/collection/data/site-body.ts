import type { CreateSiteBody } from '../../../../../shared/api/collection.js';
import type { SeasonDraft } from './season-form';

/** The site form's value as the server takes it: text trimmed, empty numbers as null. */
export function siteBody(value: {
  code: string;
  name: string;
  timezone: string;
  latitude: number | null;
  longitude: number | null;
  elevationM: number | null;
  seasons: SeasonDraft[];
}): CreateSiteBody {
  return {
    code: value.code.trim(),
    name: value.name.trim(),
    timezone: value.timezone.trim(),
    latitude: numberOrNull(value.latitude),
    longitude: numberOrNull(value.longitude),
    elevationM: numberOrNull(value.elevationM),
    seasons: value.seasons.map((season) => ({ name: season.name.trim(), start: season.start, end: season.end })),
  };
}

/** A number input's value: a real number, or null for empty (Angular gives null or "" for an empty number input). */
function numberOrNull(value: number | string | null): number | null {
  return typeof value === 'number' && Number.isFinite(value) ? value : null;
}
