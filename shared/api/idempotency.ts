// The Idempotency-Key contract of state-changing routes that a phone may resend (photos,
// readings). No zod here: the client's offline queue imports it.

/** Request header carrying the client's key (as in the IETF httpapi "Idempotency-Key" draft). */
export const IDEMPOTENCY_HEADER = 'Idempotency-Key';

/** Answer header set when the stored answer of an earlier request with the same key is replayed. */
export const REPLAYED_HEADER = 'Idempotent-Replayed';

/** A valid key: 1–100 characters of letters, digits, `_` and `-` (a UUID fits). */
export const IDEMPOTENCY_KEY_PATTERN = /^[A-Za-z0-9_-]{1,100}$/;

/** How long the server keeps a key and its answer; a resend after that runs again (our own choice: a week covers a field trip). */
export const IDEMPOTENCY_KEY_DAYS = 7;

/** Problem type slugs (after `…/problems/`) of the key's own refusals. */
export const IDEMPOTENCY_PROBLEMS = {
  /** 400: the header is not a valid key. */
  invalid: 'idempotency-key-invalid',
  /** 409: a request with this key is still running; try again shortly. */
  inUse: 'idempotency-key-in-use',
  /** 422: the key was used before with another body or route. */
  reused: 'idempotency-key-reused',
} as const;
