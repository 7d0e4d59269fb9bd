import { Injectable, computed, inject, signal } from '@angular/core';
import { Observable, catchError, map, of, shareReplay, tap, throwError } from 'rxjs';

import type { Role, UserSummary } from '../../../../shared/api/auth.js';
import { ApiError } from '../http/api-error';
import { AuthApi } from './auth-api';

/** Who is signed in, loaded once from the session and kept up to date by sign-in and sign-out. */
@Injectable({ providedIn: 'root' })
export class AuthStore {
  private readonly api = inject(AuthApi);
  private readonly user = signal<UserSummary | null>(null);
  private pending: Observable<UserSummary | null> | null = null;
  private loaded = false;

  /** The signed-in person, or null. */
  readonly currentUser = this.user.asReadonly();
  /** The signed-in person's role, or null. */
  readonly role = computed<Role | null>(() => this.user()?.role ?? null);
  /** Whether somebody is signed in. */
  readonly signedIn = computed(() => this.user() !== null);

  /**
   * Asks the server who is signed in (at most once until sign-in or sign-out changes it).
   * A 401 means nobody; other failures are passed on.
   */
  load(): Observable<UserSummary | null> {
    if (this.loaded) return of(this.user());
    this.pending ??= this.api.me().pipe(
      catchError((error: unknown) => (error instanceof ApiError && error.status === 401 ? of(null) : throwError(() => error))),
      tap((user) => this.remember(user)),
      map(() => this.user()),
      tap({ finalize: () => (this.pending = null) }),
      shareReplay({ bufferSize: 1, refCount: true }),
    );
    return this.pending;
  }

  /** Signs in and remembers who; fails with the server's ApiError (401 bad credentials, 429 too many tries). */
  signIn(email: string, password: string): Observable<UserSummary> {
    return this.api.login({ email, password }).pipe(tap((user) => this.remember(user)));
  }

  /** Signs out on the server and forgets the person here, even when the session had already ended. */
  signOut(): Observable<void> {
    return this.api.logout().pipe(
      catchError((error: unknown) => (error instanceof ApiError && error.status === 401 ? of(undefined) : throwError(() => error))),
      tap(() => this.remember(null)),
    );
  }

  /** Forgets the person without asking the server, e.g. when a request shows the session has ended. */
  forget(): void {
    this.remember(null);
  }

  private remember(user: UserSummary | null): void {
    this.user.set(user);
    this.loaded = true;
  }
}
