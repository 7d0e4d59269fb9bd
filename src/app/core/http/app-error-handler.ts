import { ErrorHandler, Injectable, Injector, inject } from '@angular/core';

import { ApiError } from './api-error';
import type { ErrorSnackData } from './error-snack';

/** How long an error stays on screen; long enough to read with wet hands. */
const ERROR_SNACK_MS = 8000;

/** Shows any uncaught error as a snack bar in plain words, and keeps the full error in the console. */
@Injectable()
export class AppErrorHandler implements ErrorHandler {
  // Resolved lazily: the ErrorHandler is created before most of the app's providers.
  private readonly injector = inject(Injector);

  handleError(error: unknown): void {
    console.error(error);
    void this.show(describeError(error));
  }

  /**
   * The snack bar (with the CDK overlay under it) loads on the first error rather than with the
   * first screen: it is most of what Material would otherwise add to the initial download.
   */
  private async show(data: ErrorSnackData): Promise<void> {
    const [{ MatSnackBar }, { ErrorSnack }] = await Promise.all([import('@angular/material/snack-bar'), import('./error-snack')]);
    this.injector.get(MatSnackBar).openFromComponent(ErrorSnack, {
      data,
      duration: ERROR_SNACK_MS,
      panelClass: 'hl-error-snack',
    });
  }
}

/** Turns any thrown value into the words shown to the person. */
export function describeError(error: unknown): ErrorSnackData {
  const cause = unwrap(error);
  if (cause instanceof ApiError) {
    const message = cause.detail ? `${cause.title} ${cause.detail}` : cause.title;
    return { message, fields: cause.fieldErrors };
  }
  return { message: 'Something went wrong. Reload the page and try again.', fields: [] };
}

/** Promise rejections and some wrappers carry the real error in `rejection` or `cause`. */
function unwrap(error: unknown): unknown {
  if (error instanceof ApiError) return error;
  if (typeof error === 'object' && error !== null) {
    const inner = (error as { rejection?: unknown; cause?: unknown }).rejection ?? (error as { cause?: unknown }).cause;
    if (inner instanceof ApiError) return inner;
  }
  return error;
}
