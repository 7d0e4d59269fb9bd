import { HttpClient, provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { Component } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';
import { firstValueFrom } from 'rxjs';

import { AuthStore } from '../auth/auth-store';
import { ApiError } from './api-error';
import { errorInterceptor } from './error-interceptor';

@Component({ template: 'page' })
class Page {}

describe('errorInterceptor', () => {
  let http: HttpTestingController;
  let client: HttpClient;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([
          { path: 'admin/users', component: Page },
          { path: 'sign-in', component: Page },
        ]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
      ],
    });
    http = TestBed.inject(HttpTestingController);
    client = TestBed.inject(HttpClient);
  });

  afterEach(() => http.verify());

  async function failure(url: string, body: string | object, status: number, statusText = 'Error'): Promise<unknown> {
    const answer = firstValueFrom(client.get(url));
    http.expectOne(url).flush(body, { status, statusText, headers: { 'Content-Type': 'application/problem+json' } });
    return answer.then(
      () => expect.fail('the request should fail'),
      (error: unknown) => error,
    );
  }

  it('should turn a problem document into an ApiError with its field errors', async () => {
    const problem = {
      type: 'https://hueledger.example/problems/validation',
      title: 'Some fields are not valid',
      status: 400,
      detail: 'Check the marked fields.',
      errors: [{ field: 'email', message: 'must be an e-mail address' }],
    };
    const error = (await failure('/api/users', problem, 400)) as ApiError;
    expect(error).toBeInstanceOf(ApiError);
    expect(error.status).toBe(400);
    expect(error.title).toBe('Some fields are not valid');
    expect(error.detail).toBe('Check the marked fields.');
    expect(error.fieldErrors).toEqual([{ field: 'email', message: 'must be an e-mail address' }]);
    expect(error.messageFor('email')).toBe('must be an e-mail address');
  });

  it('should read a problem document that arrives as text', async () => {
    const error = (await failure('/api/sites', JSON.stringify({ title: 'Site is locked', status: 409 }), 409)) as ApiError;
    expect(error.title).toBe('Site is locked');
  });

  it('should give a readable title when the body is not a problem document', async () => {
    const error = (await failure('/api/sites', '<html>Bad gateway</html>', 502, 'Bad Gateway')) as ApiError;
    expect(error.status).toBe(502);
    expect(error.title).toBe('The server answered 502 Bad Gateway');
  });

  it('should say the server cannot be reached on a network failure', async () => {
    const answer = firstValueFrom(client.get('/api/sites'));
    http.expectOne('/api/sites').error(new ProgressEvent('error'));
    const error = await answer.catch((e: unknown) => e);
    expect((error as ApiError).status).toBe(0);
    expect((error as ApiError).title).toMatch(/cannot be reached/);
  });

  it('should send to sign-in with the current page when a session ends', async () => {
    await RouterTestingHarness.create('/admin/users');
    const router = TestBed.inject(Router);
    const navigate = vi.spyOn(router, 'navigate').mockResolvedValue(true);
    await failure('/api/users', { title: 'Not signed in', status: 401 }, 401, 'Unauthorized');
    expect(navigate).toHaveBeenCalledWith(['/sign-in'], { queryParams: { returnUrl: '/admin/users' } });
  });

  it('should forget the signed-in person when a session ends', async () => {
    const store = TestBed.inject(AuthStore);
    const forget = vi.spyOn(store, 'forget');
    await failure('/api/accessions', { title: 'Not signed in', status: 401 }, 401, 'Unauthorized');
    expect(forget).toHaveBeenCalled();
  });

  it('should not leave the page on a 401 for wrong credentials', async () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigate');
    const answer = firstValueFrom(client.post('/api/auth/login', { email: 'a@b.test', password: 'x' }));
    http.expectOne('/api/auth/login').flush({ title: 'Wrong e-mail or password', status: 401 }, { status: 401, statusText: 'Unauthorized' });
    const error = await answer.catch((e: unknown) => e);
    expect((error as ApiError).status).toBe(401);
    expect(navigate).not.toHaveBeenCalled();
  });
});
