import type { FieldError } from '../../shared/api/problem.js';

export type { FieldError };

/** An error that becomes an RFC 9457 problem+json answer. */
export class AppError extends Error {
  constructor(
    readonly status: number,
    readonly title: string,
    readonly detail?: string,
    readonly errors?: FieldError[],
    /** A short slug appended to the problem type URI. */
    readonly slug: string = defaultSlug(status),
    /** RFC 9457 §3.2 extension members, written beside the standard ones. */
    readonly extensions?: Record<string, unknown>,
  ) {
    super(detail ?? title);
  }

  static badRequest(detail: string, errors?: FieldError[]): AppError {
    return new AppError(400, 'Bad request', detail, errors, errors ? 'validation' : 'bad-request');
  }
  static unauthorized(detail = 'Sign in first.'): AppError {
    return new AppError(401, 'Not signed in', detail);
  }
  static forbidden(detail = 'Your role does not allow this.'): AppError {
    return new AppError(403, 'Forbidden', detail);
  }
  static notFound(detail = 'Nothing here.'): AppError {
    return new AppError(404, 'Not found', detail);
  }
  static conflict(detail: string): AppError {
    return new AppError(409, 'Conflict', detail);
  }
  static gone(detail: string): AppError {
    return new AppError(410, 'Gone', detail);
  }
}

function defaultSlug(status: number): string {
  return (
    {
      400: 'bad-request',
      401: 'unauthorized',
      403: 'forbidden',
      404: 'not-found',
      409: 'conflict',
      410: 'gone',
      413: 'too-large',
      415: 'unsupported-media-type',
      429: 'too-many-requests',
    }[status] ?? 'error'
  );
}
