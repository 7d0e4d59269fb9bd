import type { z } from 'zod';
import { AppError } from './app-error.js';

/** Parses input with a zod schema at the route edge; a failure is a 400 naming each field and why. */
export function parse<S extends z.ZodType>(schema: S, input: unknown, what = 'body'): z.infer<S> {
  const result = schema.safeParse(input ?? {});
  if (result.success) return result.data;
  const errors = result.error.issues.map((issue) => ({
    field: issue.path.length ? issue.path.join('.') : what,
    message: issue.message,
  }));
  throw AppError.badRequest(`The request ${what} is not valid: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}.`, errors);
}

/** Parses a positive integer route parameter; 404 when it is not one (no such resource). */
export function idParam(value: unknown): number {
  const n = typeof value === 'string' && /^\d{1,12}$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(n) || n <= 0) throw AppError.notFound();
  return n;
}
