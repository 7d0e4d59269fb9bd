import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { ReadingDetail } from '../../../../../shared/api/reading-answers.js';
import { AuthStore } from '../../../core/auth/auth-store';
import { ReadingDetailPage } from './reading-detail';

const DETAIL = {
  id: 40,
  accessionNumber: 'HL-0001',
  accessionName: 'Purple Dawn',
  plantLabel: 'P1',
  characterLabel: 'Corm flesh, centre',
  observerId: 4,
  observerName: 'Juno Pellbright',
  observedAt: '2026-03-14T09:30:00.000Z',
  createdAt: '2026-03-14T09:31:00.000Z',
  method: 'photo',
  lab: [80, 2, 14],
  lch: [80, 14.1, 82],
  hex: '#d9c9a9',
  inGamut: true,
  bestChip: 'F-040.012',
  bestChipName: 'pale weak yellow',
  bestChipHex: '#dbcaa8',
  deltaE00: 0.7,
  verdict: 'indistinguishable',
  eyeChipCode: null,
  eyeDeltaE00: null,
  setId: 'v1',
  season: 'Wet',
  seasonYear: 2026,
  seasonLabel: 'Wet 2026–27',
  plantAgeMonths: 13.8,
  light: 'open-shade',
  secondsSinceCut: 95,
  leafPosition: null,
  notes: null,
  status: 'submitted',
  siteCode: 'RDP',
  supersedesId: 39,
  supersededById: null,
  matches: [],
  between: null,
  provenance: {
    photoId: 12,
    photoWidth: 4000,
    photoHeight: 3000,
    region: { shape: 'rect', x: 100, y: 100, width: 400, height: 300 },
    neutralRegion: null,
    pixelCount: 120000,
    pixelsDropped: 40,
    spreadDeltaE00: 0.9,
    uniform: true,
    correction: { kind: 'none' },
    pipeline: 'photo-sample/1',
    cluster: null,
    instrument: null,
    source: null,
  },
  versions: [
    { id: 39, observedAt: '2026-03-14T09:20:00.000Z', createdAt: '2026-03-14T09:21:00.000Z', reason: null, current: false },
    { id: 40, observedAt: '2026-03-14T09:30:00.000Z', createdAt: '2026-03-14T09:31:00.000Z', reason: 'wrong plant', current: true },
  ],
  history: [{ id: 7, at: '2026-03-14T09:31:00.000Z', actorName: 'Juno Pellbright', action: 'reading.superseded', detail: { from: 39 }, sentence: 'Juno Pellbright corrected reading 39 as reading 40, because "wrong plant".' }],
} as unknown as ReadingDetail;

