import { HttpErrorResponse } from '@angular/common/http';

import type { FieldError, Problem } from '../../../../shared/api/problem.js';

export type { FieldError } from '../../../../shared/api/problem.js';

/** Titles for answers that carry no problem document (proxy errors, network failures). */
const FALLBACK_TITLES: Record<number, string> = {
  0: 'The server cannot be reached. Check the connection and try again.',
  400: 'The request was not accepted.',
  401: 'Please sign in.',
  403: 'Your role does not allow this.',
  404: 'Not found.',
  409: 'This conflicts with something already saved.',
  410: 'This is no longer available.',
  429: 'Too many attempts. Wait a little, then try again.',
};

/** The one error type the client handles: an HTTP failure, read from RFC 9457 problem+json where sent. */
export class ApiError extends Error {
  override readonly name = 'ApiError';

  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail: string | null = null,
    readonly fieldErrors: readonly FieldError[] = [],
    readonly type = 'about:blank',
  ) {
    super(detail ? `${title} ${detail}` : title);
  }

  /** Builds an ApiError from a failed HttpClient response, whatever its body. */
  static fromResponse(response: HttpErrorResponse): ApiError {
    const problem = asProblem(response.error);
    const status = problem?.status ?? response.status;
    const title = problem?.title ?? FALLBACK_TITLES[status] ?? `The server answered ${status} ${response.statusText}`.trim();
    return new ApiError(status, title, problem?.detail ?? null, problem?.errors ?? [], problem?.type ?? 'about:blank');
  }

  /** The message for the field with this name, if the server refused it. */
  messageFor(field: string): string | null {
    return this.fieldErrors.find((error) => error.field === field)?.message ?? null;
  }
}

/** Reads a problem document from an error body, which may arrive parsed, as text, or not at all. */
function asProblem(body: unknown): Problem | null {
  const value = typeof body === 'string' ? parseJson(body) : body;
  if (typeof value !== 'object' || value === null) return null;
  const candidate = value as Partial<Problem>;
  if (typeof candidate.title !== 'string' || typeof candidate.status !== 'number') return null;
  const errors = Array.isArray(candidate.errors)
    ? candidate.errors.filter((e) => typeof e?.field === 'string' && typeof e?.message === 'string')
    : undefined;
  return { ...candidate, errors } as Problem;
}

function parseJson(text: string): unknown {
  try {
    return JSON.parse(text);
  } catch {
    return null;
  }
}
