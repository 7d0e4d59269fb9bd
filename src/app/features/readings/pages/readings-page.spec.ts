import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { Router, provideRouter, withComponentInputBinding } from '@angular/router';
import { RouterTestingHarness } from '@angular/router/testing';

import { errorInterceptor } from '../../../core/http/error-interceptor';
import { TEST_ACCESSIONS, TEST_CHARACTERS, TEST_SITES } from '../../../shared/testing/collection-fixtures';
import type { ReadingDto } from '../../../../../shared/api/reading-answers.js';
import { ReadingsPage } from './readings-page';

const ROW: ReadingDto = {
  id: 31,
  accessionId: 1,
  accessionNumber: 'HL-0001',
  accessionName: 'Purple Dawn',
  plantId: 11,
  plantLabel: 'P1',
  characterId: 5,
  characterCode: 'petiole.third.upper',
  characterLabel: 'Petiole, upper third',
  siteId: 1,
  siteCode: 'RDP',
  observerId: 4,
  observerName: 'Juno Pellbright',
  observedAt: '2026-03-14T09:30:00.000Z',
  method: 'chip',
  lab: [40, 20, -5],
  lch: [40, 20.6, 346],
  hex: '#7a4c6b',
  inGamut: true,
  bestChip: 'F-150.004',
  deltaE00: 1.23,
  verdict: 'close',
  eyeChipCode: 'F-150.004',
  bestChipName: 'plum L30 C40',
  bestChipHex: '#7a4c6b',
  eyeDeltaE00: 0,
  setId: 'v1',
  season: 'Wet',
  seasonYear: 2026,
  seasonLabel: 'Wet 2026–27',
  plantAgeMonths: 13.8,
  light: 'overcast',
  secondsSinceCut: null,
  leafPosition: null,
  notes: null,
  status: 'submitted',
  supersedesId: null,
  supersededById: null,
  createdAt: '2026-03-14T09:31:00.000Z',
};

describe('ReadingsPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([{ path: 'readings', component: ReadingsPage }], withComponentInputBinding()), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function open(url: string): Promise<{ harness: RouterTestingHarness; el: HTMLElement }> {
    const harness = await RouterTestingHarness.create(url);
    http.expectOne('/api/accessions').flush(TEST_ACCESSIONS);
    http.expectOne('/api/characters').flush(TEST_CHARACTERS);
    http.expectOne('/api/sites').flush(TEST_SITES);
    return { harness, el: harness.routeNativeElement! };
  }

  it('should ask the server for the filters, sort and page in the address', async () => {
    const { harness, el } = await open('/readings?accessionId=1&method=chip&sort=deltaE00&dir=asc&page=2&pageSize=10');
    const request = http.expectOne((r) => r.url === '/api/readings');
    expect(Object.fromEntries(request.request.params.keys().map((k) => [k, request.request.params.get(k)]))).toEqual({
      accessionId: '1',
      method: 'chip',
      sort: 'deltaE00',
      dir: 'asc',
      page: '2',
      pageSize: '10',
    });
    request.flush({ items: [ROW], total: 11 });
    await harness.fixture.whenStable();
    harness.detectChanges();
    expect(el.textContent).toContain('11 readings');
    expect(el.textContent).toContain('F-150.004');
    expect(el.textContent).toContain('1.23');
    expect(el.textContent).toContain('close');
  });

  it('should put a changed filter into the address and start again from the first page', async () => {
    const { harness } = await open('/readings?page=3');
    http.expectOne((r) => r.url === '/api/readings').flush({ items: [ROW], total: 80 });
    const page = harness.routeDebugElement!.componentInstance as unknown as { filter(change: object): void; sortBy(sort: object): void };
    const router = TestBed.inject(Router);
    page.filter({ status: 'flagged' });
    await vi.waitFor(() => expect(router.url).toBe('/readings?status=flagged'));
    http.expectOne((r) => r.url === '/api/readings' && r.params.get('status') === 'flagged').flush({ items: [], total: 0 });
    page.sortBy({ active: 'observer', direction: 'asc' });
    await vi.waitFor(() => expect(router.url).toBe('/readings?status=flagged&sort=observer&dir=asc'));
    http.expectOne((r) => r.url === '/api/readings' && r.params.get('sort') === 'observer').flush({ items: [], total: 0 });
    await harness.fixture.whenStable();
    harness.detectChanges();
    expect(harness.routeNativeElement!.textContent).toContain('No reading matches these filters');
  });
});
