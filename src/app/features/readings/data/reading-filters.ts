// The readings table's filters, sort and page live in the URL's query parameters, so a filtered
// view can be bookmarked, shared and reloaded. This maps both ways and drops anything malformed.
import type { Params } from '@angular/router';

import { READINGS_PAGE_SIZE_DEFAULT, READING_METHODS, READING_SORTS, READING_STATUSES, type ReadingListQuery, type ReadingSort } from '../../../../../shared/api/reading-answers.js';

/** Rows per page unless the URL says otherwise. */
export const DEFAULT_PAGE_SIZE = READINGS_PAGE_SIZE_DEFAULT;
/** Page sizes the paginator offers. */
export const PAGE_SIZES = [10, 25, 50, 100] as const;
/** Newest first unless the URL says otherwise. */
export const DEFAULT_SORT: { sort: ReadingSort; dir: 'asc' | 'desc' } = { sort: 'observedAt', dir: 'desc' };

const ID_KEYS = ['accessionId', 'characterId', 'siteId', 'observerId'] as const;
const DATE = /^\d{4}-\d{2}-\d{2}$/;
/** The season years the server accepts (shared/api/readings.ts). */
const SEASON_YEAR_MIN = 1900;
const SEASON_YEAR_MAX = 2200;

/** The list query the URL describes; unknown or malformed values are left out, defaults filled in. */
export function filtersFromParams(params: Params): ReadingListQuery {
  const query: ReadingListQuery = {};
  for (const key of ID_KEYS) {
    const id = positiveInteger(params[key]);
    if (id !== null) query[key] = id;
  }
  const season = text(params['season']);
  if (season) query.season = season;
  const seasonYear = positiveInteger(params['seasonYear']);
  if (seasonYear !== null && seasonYear >= SEASON_YEAR_MIN && seasonYear <= SEASON_YEAR_MAX) query.seasonYear = seasonYear;
  const method = oneOf(params['method'], READING_METHODS);
  if (method) query.method = method;
  const status = oneOf(params['status'], READING_STATUSES);
  if (status) query.status = status;
  const from = text(params['from']);
  if (from && DATE.test(from)) query.from = from;
  const to = text(params['to']);
  // The server refuses a range that ends before it starts: such an end is dropped.
  if (to && DATE.test(to) && !(query.from && to < query.from)) query.to = to;
  if (params['includeSuperseded'] === 'true') query.includeSuperseded = true;
  query.sort = oneOf(params['sort'], READING_SORTS) ?? DEFAULT_SORT.sort;
  query.dir = params['dir'] === 'asc' || params['dir'] === 'desc' ? params['dir'] : DEFAULT_SORT.dir;
  query.page = positiveInteger(params['page']) ?? 1;
  const size = positiveInteger(params['pageSize']);
  query.pageSize = size !== null && (PAGE_SIZES as readonly number[]).includes(size) ? size : DEFAULT_PAGE_SIZE;
  return query;
}

/**
 * The URL's query parameters for a list query: every known key is present, null when unset or at
 * its default, so `router.navigate([], { queryParams })` both sets and clears them.
 */
export function paramsFromFilters(query: ReadingListQuery): Params {
  const isDefaultSort = (query.sort ?? DEFAULT_SORT.sort) === DEFAULT_SORT.sort && (query.dir ?? DEFAULT_SORT.dir) === DEFAULT_SORT.dir;
  return {
    accessionId: query.accessionId ?? null,
    characterId: query.characterId ?? null,
    siteId: query.siteId ?? null,
    observerId: query.observerId ?? null,
    season: query.season || null,
    seasonYear: query.seasonYear ?? null,
    method: query.method ?? null,
    status: query.status ?? null,
    from: query.from || null,
    to: query.to || null,
    includeSuperseded: query.includeSuperseded ? 'true' : null,
    sort: isDefaultSort ? null : (query.sort ?? DEFAULT_SORT.sort),
    dir: isDefaultSort ? null : (query.dir ?? DEFAULT_SORT.dir),
    page: query.page && query.page > 1 ? query.page : null,
    pageSize: query.pageSize && query.pageSize !== DEFAULT_PAGE_SIZE ? query.pageSize : null,
  };
}

/** How many filters (not sort or page) are set, for the "Filters (3)" button. */
export function activeFilterCount(query: ReadingListQuery): number {
  const keys: (keyof ReadingListQuery)[] = [...ID_KEYS, 'season', 'seasonYear', 'method', 'status', 'from', 'to', 'includeSuperseded'];
  return keys.filter((key) => query[key] !== undefined && query[key] !== false && query[key] !== '').length;
}

function text(value: unknown): string | null {
  return typeof value === 'string' && value.trim() ? value.trim() : null;
}

function positiveInteger(value: unknown): number | null {
  if (typeof value !== 'string' || !/^\d{1,9}$/.test(value)) return null;
  const n = Number(value);
  return n > 0 ? n : null;
}

function oneOf<T extends string>(value: unknown, allowed: readonly T[]): T | null {
  return typeof value === 'string' && (allowed as readonly string[]).includes(value) ? (value as T) : null;
}
