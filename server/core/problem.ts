import type { ErrorRequestHandler, RequestHandler } from 'express';
import { AppError } from './app-error.js';

/** Base of our problem type URIs (RFC 9457 §3.1.1: a URI reference identifying the problem type). */
const TYPE_BASE = 'https://hueledger.invalid/problems/';

/** Unknown /api routes answer 404 problem+json rather than the client's index page. */
export const apiNotFound: RequestHandler = (req, _res, next) => {
  next(AppError.notFound(`No API route ${req.method} ${req.path}.`));
};

/**
 * The one error middleware, registered last: writes RFC 9457 problem+json and never a stack trace.
 * Errors from body parsers and multer carry `status`/`type`; anything else is a 500.
 */
export function problemHandler(log: (err: unknown) => void = console.error): ErrorRequestHandler {
  return (err, req, res, next) => {
    if (res.headersSent) return next(err);
    const problem = toProblem(err);
    if (problem.status >= 500) log(err);
    res.status(problem.status).type('application/problem+json').json({ ...problem, instance: req.originalUrl });
  };
}

function toProblem(err: unknown): Record<string, unknown> & { status: number } {
  if (err instanceof AppError) {
    return {
      type: TYPE_BASE + err.slug,
      title: err.title,
      status: err.status,
      ...(err.detail ? { detail: err.detail } : {}),
      ...(err.errors ? { errors: err.errors } : {}),
      ...err.extensions,
    };
  }
  const e = err as { status?: number; statusCode?: number; type?: string; expose?: boolean; message?: string };
  const status = e.status ?? e.statusCode;
  if (typeof status === 'number' && status >= 400 && status < 500) {
    // body-parser's errors (entity.too.large, entity.parse.failed, …) are safe to describe.
    const title = status === 413 ? 'Payload too large' : status === 415 ? 'Unsupported media type' : 'Bad request';
    return { type: TYPE_BASE + (e.type ?? 'bad-request').replace(/\./g, '-'), title, status, detail: describe(e) };
  }
  return { type: TYPE_BASE + 'internal', title: 'Internal server error', status: 500, detail: 'Something went wrong on the server; it has been logged.' };
}

function describe(e: { type?: string; message?: string }): string {
  switch (e.type) {
    case 'entity.parse.failed':
      return 'The body is not valid JSON.';
    case 'entity.too.large':
      return 'The body is larger than the server accepts.';
    case 'charset.unsupported':
    case 'encoding.unsupported':
      return 'The body uses an encoding the server does not accept.';
    default:
      return e.message ?? 'The request could not be read.';
  }
}
