import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { Role } from '../../../../shared/api/auth.js';
import { AuthStore } from '../auth/auth-store';
import { Shell } from './shell';

describe('Shell', () => {
  async function renderFor(role: Role): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()],
    });
    const signedIn = firstValueFrom(TestBed.inject(AuthStore).signIn(`${role}@demo.test`, 'demo-pass-2026'));
    TestBed.inject(HttpTestingController)
      .expectOne('/api/auth/login')
      .flush({ user: { id: 1, email: `${role}@demo.test`, name: 'Ash Meadow', role } });
    await signedIn;
    const fixture = TestBed.createComponent(Shell);
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const navLabels = (element: HTMLElement) =>
    Array.from(element.querySelectorAll('mat-nav-list [matListItemTitle]')).map((title) => title.textContent?.trim());

  it('should show the signed-in person’s name and role', async () => {
    const element = await renderFor('reviewer');
    const toolbar = element.querySelector('mat-toolbar')?.textContent;
    expect(toolbar).toContain('Ash Meadow');
    expect(toolbar).toContain('reviewer');
  });

  it('should list the admin pages for an admin', async () => {
    const element = await renderFor('admin');
    expect(navLabels(element)).toEqual(expect.arrayContaining(['Users', 'Outbox', 'Audit']));
  });

  it('should not list the admin pages for a recorder', async () => {
    const element = await renderFor('recorder');
    expect(navLabels(element)).toEqual(['Record', 'Collection', 'Reference set', 'Account']);
  });
});
