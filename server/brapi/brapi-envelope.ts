// The BrAPI v2.1 answer shapes: the envelope every answer is wrapped in, its page numbering, and its
// error answer. Field names and defaults follow the specification's `metadata`, `basePagination`
// and `400BadRequest`/`401Unauthorized`/`403Forbidden`/`404NotFound` components (BrAPI v2.1,
// BrAPI-Core; see tests/brapi-schemas/README.md for the exact source).
import type { ErrorRequestHandler, Request } from 'express';
import { AppError } from '../core/app-error.js';

/** The BrAPI version served. */
export const BRAPI_VERSION = '2.1';

/** The specification's default page size (`pageSize` parameter: "Default is `1000`"). */
export const DEFAULT_PAGE_SIZE = 1000;

/** Our own ceiling: a page larger than this would hold one request for too long on a small server. */
export const MAX_PAGE_SIZE = 1000;

/** A requested page: 0-based `page`, and `pageSize`. */
export interface PageRequest {
  page: number;
  pageSize: number;
}

/** One message of `metadata.status`. */
export interface BrapiStatus {
  message: string;
  messageType: 'DEBUG' | 'ERROR' | 'WARNING' | 'INFO';
}

/** `metadata.pagination` (`basePagination`). */
export interface BrapiPagination {
  currentPage: number;
  pageSize: number;
  totalCount: number;
  totalPages: number;
}

/** The envelope of a BrAPI answer. */
export interface BrapiAnswer<R> {
  metadata: { datafiles: never[]; pagination: BrapiPagination; status: BrapiStatus[] };
  result: R;
}

/**
 * A refusal in BrAPI's own form. The specification gives every error answer (400, 401, 403, 404)
 * as a JSON string "ERROR - <timestamp> - <message>", not RFC 9457 problem+json: clients of the
 * standard parse that.
 */
export class BrapiError extends Error {
  constructor(
    readonly status: number,
    message: string,
  ) {
    super(message);
  }
}

/** A list answer: one page of `data` with its pagination. `pageSize` is the number returned when the page is short, as `basePagination` says. */
export function listAnswer<T>(data: T[], req: PageRequest, totalCount: number): BrapiAnswer<{ data: T[] }> {
  return {
    metadata: {
      datafiles: [],
      pagination: { currentPage: req.page, pageSize: Math.min(req.pageSize, data.length), totalCount, totalPages: Math.ceil(totalCount / req.pageSize) },
      status: [],
    },
    result: { data },
  };
}

/** A single-object answer, paged as one item on one page. */
export function singleAnswer<R>(result: R): BrapiAnswer<R> {
  return { metadata: { datafiles: [], pagination: { currentPage: 0, pageSize: 1, totalCount: 1, totalPages: 1 }, status: [] }, result };
}

/** One page of an in-memory list. */
export function pageOf<T>(all: readonly T[], req: PageRequest): BrapiAnswer<{ data: T[] }> {
  const start = req.page * req.pageSize;
  return listAnswer(all.slice(start, start + req.pageSize), req, all.length);
}

/** A query parameter given at most once; 400 when it is repeated. */
export function oneParam(req: Request, name: string): string | undefined {
  const value = (req.query as Record<string, unknown>)[name];
  if (value === undefined) return undefined;
  if (typeof value !== 'string') throw new BrapiError(400, `Invalid query parameter ${name}: give it once, as text`);
  return value;
}

function wholeNumber(req: Request, name: string, min: number, max: number, fallback: number): number {
  const raw = oneParam(req, name);
  if (raw === undefined) return fallback;
  if (!/^\d{1,9}$/.test(raw) || Number(raw) < min || Number(raw) > max) {
    throw new BrapiError(400, `Invalid query parameter ${name}: must be a whole number from ${min} to ${max} (got "${raw.slice(0, 40)}")`);
  }
  return Number(raw);
}

/** `page` (0-based, default 0) and `pageSize` (1–1000, default 1000); 400 in BrAPI's form when either is not a whole number in range. */
export function pageRequest(req: Request): PageRequest {
  return { page: wholeNumber(req, 'page', 0, 99_999_999, 0), pageSize: wholeNumber(req, 'pageSize', 1, MAX_PAGE_SIZE, DEFAULT_PAGE_SIZE) };
}

/** An optional ISO 8601 date-time parameter (with an offset or Z); 400 when it is not one. */
export function timeParam(req: Request, name: string): Date | undefined {
  const raw = oneParam(req, name);
  if (raw === undefined) return undefined;
  const ok = /^\d{4}-\d{2}-\d{2}(T\d{2}:\d{2}(:\d{2}(\.\d{1,9})?)?(Z|[+-]\d{2}:?\d{2}))?$/.test(raw);
  const at = new Date(raw.length === 10 ? `${raw}T00:00:00Z` : raw);
  if (!ok || Number.isNaN(at.getTime())) throw new BrapiError(400, `Invalid query parameter ${name}: must be an ISO 8601 date-time with an offset, e.g. 2025-11-01T00:00:00Z (got "${raw.slice(0, 40)}")`);
  return at;
}

/** The text of a BrAPI error answer: "ERROR - 2018-10-08T18:15:11Z - Missing or expired authorization token". */
export function errorText(message: string, at = new Date()): string {
  return `ERROR - ${at.toISOString().replace(/\.\d{3}Z$/, 'Z')} - ${message}`;
}

/** Turns any error under /brapi into BrAPI's error answer; 5xx keep their cause in the log only. */
export function brapiErrorHandler(log: (err: unknown) => void): ErrorRequestHandler {
  return (err, _req, res, next) => {
    if (res.headersSent) return next(err);
    let status = 500;
    let message = 'Something went wrong on the server; it has been logged';
    if (err instanceof BrapiError) ({ status, message } = err);
    else if (err instanceof AppError && err.status < 500) ({ status, message } = { status: err.status, message: err.detail ?? err.title });
    if (status >= 500) log(err);
    if (status === 401) res.setHeader('WWW-Authenticate', 'Bearer realm="Hueledger BrAPI"');
    res.status(status).type('application/json').send(JSON.stringify(errorText(message)));
  };
}
