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
