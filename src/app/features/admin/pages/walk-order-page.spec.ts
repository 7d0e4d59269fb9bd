import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed, type ComponentFixture } from '@angular/core/testing';

import type { WalkEntry } from '../../../../../shared/api/plant-sheet-answers.js';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { WalkOrderPage, moveEntry } from './walk-order-page';

const entry = (kind: WalkEntry['kind'], id: number, label: string, sortOrder: number): WalkEntry => ({ kind, id, code: label.toLowerCase().replace(/\W+/g, '.'), label, sortOrder, active: true, characterId: null });
const WALK: WalkEntry[] = [entry('character', 1, 'Leaf blade, upper surface', 10), entry('character', 2, 'Petiole, upper third', 20), entry('descriptor', 7, 'Petiole length', 30)];

describe('WalkOrderPage', () => {
  let http: HttpTestingController;
  let fixture: ComponentFixture<WalkOrderPage>;
  let el: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(WalkOrderPage);
    el = fixture.nativeElement as HTMLElement;
    document.body.appendChild(el);
    http.expectOne('/api/catalogue/order').flush(WALK);
    await fixture.whenStable();
  });
  afterEach(() => {
    el.remove();
    http.verify();
  });

  const labels = () => [...el.querySelectorAll('.entry .label')].map((l) => l.textContent?.trim());
  const button = (name: string) => el.querySelector<HTMLButtonElement>(`button[aria-label="${name}"]`)!;

  it('should move a row with its up and down buttons, keep the keyboard on it, and save the whole order', async () => {
    expect(labels()).toEqual(['Leaf blade, upper surface', 'Petiole, upper third', 'Petiole length']);
    expect(button('Move Leaf blade, upper surface up').disabled).toBe(true);
    expect(button('Move Petiole length down').disabled).toBe(true);
    button('Move Petiole length up').click();
    await fixture.whenStable();
    expect(labels()).toEqual(['Leaf blade, upper surface', 'Petiole length', 'Petiole, upper third']);
    expect(document.activeElement).toBe(button('Move Petiole length up'));
    // Up again reaches the top: the up arrow is then disabled, so the keyboard goes to its down arrow.
    button('Move Petiole length up').click();
    await fixture.whenStable();
    expect(labels()[0]).toBe('Petiole length');
    expect(document.activeElement).toBe(button('Move Petiole length down'));

    const save = [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('Save walk order'))!;
    save.click();
    const put = http.expectOne((r) => r.method === 'PUT' && r.url === '/api/catalogue/order');
    expect(put.request.body).toEqual({ items: [{ kind: 'descriptor', id: 7 }, { kind: 'character', id: 1 }, { kind: 'character', id: 2 }] });
    put.flush([WALK[2], WALK[0], WALK[1]]);
    await fixture.whenStable();
    expect(el.textContent).toContain('No changes to save');
  });

  it('should say nothing was saved when the server refuses, keeping the moves', async () => {
    button('Move Leaf blade, upper surface down').click();
    await fixture.whenStable();
    [...el.querySelectorAll('button')].find((b) => b.textContent?.includes('Save walk order'))!.click();
    http
      .expectOne('/api/catalogue/order')
      .flush(
        { type: 'about:blank', title: 'Invalid request', status: 400, detail: 'items must list the catalogue' },
        { status: 400, statusText: 'Bad Request', headers: { 'Content-Type': 'application/problem+json' } },
      );
    await fixture.whenStable();
    expect(el.querySelector('[role=alert]')?.textContent).toContain('Nothing was saved.');
    expect(labels()[0]).toBe('Petiole, upper third');
  });
});

describe('moveEntry', () => {
  it('should swap with the neighbour and leave the ends alone', () => {
    expect(moveEntry(['a', 'b', 'c'], 2, -1)).toEqual(['a', 'c', 'b']);
    expect(moveEntry(['a', 'b', 'c'], 0, -1)).toEqual(['a', 'b', 'c']);
    expect(moveEntry(['a', 'b', 'c'], 2, 1)).toEqual(['a', 'b', 'c']);
  });
});
