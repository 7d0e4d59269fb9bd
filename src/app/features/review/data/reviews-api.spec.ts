import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { ReviewAnswer } from '../../../../../shared/api/review-answers.js';
import { ReviewsApi } from './reviews-api';

describe('ReviewsApi', () => {
  let api: ReviewsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ReviewsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should ask for the queue with only the filters that are set', () => {
    let total = -1;
    api.queue({ accessionId: 2, observerId: 5, status: undefined, from: '2025-01-01', to: '', page: 3, pageSize: 10 }).subscribe((list) => (total = list.total));
    const request = http.expectOne((r) => r.url === '/api/reviews/queue');
    expect(request.request.method).toBe('GET');
    expect(request.request.params.keys().sort()).toEqual(['accessionId', 'from', 'observerId', 'page', 'pageSize']);
    expect(request.request.params.get('from')).toBe('2025-01-01');
    request.flush({ items: [], total: 12 });
    expect(total).toBe(12);
  });

  it('should post a decision with its comment to the reading’s review route', () => {
    let answer: ReviewAnswer | null = null;
    api.review(17, { decision: 'flag', comment: 'Read in direct sun' }).subscribe((a) => (answer = a));
    const request = http.expectOne('/api/readings/17/review');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ decision: 'flag', comment: 'Read in direct sun' });
    request.flush({ review: { id: 1 }, reading: { id: 17, status: 'flagged' }, mailed: true });
    expect(answer!.mailed).toBe(true);
  });

  it('should read a reading’s reviews', () => {
    api.reviewsOf(17).subscribe();
    const request = http.expectOne('/api/readings/17/reviews');
    expect(request.request.method).toBe('GET');
    request.flush([]);
  });
});
