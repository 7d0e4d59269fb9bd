import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { PhotoSample, RegionCluster } from '../../../../../shared/api/photo-answers.js';
import type { CreateReadingsRequest, ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import type { Region } from '../../../../../shared/photo/region.js';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { IS_ONLINE } from '../../../core/offline/offline-queue';
import { TEST_ACCESSIONS, TEST_CHARACTERS } from '../../../shared/testing/collection-fixtures';
import { READING_DRAFT_KEY } from '../data/reading-memory';
import { ClusterReadings } from './cluster-readings';

const REGION: Region = { shape: 'rect', x: 0, y: 20, width: 400, height: 160 };
const cluster = (hex: string, share: number, code: string): RegionCluster =>
  ({ lab: [40, 10, 10], lch: [40, 14, 45], hex, inGamut: true, share, spreadDeltaE00: 0.2, chip: { code, parent: null, name: 'leaf L46 C47', hex, lab: [40, 10, 10], deltaE00: 0.4, verdict: 'indistinguishable' } }) as RegionCluster;
const SAMPLE = { photoId: 12, region: REGION, uniform: false, clusters: [cluster('#4f7a28', 0.75, 'F-094.003'), cluster('#6b2d5c', 0.25, 'F-183.042')] } as unknown as PhotoSample;

describe('ClusterReadings', () => {
  let http: HttpTestingController;
  let online = true;

  beforeEach(() => {
    online = true;
    sessionStorage.clear();
    // The reading form's half-filled draft: accession HL-0001, plant P1, the upper third, overcast.
    sessionStorage.setItem(READING_DRAFT_KEY, JSON.stringify({ accessionId: 1, plantId: 11, characterId: 5, light: 'overcast' }));
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting(), { provide: IS_ONLINE, useValue: () => online }] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  async function open() {
    const fixture = TestBed.createComponent(ClusterReadings);
    fixture.componentRef.setInput('sample', SAMPLE);
    fixture.componentRef.setInput('photoId', 12);
    fixture.componentRef.setInput('region', REGION);
    fixture.detectChanges();
    http.expectOne('/api/accessions').flush(TEST_ACCESSIONS);
    http.expectOne('/api/characters').flush(TEST_CHARACTERS);
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture;
  }

  const saveButton = (el: HTMLElement) => [...el.querySelectorAll('button')].find((b) => /Save \d+ reading/.test(b.textContent ?? ''))!;

  it("should send both colours in one request, each with its character and index, and show a refusal at the colour it concerns, saving nothing", async () => {
    const fixture = await open();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.querySelectorAll('li.colour').length).toBe(2);
    // The stripes get their own character (the select's own change, as a tap on an option gives it).
    fixture.componentInstance['chooseCharacter'](1, 7);
    fixture.detectChanges();
    expect(saveButton(el).textContent).toContain('Save 2 readings');
    saveButton(el).click();
    const request = http.expectOne('/api/readings/batch');
    const body = request.request.body as CreateReadingsRequest;
    expect(body.readings.map((r) => [r.accessionId, r.plantId, r.characterId, r.light, r.method, r.photo?.cluster])).toEqual([
      [1, 11, 5, 'overcast', 'photo', 0],
      [1, 11, 7, 'overcast', 'photo', 1],
    ]);
    expect(request.request.headers.get('Idempotency-Key')).toBeTruthy();
    request.flush(
      { type: 'about:blank', title: 'Bad request', status: 400, detail: 'Reading 2 of the batch: The reading is not valid. Nothing was saved.', errors: [{ field: 'readings.1.photo.cluster', message: 'names colour 1, but the region is one colour' }] },
      { status: 400, statusText: 'Bad Request', headers: { 'Content-Type': 'application/problem+json' } },
    );
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.querySelector('li.colour[data-cluster="1"]')?.textContent).toContain('photo.cluster names colour 1, but the region is one colour');
    expect(el.querySelector('li.colour[data-cluster="0"] .field-error')).toBeNull();
    expect(el.textContent).toContain('Nothing was saved.');
    expect(el.textContent).not.toContain('readings saved');
    expect(sessionStorage.getItem(READING_DRAFT_KEY)).not.toBeNull();
  });

  it('should list the saved readings and let the form forget its draft once both are saved', async () => {
    const fixture = await open();
    const el = fixture.nativeElement as HTMLElement;
    fixture.componentInstance['chooseCharacter'](1, 7);
    fixture.detectChanges();
    saveButton(el).click();
    const saved = (id: number, characterLabel: string, bestChip: string) => ({ id, accessionNumber: 'HL-0001', plantLabel: 'P1', characterId: 5, characterLabel, bestChip, bestChipName: 'leaf L46 C47', hex: '#4f7a28' }) as ReadingDetail;
    http.expectOne('/api/readings/batch').flush({ readings: [saved(41, 'Petiole, upper third', 'F-094.003'), saved(42, 'Corm flesh, centre', 'F-183.042')] }, { status: 201, statusText: 'Created' });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(el.textContent).toContain('2 readings saved');
    expect([...el.querySelectorAll('.saved-list a')].map((a) => a.getAttribute('href'))).toEqual(['/readings/41', '/readings/42']);
    expect(sessionStorage.getItem(READING_DRAFT_KEY)).toBeNull();
  });

  it('should say out of range that the colours need the server, sending nothing', async () => {
    online = false;
    const fixture = await open();
    const el = fixture.nativeElement as HTMLElement;
    fixture.componentInstance['chooseCharacter'](1, 7);
    fixture.detectChanges();
    saveButton(el).click();
    fixture.detectChanges();
    http.expectNone('/api/readings/batch');
    expect(el.textContent).toContain('No connection: saving the colours separately needs the server.');
  });

  it('should point out one character given to two colours and send nothing', async () => {
    const fixture = await open();
    const el = fixture.nativeElement as HTMLElement;
    fixture.componentInstance['chooseCharacter'](1, 5);
    fixture.detectChanges();
    expect(el.querySelector('li.colour[data-cluster="1"]')?.textContent).toContain('already given to an earlier colour');
    saveButton(el).click();
    fixture.detectChanges();
    http.expectNone('/api/readings/batch');
    expect(el.textContent).toContain('Two colours have the same character');
  });
});
