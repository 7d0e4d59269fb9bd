import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { Component } from '@angular/core';

import type { NotificationDto } from '../../../../shared/api/review-answers.js';
import { NOTIFICATION_POLL_MS, NotificationFeed } from './notification-feed';

@Component({ template: '' })
class Blank {}

function notice(id: number, readAt: string | null = null): NotificationDto {
  return { id, kind: 'reread-requested', readingId: 40 + id, sessionId: null, message: 'Please read it again in open shade.', createdAt: '2026-03-01T10:00:00Z', readAt };
}

describe('NotificationFeed', () => {
  let feed: NotificationFeed;
  let http: HttpTestingController;

  beforeEach(() => {
    vi.useFakeTimers();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting(), provideRouter([{ path: 'x', component: Blank }])] });
    feed = TestBed.inject(NotificationFeed);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    feed.stop();
    http.verify();
    vi.useRealTimers();
  });

  it('should ask at once and then every minute', () => {
    feed.start();
    vi.advanceTimersByTime(0);
    http.expectOne('/api/notifications').flush({ items: [notice(1)], unread: 1 });
    expect(feed.unread()).toBe(1);
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS - 1);
    http.expectNone('/api/notifications');
    vi.advanceTimersByTime(1);
    http.expectOne('/api/notifications').flush({ items: [notice(1), notice(2)], unread: 2 });
    expect(feed.unread()).toBe(2);
  });

  it('should ask again after a navigation', async () => {
    feed.start();
    vi.advanceTimersByTime(0);
    http.expectOne('/api/notifications').flush({ items: [], unread: 0 });
    const navigated = TestBed.inject(Router).navigateByUrl('/x');
    await vi.advanceTimersByTimeAsync(10);
    expect(await navigated).toBe(true);
    // Well before the next minute's poll: this request is the navigation's.
    http.expectOne('/api/notifications').flush({ items: [notice(3)], unread: 1 });
    expect(feed.unread()).toBe(1);
  });

  it('should keep the last list when a poll fails', () => {
    feed.start();
    vi.advanceTimersByTime(0);
    http.expectOne('/api/notifications').flush({ items: [notice(1)], unread: 1 });
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS);
    http.expectOne('/api/notifications').flush(null, { status: 500, statusText: 'Server Error' });
    expect(feed.unread()).toBe(1);
    vi.advanceTimersByTime(NOTIFICATION_POLL_MS);
    http.expectOne('/api/notifications').flush({ items: [], unread: 0 });
    expect(feed.unread()).toBe(0);
  });

  it('should count a notice read at once and tell the server', () => {
    feed.start();
    vi.advanceTimersByTime(0);
    http.expectOne('/api/notifications').flush({ items: [notice(1), notice(2)], unread: 2 });
    feed.markRead(2);
    expect(feed.unread()).toBe(1);
    expect(feed.items().find((n) => n.id === 2)!.readAt).not.toBeNull();
    http.expectOne('/api/notifications/2/read').flush(null, { status: 204, statusText: 'No Content' });
    http.expectOne('/api/notifications').flush({ items: [notice(1), notice(2, '2026-03-01T11:00:00Z')], unread: 1 });
    feed.markRead(2);
    http.expectNone('/api/notifications/2/read');
  });
});
