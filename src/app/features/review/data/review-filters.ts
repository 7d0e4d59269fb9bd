// The review queue's filters and page live in the URL, so a reviewer can bookmark "submitted
// readings of this accession" and come back to it. Oldest first: the queue is worked in order.
import type { Params } from '@angular/router';

import { READING_STATUSES, type ReadingStatus } from '../../../../../shared/api/reading-answers.js';
import type { ReviewQueueQuery } from '../../../../../shared/api/review-answers.js';

export const QUEUE_PAGE_SIZES = [10, 25, 50] as const;
export const QUEUE_PAGE_SIZE = 25;
/** The status the server lists when none is asked for. */
export const QUEUE_DEFAULT_STATUS: ReadingStatus = 'submitted';

const ID_KEYS = ['accessionId', 'characterId', 'siteId', 'observerId'] as const;
const DATE = /^\d{4}-\d{2}-\d{2}$/;

function id(value: unknown): number | null {
  if (typeof value !== 'string' || !/^\d{1,9}$/.test(value)) return null;
  const n = Number(value);
  return n > 0 ? n : null;
}

/** The queue query the URL describes, oldest first; malformed values are left out. */
export function queueFromParams(params: Params): ReviewQueueQuery {
  const query: ReviewQueueQuery = { sort: 'observedAt', dir: 'asc' };
  for (const key of ID_KEYS) {
    const v = id(params[key]);
    if (v !== null) query[key] = v;
  }
  const status = params['status'];
  if (typeof status === 'string' && (READING_STATUSES as readonly string[]).includes(status)) query.status = status as ReadingStatus;
  const from = params['from'];
  if (typeof from === 'string' && DATE.test(from)) query.from = from;
  const to = params['to'];
  if (typeof to === 'string' && DATE.test(to) && !(query.from && to < query.from)) query.to = to;
  query.page = id(params['page']) ?? 1;
  const size = id(params['pageSize']);
  query.pageSize = size !== null && (QUEUE_PAGE_SIZES as readonly number[]).includes(size) ? size : QUEUE_PAGE_SIZE;
  return query;
}

/** The URL's query for a queue query; every key present (null when unset or default) so navigating clears it too. */
export function paramsFromQueue(query: ReviewQueueQuery): Params {
  return {
    accessionId: query.accessionId ?? null,
    characterId: query.characterId ?? null,
    siteId: query.siteId ?? null,
    observerId: query.observerId ?? null,
    status: query.status && query.status !== QUEUE_DEFAULT_STATUS ? query.status : null,
    from: query.from || null,
    to: query.to || null,
    page: query.page && query.page > 1 ? query.page : null,
    pageSize: query.pageSize && query.pageSize !== QUEUE_PAGE_SIZE ? query.pageSize : null,
  };
}
