import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type {
  AuditEventRow,
  InvitationRow,
  InviteBody,
  OutboxMessage,
  Page,
  UpdateUserBody,
  UserRow,
} from '../../../../../shared/api/auth.js';

/** The audit trail's filters: who (part of a name or e-mail), what (an action family such as "reading"), when (days). */
export interface AuditFilters {
  who?: string;
  action?: string;
  from?: string;
  to?: string;
}

/** The admin's endpoints: people, invitations, the caught-mail outbox and the audit trail. */
@Injectable({ providedIn: 'root' })
export class AdminApi {
  private readonly http = inject(HttpClient);

  users(): Observable<UserRow[]> {
    return this.http.get<UserRow[]>('/api/users');
  }

  updateUser(id: number, changes: UpdateUserBody): Observable<UserRow> {
    return this.http.patch<UserRow>(`/api/users/${id}`, changes);
  }

  invitations(): Observable<InvitationRow[]> {
    return this.http.get<InvitationRow[]>('/api/invitations');
  }

  /** Creates an invitation; the server mails the link. */
  invite(body: InviteBody): Observable<InvitationRow> {
    return this.http.post<InvitationRow>('/api/invitations', body);
  }

  /** Mails caught by the built-in test mail server, newest first. */
  outbox(): Observable<OutboxMessage[]> {
    return this.http.get<OutboxMessage[]>('/api/outbox');
  }

  /** One page of the audit trail, newest first; `page` counts from 1; empty filters are left out. */
  audit(page: number, pageSize: number, filters: AuditFilters = {}): Observable<Page<AuditEventRow>> {
    let params = new HttpParams().set('page', page).set('pageSize', pageSize);
    for (const [key, value] of Object.entries(filters)) if (value) params = params.set(key, value);
    return this.http.get<Page<AuditEventRow>>('/api/audit', { params });
  }
}
