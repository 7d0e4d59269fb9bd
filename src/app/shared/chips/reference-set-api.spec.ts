import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { ChipDto, MatchAnswer, ReferenceSetSummary } from '../../../../shared/api/reference-set-answers.js';
import { ReferenceSetApi } from './reference-set-api';

describe('ReferenceSetApi', () => {
  let api: ReferenceSetApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ReferenceSetApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should list the sets', () => {
    const sets: ReferenceSetSummary[] = [{ id: 'v1', name: 'Set 1', version: 1, white: 'D65', observer: '2°', fieldChips: 2, fineChips: 3, current: true }];
    let answer: ReferenceSetSummary[] | undefined;
    api.sets().subscribe((s) => (answer = s));
    const req = http.expectOne('/api/reference-sets');
    expect(req.request.method).toBe('GET');
    req.flush(sets);
    expect(answer).toEqual(sets);
  });

  it('should load all chips of one set from its cacheable route', () => {
    const chips: ChipDto[] = [{ code: 'F-001', parent: null, name: 'pale red', lab: [80, 20, 10], hex: '#f0c0b8', inGamut: true }];
    let answer: ChipDto[] | undefined;
    api.chips('v1').subscribe((c) => (answer = c));
    const req = http.expectOne('/api/reference-sets/v1/chips');
    expect(req.request.method).toBe('GET');
    req.flush(chips);
    expect(answer).toEqual(chips);
  });

  it('should post a match request as it is given', () => {
    let answer: MatchAnswer | undefined;
    api.match({ lab: [50, 10, -5], k: 3 }).subscribe((a) => (answer = a));
    const req = http.expectOne('/api/match');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ lab: [50, 10, -5], k: 3 });
    const flushed = { input: { lab: [50, 10, -5], lch: [50, 11.18, 333.4], hex: '#857379', inGamut: true }, matches: [], between: null, setId: 'v1' } as MatchAnswer;
    req.flush(flushed);
    expect(answer).toEqual(flushed);
  });

  it('should give the card address of a set, escaped', () => {
    expect(api.cardUrl('v1')).toBe('/api/reference-sets/v1/card.pdf');
    expect(api.cardUrl('a b')).toBe('/api/reference-sets/a%20b/card.pdf');
  });
});
