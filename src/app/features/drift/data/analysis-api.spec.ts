import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { DriftAnswer, SiteComparisonAnswer } from '../../../../../shared/api/analysis-answers.js';
import { AnalysisApi } from './analysis-api';

describe('AnalysisApi', () => {
  let api: AnalysisApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(AnalysisApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should ask for the drift of an accession and character at every site when no site is chosen', () => {
    let answer: DriftAnswer | null = null;
    api.drift({ accessionId: 4, characterId: 7, siteId: null }).subscribe((a) => (answer = a));
    const request = http.expectOne((r) => r.url === '/api/analysis/drift');
    expect(request.request.method).toBe('GET');
    expect(request.request.params.keys().sort()).toEqual(['accessionId', 'characterId']);
    expect(request.request.params.get('accessionId')).toBe('4');
    expect(request.request.params.get('characterId')).toBe('7');
    request.flush({ groups: [], comparisons: [], points: [] });
    expect(answer).not.toBeNull();
  });

  it('should send the site when one is chosen', () => {
    api.drift({ accessionId: 4, characterId: 7, siteId: 2 }).subscribe();
    const request = http.expectOne((r) => r.url === '/api/analysis/drift');
    expect(request.request.params.get('siteId')).toBe('2');
    request.flush({});
  });

  it('should ask for the site comparison without a site', () => {
    let answer: SiteComparisonAnswer | null = null;
    api.sites({ accessionId: 4, characterId: 7 }).subscribe((a) => (answer = a));
    const request = http.expectOne((r) => r.url === '/api/analysis/sites');
    expect(request.request.params.keys().sort()).toEqual(['accessionId', 'characterId']);
    request.flush({ sites: [], deltaE00: [], pValue: [], threshold: 1.8 });
    expect(answer!.threshold).toBe(1.8);
  });
});
