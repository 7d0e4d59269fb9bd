import { inject } from '@angular/core';
import { CanActivateFn, Router, UrlTree } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import { AuthStore } from './auth-store';

/** The sign-in page, remembering where the person wanted to go. */
export function signInUrl(router: Router, returnUrl: string): UrlTree {
  const queryParams = returnUrl && returnUrl !== '/' ? { returnUrl } : {};
  return router.createUrlTree(['/sign-in'], { queryParams });
}

/** Lets signed-in people through; everybody else goes to /sign-in?returnUrl=… */
export const authGuard: CanActivateFn = (_route, state) => {
  const store = inject(AuthStore);
  const router = inject(Router);
  return store.load().pipe(
    catchError(() => of(null)),
    map((user) => (user ? true : signInUrl(router, state.url))),
  );
};
