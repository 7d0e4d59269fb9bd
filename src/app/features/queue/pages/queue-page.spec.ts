import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';
import { of } from 'rxjs';

import { AuthStore } from '../../../core/auth/auth-store';
import { IS_ONLINE, QUEUE_TRANSPORT } from '../../../core/offline/offline-queue';
import { MemoryQueueStorage, QUEUE_STORAGE } from '../../../core/offline/queue-storage';
import { pendingReading, ScriptedTransport } from '../../../core/offline/testing/queue-fakes';
import { QueuePage } from './queue-page';

const recorder = { id: 7, email: 'ana@demo.test', name: 'Ana Field', role: 'recorder' as const };

describe('QueuePage', () => {
  let storage: MemoryQueueStorage;
  let transport: ScriptedTransport;

  async function render(): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(),
        provideHttpClientTesting(),
        { provide: QUEUE_STORAGE, useValue: storage },
        { provide: QUEUE_TRANSPORT, useValue: transport },
        { provide: IS_ONLINE, useValue: () => true },
        { provide: AuthStore, useValue: { currentUser: signal(recorder), load: () => of(recorder) } },
      ],
    });
    const fixture = TestBed.createComponent(QueuePage);
    const http = TestBed.inject(HttpTestingController);
    fixture.detectChanges();
    http.expectOne('/api/accessions').flush([]);
    http.expectOne('/api/characters').flush([]);
    await settle();
    await fixture.whenStable();
    return fixture.nativeElement as HTMLElement;
  }

  const settle = () => new Promise((r) => setTimeout(r, 0));

  beforeEach(() => {
    storage = new MemoryQueueStorage();
    transport = new ScriptedTransport();
  });

  it('should list each waiting reading as a card with its swatch code and state in words', async () => {
    await storage.putReading(pendingReading({ summary: { ...pendingReading().summary, code: 'F-087.014' } }));
    await storage.putReading(pendingReading({ createdAt: '2026-03-01T11:00:00.000Z' }));
    const element = await render();
    expect(element.querySelector('.summary')?.textContent).toContain('2 readings waiting to send');
    const cards = element.querySelectorAll('hl-queued-reading');
    expect(cards.length).toBe(2);
    expect(cards[0]!.textContent).toContain('HL-0917 Dusk Purple');
    expect(cards[0]!.textContent).toContain('F-087.014');
    expect(cards[0]!.textContent).toContain('Waiting to send');
    expect(element.querySelector('button.send')?.textContent).toContain('Send now');
  });

  it('should show the server words of a refused reading and offer to change it', async () => {
    await storage.putReading(pendingReading({ state: 'needs-attention', lastError: { status: 400, title: 'Bad request', detail: 'No accession 3: it may have been renamed.', fieldErrors: [{ field: 'accessionId', message: 'no such accession' }] } }));
    const element = await render();
    const card = element.querySelector('hl-queued-reading')!;
    expect(card.textContent).toContain('Needs your attention');
    expect(card.textContent).toContain('No accession 3: it may have been renamed.');
    expect(card.textContent).toContain('Accession: no such accession');
    expect(Array.from(card.querySelectorAll('button')).map((b) => b.textContent?.trim())).toContain('editChange and send again');
  });

  it('should mark a colour from the phone preview of a photo as provisional', async () => {
    const r = pendingReading();
    await storage.putReading({ ...r, summary: { ...r.summary, provisional: true, method: 'Photo region' } });
    const element = await render();
    expect(element.querySelector('.provisional')?.textContent).toContain('Provisional colour');
  });

  it('should say that nothing waits when the queue is empty', async () => {
    const element = await render();
    expect(element.querySelector('.empty')?.textContent).toContain('Nothing waiting');
    expect(element.querySelector('button.send')).toBeNull();
  });
});
