import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { ReadingList } from '../../../../../shared/api/reading-answers.js';
import type { ReviewAnswer, ReviewDto, ReviewQueueQuery, ReviewRequest } from '../../../../../shared/api/review-answers.js';

/** A queue query as HTTP parameters: empty and unset filters are left out. */
export function queueParams(query: ReviewQueueQuery): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '' || value === false) continue;
    params = params.set(key, String(value));
  }
  return params;
}

/** The reviewers' routes: the queue of readings to review, a decision on one, and a reading's reviews. */
@Injectable({ providedIn: 'root' })
export class ReviewsApi {
  private readonly http = inject(HttpClient);

  /** One server page of the queue (status submitted unless the query asks for another). */
  queue(query: ReviewQueueQuery): Observable<ReadingList> {
    return this.http.get<ReadingList>('/api/reviews/queue', { params: queueParams(query) });
  }

  /** Approves, flags (comment required) or asks for a re-read (comment required) of reading `id`. */
  review(id: number, body: ReviewRequest): Observable<ReviewAnswer> {
    return this.http.post<ReviewAnswer>(`/api/readings/${id}/review`, body);
  }

  /** Approves every reading named in one request, all or nothing. */
  approveAll(ids: readonly number[]): Observable<{ approved: number }> {
    return this.http.post<{ approved: number }>('/api/reviews/approve', { ids });
  }

  /** Every review of a reading, oldest first. */
  reviewsOf(id: number): Observable<ReviewDto[]> {
    return this.http.get<ReviewDto[]>(`/api/readings/${id}/reviews`);
  }
}
