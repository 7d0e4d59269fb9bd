import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import type { Role } from '../../../../shared/api/auth.js';
import { signInUrl } from './auth-guard';
import { AuthStore } from './auth-store';

/** A guard that lets only the given roles through; other roles go home, signed-out people to sign-in. */
export function roleGuard(...roles: Role[]): CanActivateFn {
  return (_route, state) => {
    const store = inject(AuthStore);
    const router = inject(Router);
    return store.load().pipe(
      catchError(() => of(null)),
      map((user) => {
        if (!user) return signInUrl(router, state.url);
        return roles.includes(user.role) ? true : router.createUrlTree(['/']);
      }),
    );
  };
}
