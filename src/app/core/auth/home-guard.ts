import { inject } from '@angular/core';
import { CanActivateFn, Router } from '@angular/router';
import { catchError, map, of } from 'rxjs';

import type { Role } from '../../../../shared/api/auth.js';
import { signInUrl } from './auth-guard';
import { AuthStore } from './auth-store';

/** Where each role starts after signing in: the section of its daily job. */
export const HOME_PATHS: Readonly<Record<Role, string>> = {
  recorder: '/record',
  reviewer: '/review',
  trainer: '/calibration',
  admin: '/collection',
};

/** The start page of a role; Collection when the role is not known. */
export function homePathFor(role: Role | null | undefined): string {
  return role ? HOME_PATHS[role] : '/collection';
}

/** Sends "/" to the signed-in person's start page (a guard, so the account is loaded first). */
export const homeGuard: CanActivateFn = (_route, state) => {
  const store = inject(AuthStore);
  const router = inject(Router);
  return store.load().pipe(
    catchError(() => of(null)),
    map((user) => (user ? router.parseUrl(homePathFor(user.role)) : signInUrl(router, state.url))),
  );
};
