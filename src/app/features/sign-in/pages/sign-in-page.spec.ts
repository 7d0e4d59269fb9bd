import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { Router, provideRouter } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { SignInPage } from './sign-in-page';

describe('SignInPage', () => {
  let fixture: ComponentFixture<SignInPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(SignInPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  async function submit(email: string, password: string): Promise<void> {
    const [emailInput, passwordInput] = Array.from(element.querySelectorAll('input'));
    emailInput.value = email;
    emailInput.dispatchEvent(new Event('input'));
    passwordInput.value = password;
    passwordInput.dispatchEvent(new Event('input'));
    element.querySelector('form')?.dispatchEvent(new Event('submit'));
    await fixture.whenStable();
  }

  it('should say the credentials do not match on a 401', async () => {
    await submit('rec@demo.test', 'not-it');
    http.expectOne('/api/auth/login').flush({ title: 'Wrong e-mail or password', status: 401 }, { status: 401, statusText: 'Unauthorized' });
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('do not match an active account');
  });

  it('should say to wait after too many attempts', async () => {
    await submit('rec@demo.test', 'not-it');
    http.expectOne('/api/auth/login').flush({ title: 'Too many attempts', status: 429 }, { status: 429, statusText: 'Too Many Requests' });
    await fixture.whenStable();
    expect(element.querySelector('[role="alert"]')?.textContent).toContain('Wait a few minutes');
  });

  it('should not send the form without a password', async () => {
    await submit('rec@demo.test', '');
    http.expectNone('/api/auth/login');
    expect(element.textContent).toContain('Enter your password.');
  });

  it('should not send the form without an e-mail address, and say so', async () => {
    await submit('', 'demo-pass-2026');
    http.expectNone('/api/auth/login');
    expect(element.textContent).toContain('Enter your e-mail address.');
  });

  it('should not send the form with something that is not an e-mail address, and say so', async () => {
    await submit('not-an-address', 'demo-pass-2026');
    http.expectNone('/api/auth/login');
    expect(element.textContent).toContain('That is not an e-mail address.');
  });

  it('should go to the returnUrl after signing in', async () => {
    const navigate = vi.spyOn(TestBed.inject(Router), 'navigateByUrl').mockResolvedValue(true);
    fixture.componentRef.setInput('returnUrl', '/admin/users');
    await submit('admin@demo.test', 'demo-pass-2026');
    http.expectOne('/api/auth/login').flush({ user: { id: 1, email: 'admin@demo.test', name: 'Demo Admin', role: 'admin' } });
    await fixture.whenStable();
    expect(navigate).toHaveBeenCalledWith('/admin/users');
    expect(TestBed.inject(AuthStore).role()).toBe('admin');
  });

  it('should show the typed password while the eye button is pressed, and hide it again', async () => {
    const password = element.querySelector<HTMLInputElement>('input[autocomplete="current-password"]')!;
    const eye = element.querySelector<HTMLButtonElement>('hl-password-visibility button')!;
    expect([password.type, eye.getAttribute('aria-label'), eye.getAttribute('aria-pressed')]).toEqual(['password', 'Show password', 'false']);
    eye.click();
    await fixture.whenStable();
    expect([password.type, eye.getAttribute('aria-label'), eye.getAttribute('aria-pressed')]).toEqual(['text', 'Hide password', 'true']);
    eye.click();
    await fixture.whenStable();
    expect(password.type).toBe('password');
  });
});