describe('ReadingDetailPage', () => {
  async function open(me: { id: number; role: string }, reading: ReadingDetail = DETAIL): Promise<HTMLElement> {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting(), { provide: AuthStore, useValue: { currentUser: signal({ ...me, email: 'x@demo.test', name: 'X' }) } }],
    });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ReadingDetailPage);
    fixture.componentRef.setInput('id', reading.id);
    fixture.detectChanges();
    http.expectOne(`/api/readings/${reading.id}`).flush(reading);
    await fixture.whenStable();
    fixture.detectChanges();
    http.verify();
    return fixture.nativeElement as HTMLElement;
  }

  it('should show the provenance: crop, chips, correction, pixels, conditions, season, age, versions and history', async () => {
    const el = await open({ id: 4, role: 'recorder' });
    expect(el.querySelector('hl-photo-crop svg image')?.getAttribute('href')).toBe('/api/photos/12/image');
    const text = el.textContent!;
    for (const words of ['F-040.012', 'indistinguishable', 'No correction', '120,000 used', 'Open shade', '95 s', 'More than a minute after the cut', 'Wet 2026–27', '13 months', 'Reason: wrong plant', 'Juno Pellbright corrected reading 39 as reading 40']) {
      expect(text).toContain(words);
    }
    expect(el.querySelector('.versions a')?.getAttribute('href')).toBe('/readings/39');
  });

  it("should put the reviewer's comment at the top of the reading, above the actions, for its recorder", async () => {
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, status: 'reread-requested', latestReview: { decision: 'reread', comment: 'Read the middle third in open shade.', reviewerName: 'Caspar Thistlewood', createdAt: '2026-03-15T08:00:00Z' } });
    const note = el.querySelector('[data-testid="review-comment"]');
    expect(note?.textContent).toContain('Caspar Thistlewood asked for a re-read');
    expect(note?.textContent).toContain('“Read the middle third in open shade.”');
    expect(note!.compareDocumentPosition(el.querySelector('.actions')!) & Node.DOCUMENT_POSITION_FOLLOWING).toBeTruthy();
  });

  it('should show no review note on a reading never reviewed', async () => {
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, latestReview: null });
    expect(el.querySelector('[data-testid="review-comment"]')).toBeNull();
  });

  it('should offer a correction to its observer and to an admin, not to another recorder', async () => {
    expect((await open({ id: 4, role: 'recorder' })).textContent).toContain('Correct this reading');
    TestBed.resetTestingModule();
    expect((await open({ id: 1, role: 'admin' })).textContent).toContain('Correct this reading');
    TestBed.resetTestingModule();
    expect((await open({ id: 9, role: 'recorder' })).textContent).not.toContain('Correct this reading');
  });

  it('should say when the reading took one colour of a region that held several, and not otherwise', async () => {
    expect((await open({ id: 4, role: 'recorder' })).querySelector('[data-testid="reading-cluster"]')).toBeNull();
    TestBed.resetTestingModule();
    const cluster = { index: 1, of: 2, share: 0.25, spreadDeltaE00: 0.21 };
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, uniform: false, provenance: { ...DETAIL.provenance, uniform: false, cluster } } as ReadingDetail);
    expect(el.querySelector('[data-testid="reading-cluster"]')?.textContent).toContain("Colour 2 of 2 in the region (25 % of it, spread ΔE00 0.2), not the region's mean");
  });

  it("should show an instrument reading's illuminant/observer and the numbers it reported, and no light", async () => {
    const el = await open({ id: 4, role: 'recorder' }, {
      ...DETAIL,
      method: 'instrument',
      light: null,
      provenance: { ...DETAIL.provenance, photoId: null, region: null, instrument: 'Bench spectro A', illuminant: 'D50/2', reportedLab: [38.2, 24.5, -12.1] },
    } as ReadingDetail);
    const facts = [...el.querySelectorAll('dt')].map((dt) => dt.textContent?.trim());
    expect(facts).not.toContain('Light');
    const dt = [...el.querySelectorAll('dt')].find((d) => d.textContent?.includes('Illuminant / observer'))!;
    expect(dt.nextElementSibling?.textContent?.replace(/\s+/g, ' ')).toContain('D50 / 2° as the instrument reported · reported L*a*b* 38.2, 24.5, -12.1, adapted to D65 / 2° (Bradford)');
  });

  it('should show the colour matched against the other reference set too, beside the set it was stored with', async () => {
    const other = {
      setId: 'v2',
      current: true,
      matches: [{ code: 'F-201.004', parent: 'F-201', name: 'plum L32 C30', hex: '#6a2e5b', lab: [32, 30, -12], deltaE00: 0.62, verdict: 'indistinguishable' }],
      between: null,
    };
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, otherSets: [other] } as ReadingDetail);
    expect(el.querySelector('[data-testid="other-set-v2"]')?.textContent).toContain('In set v2 (current): F-201.004, plum L32 C30, ΔE00 0.6');
  });

  it("should show the plant's earlier readings of the character on the grey surround, each with its code, day and observer, linked", async () => {
    const earlier = [
      { id: 31, observedAt: '2025-12-01T09:00:00Z', observerName: 'Tamsin Orrowby', hex: '#6d4a66', bestChip: 'F-101.002', status: 'approved' },
      { id: 22, observedAt: '2025-06-01T09:00:00Z', observerName: 'Juno Pellbright', hex: '#6a4060', bestChip: 'F-101.004', status: 'approved' },
    ];
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, earlier } as ReadingDetail);
    const section = el.querySelector('[data-testid="earlier-readings"]')!;
    expect(section.textContent).toContain('Plant P1: earlier readings of Corm flesh, centre');
    const items = section.querySelectorAll('.hl-swatch-surround li');
    expect(items.length).toBe(2);
    expect(items[0].textContent).toContain('F-101.002');
    expect(items[0].textContent).toContain('Tamsin Orrowby');
    expect(items[0].querySelector('time')?.getAttribute('datetime')).toBe('2025-12-01T09:00:00Z');
    expect(items[1].querySelector('a')?.getAttribute('href')).toBe('/readings/22');
  });

  it('should say so when the plant has no earlier reading of the character', async () => {
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, earlier: [] } as ReadingDetail);
    expect(el.querySelector('[data-testid="earlier-readings"]')?.textContent).toContain('No earlier reading of this character.');
  });

  it('should point a superseded reading to its correction and offer no correction of it', async () => {
    const el = await open({ id: 4, role: 'recorder' }, { ...DETAIL, supersededById: 41 });
    expect(el.textContent).toContain('Superseded by a correction');
    expect(el.querySelector('.hl-notice a')?.getAttribute('href')).toBe('/readings/41');
    expect(el.textContent).not.toContain('Correct this reading');
  });
});
