// Which failures the queue retries by itself and which wait for the recorder, and how long it waits.
import { IDEMPOTENCY_PROBLEMS } from '../../../../shared/api/idempotency.js';
import { ApiError } from '../http/api-error';
import type { QueueError } from './queue-item';

/** What to do after a failed attempt. */
export type Verdict = 'retry' | 'needs-attention';

/**
 * Out of range, a server hiccup, a rate limit, an expired session or a key still in use: try
 * again later. Any other 4xx is the server refusing this reading (an accession renamed away, a
 * character retired, a photo it cannot read): it waits for the recorder, never dropped.
 */
export function verdictOf(error: QueueError, type = 'about:blank'): Verdict {
  const s = error.status;
  if (s === 0 || s >= 500 || s === 408 || s === 429 || s === 401) return 'retry';
  if (s === 409 && type.endsWith(IDEMPOTENCY_PROBLEMS.inUse)) return 'retry';
  if (s === 403 && /csrf|xsrf/i.test(`${type} ${error.detail ?? ''}`)) return 'retry';
  return 'needs-attention';
}

/** A failure in the words kept with the item; anything that is not an ApiError is a lost connection. */
export function queueErrorOf(error: unknown): { error: QueueError; type: string } {
  if (error instanceof ApiError) {
    // The service worker answers 504 without a problem document when the network is gone.
    const unreachable = error.status === 0 || (error.status === 504 && error.type === 'about:blank');
    if (unreachable) return { error: offline(), type: 'about:blank' };
    return { error: { status: error.status, title: error.title, detail: error.detail, fieldErrors: error.fieldErrors }, type: error.type };
  }
  return { error: offline(), type: 'about:blank' };
}

function offline(): QueueError {
  return { status: 0, title: 'No connection', detail: 'It will be sent when the phone is back in range.', fieldErrors: [] };
}

/** First retry after 30 s, doubling to at most 15 min (our own: gentle on a weak signal and on the battery). */
export function backoffMs(attempts: number): number {
  return Math.min(30_000 * 2 ** Math.max(0, attempts - 1), 15 * 60_000);
}
