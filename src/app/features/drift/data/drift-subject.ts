// The drift pages keep their choice (accession, character, optional site) in the URL's query, so
// a view can be bookmarked, shared with a colleague and reloaded.
import type { Params } from '@angular/router';

/** What the picker has chosen so far; each part may still be missing. */
export interface DriftChoice {
  accessionId: number | null;
  characterId: number | null;
  siteId: number | null;
}

function id(value: unknown): number | null {
  if (typeof value !== 'string' || !/^\d{1,9}$/.test(value)) return null;
  const n = Number(value);
  return n > 0 ? n : null;
}

/** The choice the URL describes; malformed ids are left out. */
export function choiceFromParams(params: Params): DriftChoice {
  return { accessionId: id(params['accessionId']), characterId: id(params['characterId']), siteId: id(params['siteId']) };
}

/** The URL's query for a choice: unset parts are null, so navigating both sets and clears them. */
export function paramsFromChoice(choice: DriftChoice): Params {
  return { accessionId: choice.accessionId, characterId: choice.characterId, siteId: choice.siteId };
}

/** The subject to analyse, once both accession and character are chosen. */
export function subjectOf(choice: DriftChoice): { accessionId: number; characterId: number; siteId: number | null } | null {
  return choice.accessionId && choice.characterId ? { accessionId: choice.accessionId, characterId: choice.characterId, siteId: choice.siteId } : null;
}
