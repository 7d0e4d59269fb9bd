import type { z } from 'zod';
import { AppError, type FieldError } from './app-error.js';

/**
 * Parses input with a zod schema at the route edge; a failure is a 400 naming each field and why.
 * Text holding control characters (see `controlCharacterErrors`) is refused the same way.
 */
export function parse<S extends z.ZodType>(schema: S, input: unknown, what = 'body'): z.infer<S> {
  const result = schema.safeParse(input ?? {});
  const errors: FieldError[] = result.success
    ? controlCharacterErrors(result.data, what)
    : result.error.issues.map((issue) => ({
        field: issue.path.length ? issue.path.join('.') : what,
        message: issue.message,
      }));
  if (result.success && !errors.length) return result.data;
  throw AppError.badRequest(`The request ${what} is not valid: ${errors.map((e) => `${e.field} ${e.message}`).join('; ')}.`, errors);
}

/**
 * C0 controls other than tab, line feed and carriage return, DEL, C1 controls, and the Unicode
 * bidirectional embeddings, overrides and isolates (U+202A–U+202E, U+2066–U+2069; Unicode
 * Technical Report #36, "Bidirectional text spoofing"): invisible in a list or an export, they can
 * hide or reorder what a reviewer reads, and NUL truncates text in other tools.
 */
const CONTROL_CHARACTER = /[\u0000-\u0008\u000B\u000C\u000E-\u001F\u007F-\u009F\u202A-\u202E\u2066-\u2069]/;

/** Fields whose text is never shown and must reach the password check as typed. */
const OPAQUE_FIELD = /password$/i;

/** A field error for every string in a parsed value that holds a control character; newlines and tabs are kept. */
export function controlCharacterErrors(value: unknown, what = 'body', path: readonly (string | number)[] = []): FieldError[] {
  if (typeof value === 'string') {
    const found = CONTROL_CHARACTER.exec(value);
    if (!found) return [];
    const code = `U+${found[0].codePointAt(0)!.toString(16).toUpperCase().padStart(4, '0')}`;
    return [{ field: path.length ? path.join('.') : what, message: `must not contain control characters (${code} at character ${found.index + 1}); newlines and tabs are fine` }];
  }
  if (Array.isArray(value)) return value.flatMap((item, i) => controlCharacterErrors(item, what, [...path, i]));
  if (value && typeof value === 'object' && !(value instanceof Date)) {
    return Object.entries(value).flatMap(([key, item]) => (OPAQUE_FIELD.test(key) ? [] : controlCharacterErrors(item, what, [...path, key])));
  }
  return [];
}

/** Parses a positive integer route parameter; 404 when it is not one (no such resource). */
export function idParam(value: unknown): number {
  const n = typeof value === 'string' && /^\d{1,12}$/.test(value) ? Number(value) : NaN;
  if (!Number.isSafeInteger(n) || n <= 0) throw AppError.notFound();
  return n;
}
