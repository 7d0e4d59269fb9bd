import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { MATERIAL_ANIMATIONS } from '@angular/material/core';
import { MatDialog } from '@angular/material/dialog';
import { provideRouter } from '@angular/router';

import type { ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import type { ReviewAnswer } from '../../../../../shared/api/review-answers.js';
import { ReviewDialog, type ReviewDialogData } from './review-dialog';

function detail(id: number): ReadingDetail {
  return {
    id,
    accessionNumber: 'HL-0007',
    accessionName: 'Dusk Ring',
    plantLabel: 'P2',
    characterLabel: 'Petiole, upper third',
    observerId: 4,
    observerName: 'Juno Pellbright',
    observedAt: '2026-03-14T09:30:00.000Z',
    method: 'instrument',
    lab: [38, 24, -9],
    lch: [38, 25.6, 339.4],
    hex: '#7a4a68',
    inGamut: true,
    bestChip: 'F-101.004',
    bestChipName: 'violet L30 C40',
    bestChipHex: '#7b4a69',
    deltaE00: 0.6,
    verdict: 'indistinguishable',
    eyeChipCode: null,
    eyeDeltaE00: null,
    siteCode: 'RDP',
    season: 'Wet',
    seasonYear: 2026,
    seasonLabel: 'Wet 2026–27',
    plantAgeMonths: 5,
    light: 'overcast',
    secondsSinceCut: null,
    leafPosition: 'third leaf',
    notes: 'Rain in the morning',
    status: 'submitted',
    supersededById: null,
    matches: [],
    between: null,
    provenance: { photoId: null, photoWidth: null, photoHeight: null, region: null, neutralRegion: null, instrument: 'bench', source: null },
  } as unknown as ReadingDetail;
}

const answer = (id: number, status: string, mailed: boolean) => ({ review: { id: 1, readingId: id }, reading: { id, status }, mailed }) as unknown as ReviewAnswer;

describe('ReviewDialog', () => {
  let http: HttpTestingController;
  let decided: ReviewAnswer[];
  let closedWith: unknown;

  async function open(ids: number[]): Promise<void> {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: MATERIAL_ANIMATIONS, useValue: { animationsDisabled: true } }] });
    http = TestBed.inject(HttpTestingController);
    decided = [];
    closedWith = 'open';
    const data: ReviewDialogData = { ids, index: 0, query: { status: 'submitted', page: 1, pageSize: 25 }, decided: (a) => decided.push(a) };
    TestBed.inject(MatDialog)
      .open(ReviewDialog, { data })
      .afterClosed()
      .subscribe((v) => (closedWith = v));
    await settle();
  }

  async function settle(): Promise<void> {
    await new Promise((r) => setTimeout(r));
    TestBed.tick();
  }

  const pane = () => document.querySelector('.cdk-overlay-pane') as HTMLElement;
  const press = (key: string, target: EventTarget = document.body) => target.dispatchEvent(new KeyboardEvent('keydown', { key, bubbles: true }));
  const button = (name: RegExp) => Array.from(pane().querySelectorAll('button')).find((b) => name.test(b.textContent ?? '')) as HTMLButtonElement;

  afterEach(() => {
    TestBed.inject(MatDialog).closeAll();
    http.verify();
  });

  it('should show the reading’s swatch, conditions and notes, with the shortcut keys', async () => {
    await open([11, 12]);
    http.expectOne('/api/readings/11').flush(detail(11));
    await settle();
    const text = pane().textContent ?? '';
    expect(text).toContain('Review reading 11');
    expect(text).toContain('1 of 2');
    expect(text).toContain('F-101.004');
    expect(text).toContain('Overcast');
    expect(text).toContain('Rain in the morning');
    expect(button(/Approve/).textContent).toContain('A');
    expect(button(/^\s*flag\s*Flag/i).textContent).toContain('F');
  });

  it("should show the plant's earlier readings of the character with swatch, chip code, date and observer", async () => {
    await open([11]);
    http.expectOne('/api/readings/11').flush({ ...detail(11), plantLabel: 'P3', earlier: [{ id: 7, observedAt: '2025-12-01T09:00:00Z', observerName: 'Tamsin Orrowby', hex: '#6d4a66', bestChip: 'F-101.002', status: 'approved' }] });
    await settle();
    const earlier = pane().querySelector('[data-testid="earlier-readings"]')!;
    expect(earlier.textContent).toContain('Plant P3: earlier readings of');
    expect(earlier.textContent).toContain('F-101.002');
    expect(earlier.textContent).toContain('Tamsin Orrowby');
    expect(earlier.querySelector('.hl-swatch-surround .earlier-swatch')).not.toBeNull();
  });

  it('should approve on A and open the next reading', async () => {
    await open([11, 12]);
    http.expectOne('/api/readings/11').flush(detail(11));
    await settle();
    press('a');
    const post = http.expectOne('/api/readings/11/review');
    expect(post.request.body).toEqual({ decision: 'approve', comment: null });
    post.flush(answer(11, 'approved', false));
    await settle();
    http.expectOne('/api/readings/12').flush(detail(12));
    await settle();
    expect(decided).toHaveLength(1);
    expect(pane().textContent).toContain('Reading 11 approved.');
    expect(pane().textContent).toContain('Review reading 12');
  });

  it('should ask for a reason on F, refuse to send without one, and not take letters typed in it as shortcuts', async () => {
    await open([11]);
    http.expectOne('/api/readings/11').flush(detail(11));
    await settle();
    press('f');
    await settle();
    const box = pane().querySelector('textarea') as HTMLTextAreaElement;
    expect(box).not.toBeNull();
    button(/Flag reading/).click();
    await settle();
    http.expectNone('/api/readings/11/review');
    expect(pane().textContent).toContain('Say what is wrong');
    box.value = 'Looks too green against the rest';
    box.dispatchEvent(new Event('input'));
    press('a', box);
    http.expectNone('/api/readings/11/review');
    button(/Flag reading/).click();
    const post = http.expectOne('/api/readings/11/review');
    expect(post.request.body).toEqual({ decision: 'flag', comment: 'Looks too green against the rest' });
    post.flush(answer(11, 'flagged', true));
    await settle();
    // The page's readings are worked: the dialog asks the queue for more, and closes when none are left.
    http.expectOne((r) => r.url === '/api/reviews/queue').flush({ items: [{ id: 11 }], total: 1 });
    await settle();
    await settle();
    expect(TestBed.inject(MatDialog).openDialogs).toHaveLength(0);
    expect(closedWith).toBe(1);
  });

  it('should ask what to re-read on R and send it', async () => {
    await open([11]);
    http.expectOne('/api/readings/11').flush(detail(11));
    await settle();
    press('r');
    await settle();
    expect(pane().textContent).toContain('What should be read again, and how?');
    const box = pane().querySelector('textarea') as HTMLTextAreaElement;
    box.value = 'Read the upper third again in open shade';
    box.dispatchEvent(new Event('input'));
    button(/Ask for a re-read/).click();
    const post = http.expectOne('/api/readings/11/review');
    expect(post.request.body).toEqual({ decision: 'reread', comment: 'Read the upper third again in open shade' });
    post.flush(answer(11, 'reread-requested', true));
    await settle();
    http.expectOne((r) => r.url === '/api/reviews/queue').flush({ items: [{ id: 30 }], total: 1 });
    await settle();
    http.expectOne('/api/readings/30').flush(detail(30));
    await settle();
    expect(pane().textContent).toContain('Reading 11 sent back for a re-read; the recorder was e-mailed.');
  });
});
