import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map } from 'rxjs';

import type {
  AcceptInvitationBody,
  ChangePasswordBody,
  ConfirmResetBody,
  InvitationView,
  LoginBody,
  UserSummary,
} from '../../../../shared/api/auth.js';

/** The signed-in person's own endpoints: session, password, invitations and reset links. */
@Injectable({ providedIn: 'root' })
export class AuthApi {
  private readonly http = inject(HttpClient);

  /** The current session's user; fails with 401 when nobody is signed in. */
  me(): Observable<UserSummary> {
    return this.http.get<{ user: UserSummary }>('/api/auth/me').pipe(map((answer) => answer.user));
  }

  login(body: LoginBody): Observable<UserSummary> {
    return this.http.post<{ user: UserSummary }>('/api/auth/login', body).pipe(map((answer) => answer.user));
  }

  logout(): Observable<void> {
    return this.http.post<void>('/api/auth/logout', null);
  }

  changePassword(body: ChangePasswordBody): Observable<void> {
    return this.http.post<void>('/api/auth/password', body);
  }

  /** Asks for a reset link; the server answers 202 whether or not the address has an account. */
  requestPasswordReset(email: string): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset', { email });
  }

  confirmPasswordReset(body: ConfirmResetBody): Observable<void> {
    return this.http.post<void>('/api/auth/password-reset/confirm', body);
  }

  invitation(token: string): Observable<InvitationView> {
    return this.http.get<InvitationView>(`/api/invitations/${encodeURIComponent(token)}`);
  }

  acceptInvitation(body: AcceptInvitationBody): Observable<UserSummary> {
    return this.http.post<{ user: UserSummary }>('/api/invitations/accept', body).pipe(map((answer) => answer.user));
  }
}
