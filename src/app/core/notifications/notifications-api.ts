import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { NotificationList } from '../../../../shared/api/review-answers.js';

/** The signed-in person's own notices: list them, mark one read. */
@Injectable({ providedIn: 'root' })
export class NotificationsApi {
  private readonly http = inject(HttpClient);

  /** Every notice, newest first, with how many are unread. */
  list(): Observable<NotificationList> {
    return this.http.get<NotificationList>('/api/notifications');
  }

  /** Marks notice `id` read (the server answers 204). */
  markRead(id: number): Observable<void> {
    return this.http.post<void>(`/api/notifications/${id}/read`, null);
  }
}
