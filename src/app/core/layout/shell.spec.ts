import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { firstValueFrom } from 'rxjs';

import type { Role } from '../../../../shared/api/auth.js';
import { AuthStore } from '../auth/auth-store';
import { OfflineQueue } from '../offline/offline-queue';
import { MemoryQueueStorage, QUEUE_STORAGE } from '../offline/queue-storage';
import { pendingReading } from '../offline/testing/queue-fakes';
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
    expect(navLabels(element)).toEqual(['Record', 'Waiting to send', 'Readings', 'Drift', 'Collection', 'Calibration', 'Reference set', 'Account']);
  });

  it('should show the unread notification count on the toolbar bell, linking to the notifications', async () => {
    const element = await renderFor('recorder');
    // The bell asks at once on a timer: let it fire before answering.
    await new Promise((r) => setTimeout(r));
    TestBed.inject(HttpTestingController)
      .match('/api/notifications')
      .forEach((r) => r.flush({ items: [], unread: 3 }));
    await new Promise((r) => setTimeout(r));
    TestBed.tick();
    const bell = element.querySelector('mat-toolbar hl-notification-bell a') as HTMLAnchorElement;
    expect(bell.getAttribute('href')).toBe('/notifications');
    expect(bell.getAttribute('aria-label')).toBe('Notifications: 3 unread');
    expect(bell.textContent).toContain('3');
  });

  it('should show how many readings wait to send in the toolbar, linking to the queue', async () => {
    const storage = new MemoryQueueStorage();
    await storage.putReading(pendingReading());
    await storage.putReading(pendingReading());
    TestBed.overrideProvider(QUEUE_STORAGE, { useValue: storage });
    const element = await renderFor('recorder');
    expect(element.querySelector('hl-queue-indicator a')).toBeNull();
    await TestBed.inject(OfflineQueue).refresh();
    await new Promise((r) => setTimeout(r));
    TestBed.tick();
    const link = element.querySelector('hl-queue-indicator a') as HTMLAnchorElement;
    expect(link.getAttribute('href')).toBe('/queue');
    expect(link.textContent?.trim()).toContain('2 readings waiting to send');
  });
});
