import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { firstValueFrom } from 'rxjs';

import type { UserSummary } from '../../../../shared/api/auth.js';
import { offlineSessionInterceptor } from './offline-session';

const recorder: UserSummary = { id: 7, email: 'ana@demo.test', name: 'Ana Field', role: 'recorder' };

describe('offlineSessionInterceptor', () => {
  let client: HttpClient;
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([offlineSessionInterceptor])), provideHttpClientTesting()] });
    client = TestBed.inject(HttpClient);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  const me = () => firstValueFrom(client.get<{ user: UserSummary }>('/api/auth/me'));

  it('should answer the last signed-in person when the server cannot be reached', async () => {
    const first = me();
    http.expectOne('/api/auth/me').flush({ user: recorder });
    await first;
    const offline = me();
    http.expectOne('/api/auth/me').flush(null, { status: 504, statusText: 'Gateway Timeout' });
    expect((await offline).user).toEqual(recorder);
  });

  it('should pass the failure on when nobody was signed in here before', async () => {
    const offline = me();
    http.expectOne('/api/auth/me').error(new ProgressEvent('error'));
    await expect(offline).rejects.toEqual(expect.objectContaining({ status: 0 }));
  });

  it('should forget the person on a 401 and on sign-out', async () => {
    const first = me();
    http.expectOne('/api/auth/me').flush({ user: recorder });
    await first;
    const out = firstValueFrom(client.post('/api/auth/logout', null));
    http.expectOne('/api/auth/logout').flush(null);
    await out;
    const offline = me();
    http.expectOne('/api/auth/me').flush(null, { status: 504, statusText: 'Gateway Timeout' });
    await expect(offline).rejects.toEqual(expect.objectContaining({ status: 504 }));
  });

  it('should not make up an answer when the server itself refuses with a problem', async () => {
    const first = me();
    http.expectOne('/api/auth/me').flush({ user: recorder });
    await first;
    const refused = me();
    http.expectOne('/api/auth/me').flush({ title: 'Gateway', status: 504 }, { status: 504, statusText: 'Gateway Timeout' });
    await expect(refused).rejects.toEqual(expect.objectContaining({ status: 504 }));
  });
});
