import { FormGroup } from '@angular/forms';

import { ApiError } from './api-error';

/**
 * Puts the server's refusals on the matching form controls (as the `server` error) and returns
 * the messages that match no control, so the page can show them above the form.
 */
export function applyFieldErrors(form: FormGroup, error: ApiError, aliases: Record<string, string> = {}): string[] {
  const unmatched: string[] = [];
  for (const { field, message } of error.fieldErrors) {
    const control = form.get(aliases[field] ?? field);
    if (control) {
      control.setErrors({ ...control.errors, server: message });
      control.markAsTouched();
    } else {
      unmatched.push(`${field} ${message}`);
    }
  }
  return unmatched;
}

/**
 * The one way a form shows a refusal: anything but an API error gets `fallback`; an API error's
 * field errors go on their controls, and what is left for the line above the form is returned —
 * the server's message with any refusals no control took, or null when every one found its field.
 */
export function refusalMessage(form: FormGroup, error: unknown, fallback: string, aliases: Record<string, string> = {}): string | null {
  if (!(error instanceof ApiError)) return fallback;
  const unmatched = applyFieldErrors(form, error, aliases);
  return error.fieldErrors.length === 0 || unmatched.length > 0 ? [error.message, ...unmatched].join(' ') : null;
}
