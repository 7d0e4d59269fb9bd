import { HttpErrorResponse, HttpHeaders, HttpResponse, type HttpInterceptorFn } from '@angular/common/http';
import { catchError, of, tap, throwError } from 'rxjs';

import type { UserSummary } from '../../../../shared/api/auth.js';

/** Where the last signed-in person is remembered on this device (only who, never a password or token). */
const LAST_USER = 'hueledger.offline.lastUser';

/** Header on an answer made up here from memory, so anyone curious can tell. */
export const OFFLINE_ANSWER_HEADER = 'X-Hueledger-Offline';

/**
 * Keeps the app usable out of range: `GET /api/auth/me` is never cached by the service worker,
 * so when it cannot reach the server this answers with the person last signed in on this device
 * (their session cookie still travels with the queue's requests once back in range; if it has
 * expired by then, those answer 401 and the queue waits for a new sign-in). A 401, sign-out and
 * sign-in update the memory.
 */
export const offlineSessionInterceptor: HttpInterceptorFn = (req, next) => {
  const path = req.url.split('?')[0]!;
  if (path.endsWith('/api/auth/logout')) {
    forget();
    return next(req);
  }
  if (path.endsWith('/api/auth/login') && req.method === 'POST') {
    return next(req).pipe(tap((event) => event instanceof HttpResponse && remember(event.body)));
  }
  if (!path.endsWith('/api/auth/me') || req.method !== 'GET') return next(req);
  return next(req).pipe(
    tap((event) => event instanceof HttpResponse && remember(event.body)),
    catchError((error: unknown) => {
      if (error instanceof HttpErrorResponse && error.status === 401) forget();
      const known = recall();
      if (known && isUnreachable(error)) return of(new HttpResponse({ status: 200, body: { user: known }, headers: new HttpHeaders({ [OFFLINE_ANSWER_HEADER]: '1' }), url: req.url }));
      return throwError(() => error);
    }),
  );
};

/** No answer at all, or the service worker's 504 for a request it could not pass on. */
function isUnreachable(error: unknown): boolean {
  return error instanceof HttpErrorResponse && (error.status === 0 || (error.status === 504 && !isProblem(error.error)));
}

function isProblem(body: unknown): boolean {
  return typeof body === 'object' && body !== null && 'status' in body && 'title' in body;
}

function remember(body: unknown): void {
  const user = (body as { user?: UserSummary } | null)?.user;
  if (user && typeof user.id === 'number') localStorage.setItem(LAST_USER, JSON.stringify(user));
}

function forget(): void {
  localStorage.removeItem(LAST_USER);
}

function recall(): UserSummary | null {
  try {
    const user = JSON.parse(localStorage.getItem(LAST_USER) ?? 'null') as UserSummary | null;
    return user && typeof user.id === 'number' && typeof user.role === 'string' ? user : null;
  } catch {
    return null;
  }
}
