import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type { ApiTokenRow, IssuedApiToken } from '../../../../../shared/api/api-token-answers.js';

/** The admin's BrAPI token endpoints: list, issue (the answer carries the token once), revoke. */
@Injectable({ providedIn: 'root' })
export class ApiTokensApi {
  private readonly http = inject(HttpClient);

  list(): Observable<ApiTokenRow[]> {
    return this.http.get<ApiTokenRow[]>('/api/api-tokens');
  }

  issue(userId: number, label: string): Observable<IssuedApiToken> {
    return this.http.post<IssuedApiToken>('/api/api-tokens', { userId, label });
  }

  revoke(id: number): Observable<ApiTokenRow> {
    return this.http.post<ApiTokenRow>(`/api/api-tokens/${id}/revoke`, {});
  }
}
