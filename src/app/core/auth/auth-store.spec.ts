import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { UserSummary } from '../../../../shared/api/auth.js';
import { ApiError } from '../http/api-error';
import { errorInterceptor } from '../http/error-interceptor';
import { AuthStore } from './auth-store';

const reviewer: UserSummary = { id: 3, email: 'rev@demo.test', name: 'Wren Ledger', role: 'reviewer' };
const unauthorized = { status: 401, statusText: 'Unauthorized' };

describe('AuthStore', () => {
  let store: AuthStore;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    store = TestBed.inject(AuthStore);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should remember the person the session belongs to', async () => {
    const loaded = firstValueFrom(store.load());
    http.expectOne('/api/auth/me').flush({ user: reviewer });
    expect(await loaded).toEqual(reviewer);
    expect(store.role()).toBe('reviewer');
  });

  it('should treat a 401 from /api/auth/me as nobody signed in', async () => {
    const loaded = firstValueFrom(store.load());
    http.expectOne('/api/auth/me').flush({ title: 'Not signed in', status: 401 }, unauthorized);
    expect(await loaded).toBeNull();
    expect(store.signedIn()).toBe(false);
  });

  it('should pass on a server failure and ask again next time', async () => {
    const failed = firstValueFrom(store.load());
    http.expectOne('/api/auth/me').flush({ title: 'Database unavailable', status: 503 }, { status: 503, statusText: 'Unavailable' });
    await expect(failed).rejects.toBeInstanceOf(ApiError);
    const retried = firstValueFrom(store.load());
    http.expectOne('/api/auth/me').flush({ user: reviewer });
    expect(await retried).toEqual(reviewer);
  });

  it('should sign in with the e-mail and password given', async () => {
    const signedIn = firstValueFrom(store.signIn('rev@demo.test', 'demo-pass-2026'));
    const request = http.expectOne('/api/auth/login');
    expect(request.request.body).toEqual({ email: 'rev@demo.test', password: 'demo-pass-2026' });
    request.flush({ user: reviewer });
    await signedIn;
    expect(store.currentUser()).toEqual(reviewer);
  });

  it('should not ask the server again after signing in', async () => {
    const signedIn = firstValueFrom(store.signIn('rev@demo.test', 'demo-pass-2026'));
    http.expectOne('/api/auth/login').flush({ user: reviewer });
    await signedIn;
    expect(await firstValueFrom(store.load())).toEqual(reviewer);
    http.expectNone('/api/auth/me');
  });

  it('should keep nobody signed in after a refused sign-in', async () => {
    const signedIn = firstValueFrom(store.signIn('rev@demo.test', 'wrong'));
    http.expectOne('/api/auth/login').flush({ title: 'Wrong e-mail or password', status: 401 }, unauthorized);
    await expect(signedIn).rejects.toMatchObject({ status: 401 });
    expect(store.signedIn()).toBe(false);
  });

  it('should forget the person on sign-out', async () => {
    const signedIn = firstValueFrom(store.signIn('rev@demo.test', 'demo-pass-2026'));
    http.expectOne('/api/auth/login').flush({ user: reviewer });
    await signedIn;
    const signedOut = firstValueFrom(store.signOut(), { defaultValue: undefined });
    http.expectOne('/api/auth/logout').flush(null, { status: 204, statusText: 'No Content' });
    await signedOut;
    expect(store.currentUser()).toBeNull();
  });

  it('should forget the person on sign-out even when the session had already ended', async () => {
    const signedIn = firstValueFrom(store.signIn('rev@demo.test', 'demo-pass-2026'));
    http.expectOne('/api/auth/login').flush({ user: reviewer });
    await signedIn;
    const signedOut = firstValueFrom(store.signOut(), { defaultValue: undefined });
    http.expectOne('/api/auth/logout').flush({ title: 'Not signed in', status: 401 }, unauthorized);
    await signedOut;
    expect(store.signedIn()).toBe(false);
  });
});
