import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { ActivatedRouteSnapshot, Router, RouterStateSnapshot, UrlTree, provideRouter } from '@angular/router';
import { Observable, firstValueFrom } from 'rxjs';

import type { Role, UserSummary } from '../../../../shared/api/auth.js';
import { errorInterceptor } from '../http/error-interceptor';
import { roleGuard } from './role-guard';

function person(role: Role): UserSummary {
  return { id: 1, email: `${role}@demo.test`, name: `Demo ${role}`, role };
}

describe('roleGuard', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function decide(roles: Role[], url: string): Promise<boolean | UrlTree> {
    const state = { url } as RouterStateSnapshot;
    const result = TestBed.runInInjectionContext(() => roleGuard(...roles)({} as ActivatedRouteSnapshot, state));
    return firstValueFrom(result as Observable<boolean | UrlTree>);
  }

  it('should let an allowed role through', async () => {
    const decision = decide(['admin'], '/admin/users');
    http.expectOne('/api/auth/me').flush({ user: person('admin') });
    expect(await decision).toBe(true);
  });

  it('should let any one of several allowed roles through', async () => {
    const decision = decide(['reviewer', 'trainer'], '/somewhere');
    http.expectOne('/api/auth/me').flush({ user: person('trainer') });
    expect(await decision).toBe(true);
  });

  it('should send a refused role home', async () => {
    const decision = decide(['admin'], '/admin/users');
    http.expectOne('/api/auth/me').flush({ user: person('recorder') });
    const tree = (await decision) as UrlTree;
    expect(TestBed.inject(Router).serializeUrl(tree)).toBe('/');
  });

  it('should send a signed-out person to sign-in with the returnUrl', async () => {
    const decision = decide(['admin'], '/admin/audit');
    http.expectOne('/api/auth/me').flush({ title: 'Not signed in', status: 401 }, { status: 401, statusText: 'Unauthorized' });
    const tree = (await decision) as UrlTree;
    expect(TestBed.inject(Router).serializeUrl(tree)).toBe('/sign-in?returnUrl=%2Fadmin%2Faudit');
  });
});
