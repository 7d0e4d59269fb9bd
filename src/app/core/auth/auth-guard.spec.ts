import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import { Observable, firstValueFrom } from 'rxjs';

import type { UserSummary } from '../../../../shared/api/auth.js';
import { errorInterceptor } from '../http/error-interceptor';
import { authGuard } from './auth-guard';

const recorder: UserSummary = { id: 4, email: 'rec@demo.test', name: 'Rowan Field', role: 'recorder' };
const notSignedIn = { type: 'about:blank', title: 'Not signed in', status: 401 };

describe('authGuard', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function guard(url: string): Promise<boolean | UrlTree> {
    const state = { url } as RouterStateSnapshot;
    const result = TestBed.runInInjectionContext(() => authGuard({} as ActivatedRouteSnapshot, state));
    return firstValueFrom(result as Observable<boolean | UrlTree>);
  }

  it('should let a signed-in person through', async () => {
    const decision = guard('/collection');
    http.expectOne('/api/auth/me').flush({ user: recorder });
    expect(await decision).toBe(true);
  });

  it('should send a signed-out person to sign-in with the page as returnUrl', async () => {
    const decision = guard('/admin/users?page=2');
    http.expectOne('/api/auth/me').flush(notSignedIn, { status: 401, statusText: 'Unauthorized' });
    const tree = (await decision) as UrlTree;
    expect(TestBed.inject(Router).serializeUrl(tree)).toBe('/sign-in?returnUrl=%2Fadmin%2Fusers%3Fpage%3D2');
  });

  it('should send to sign-in when the server cannot be reached', async () => {
    const decision = guard('/collection');
    http.expectOne('/api/auth/me').error(new ProgressEvent('error'));
    const tree = (await decision) as UrlTree;
    expect(TestBed.inject(Router).serializeUrl(tree)).toBe('/sign-in?returnUrl=%2Fcollection');
  });

  it('should ask the server only once for two guarded navigations', async () => {
    const first = guard('/collection');
    http.expectOne('/api/auth/me').flush({ user: recorder });
    await first;
    expect(await guard('/account')).toBe(true);
    http.expectNone('/api/auth/me');
  });
});
