import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { progressInterceptor } from './progress-interceptor';
import { PROGRESS_DELAY_MS, RequestProgress } from './request-progress';

describe('RequestProgress with progressInterceptor', () => {
  let progress: RequestProgress;
  let http: HttpTestingController;
  let client: HttpClient;

  beforeEach(() => {
    vi.useFakeTimers();
    TestBed.configureTestingModule({
      providers: [provideHttpClient(withInterceptors([progressInterceptor])), provideHttpClientTesting()],
    });
    progress = TestBed.inject(RequestProgress);
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  });

  afterEach(() => {
    http.verify();
    vi.useRealTimers();
  });

  it('should count a request while it is in flight', () => {
    client.get('/api/sites').subscribe();
    expect(progress.inFlight()).toBe(1);
    http.expectOne('/api/sites').flush([]);
    expect(progress.inFlight()).toBe(0);
  });

  it('should not show the bar for a quick answer', () => {
    client.get('/api/sites').subscribe();
    vi.advanceTimersByTime(PROGRESS_DELAY_MS - 50);
    expect(progress.visible()).toBe(false);
    http.expectOne('/api/sites').flush([]);
    vi.advanceTimersByTime(100);
    expect(progress.visible()).toBe(false);
  });

  it('should show the bar once a request runs longer than the delay', () => {
    client.get('/api/sites').subscribe();
    vi.advanceTimersByTime(PROGRESS_DELAY_MS + 1);
    expect(progress.visible()).toBe(true);
    http.expectOne('/api/sites').flush([]);
  });

  it('should hide the bar when a slow request fails', () => {
    client.get('/api/sites').subscribe({ error: () => undefined });
    vi.advanceTimersByTime(PROGRESS_DELAY_MS + 1);
    http.expectOne('/api/sites').flush('down', { status: 503, statusText: 'Unavailable' });
    expect(progress.visible()).toBe(false);
  });

  it('should stop counting a cancelled request', () => {
    const subscription = client.get('/api/sites').subscribe();
    const request = http.expectOne('/api/sites');
    subscription.unsubscribe();
    expect(request.cancelled).toBe(true);
    expect(progress.inFlight()).toBe(0);
  });
});
