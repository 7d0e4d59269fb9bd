import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { NotificationList } from '../../../../shared/api/review-answers.js';
import { NotificationsApi } from './notifications-api';

describe('NotificationsApi', () => {
  let api: NotificationsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(NotificationsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should list the signed-in person’s notices', () => {
    let list: NotificationList | null = null;
    api.list().subscribe((l) => (list = l));
    const request = http.expectOne('/api/notifications');
    expect(request.request.method).toBe('GET');
    request.flush({ items: [], unread: 0 });
    expect(list).toEqual({ items: [], unread: 0 });
  });

  it('should mark one notice read with a POST to its read route', () => {
    let done = false;
    api.markRead(8).subscribe({ complete: () => (done = true) });
    const request = http.expectOne('/api/notifications/8/read');
    expect(request.request.method).toBe('POST');
    request.flush(null, { status: 204, statusText: 'No Content' });
    expect(done).toBe(true);
  });
});
