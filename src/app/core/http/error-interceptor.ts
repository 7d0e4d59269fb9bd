import { HttpErrorResponse, HttpInterceptorFn } from '@angular/common/http';
import { inject } from '@angular/core';
import { Router } from '@angular/router';
import { catchError, throwError } from 'rxjs';

import { AuthStore } from '../auth/auth-store';
import { ApiError } from './api-error';

/** Auth routes where 401 is the expected answer (bad credentials, nobody signed in), not an expired session. */
const EXPECTED_401_URLS = ['/api/auth/login', '/api/auth/me', '/api/auth/logout'];

/** Turns every failed response into an {@link ApiError}; a 401 elsewhere means the session ended, so it sends to sign-in. */
export const errorInterceptor: HttpInterceptorFn = (req, next) => {
  const router = inject(Router);
  const authStore = inject(AuthStore);
  return next(req).pipe(
    catchError((error: unknown) => {
      if (!(error instanceof HttpErrorResponse)) return throwError(() => error);
      const apiError = ApiError.fromResponse(error);
      if (apiError.status === 401 && !isExpected401(req.url)) {
        authStore.forget();
        sendToSignIn(router);
      }
      return throwError(() => apiError);
    }),
  );
};

function isExpected401(url: string): boolean {
  const path = url.split('?')[0];
  return EXPECTED_401_URLS.some((expected) => path.endsWith(expected));
}

function sendToSignIn(router: Router): void {
  const current = router.url;
  if (current.startsWith('/sign-in')) return;
  const returnUrl = current === '/' ? undefined : current;
  void router.navigate(['/sign-in'], { queryParams: { returnUrl } });
}
