import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { SavedSite, Site } from '../../../../shared/api/collection-answers.js';
import { CollectionApi } from './collection-api';

const site: Site = { id: 4, code: 'CCG', name: 'Coastal', timezone: 'UTC', latitude: null, longitude: null, elevationM: null, seasons: [] };
const body = { code: 'CCG', name: 'Coastal', timezone: 'UTC', latitude: null, longitude: null, elevationM: null, seasons: [{ name: 'Wet', start: '11-01', end: '04-30' }, { name: 'Dry', start: '05-01', end: '10-31' }] };

describe('CollectionApi', () => {
  let api: CollectionApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(CollectionApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should create a site with its whole season scheme in one request', () => {
    api.createSite(body).subscribe();
    const request = http.expectOne('/api/sites');
    expect(request.request.method).toBe('POST');
    expect(request.request.body.seasons).toEqual(body.seasons);
    request.flush({ ...site, warnings: [] });
  });

  it('should save a site’s fields, then replace its seasons, answering with the saved scheme', () => {
    let saved: SavedSite | undefined;
    api.updateSite(4, body).subscribe((answer) => (saved = answer));
    const patch = http.expectOne('/api/sites/4');
    expect(patch.request.method).toBe('PATCH');
    expect(patch.request.body).not.toHaveProperty('seasons');
    patch.flush(site);
    const put = http.expectOne('/api/sites/4/seasons');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ seasons: body.seasons });
    put.flush({ ...site, seasons: body.seasons.map((s, i) => ({ ...s, id: i + 1 })), warnings: [] });
    expect(saved?.seasons.length).toBe(2);
  });

  it('should not replace the seasons when the site’s fields were refused', () => {
    let failed = false;
    api.updateSite(4, body).subscribe({ error: () => (failed = true) });
    http.expectOne('/api/sites/4').flush({ title: 'Conflict', status: 409 }, { status: 409, statusText: 'Conflict' });
    http.expectNone('/api/sites/4/seasons');
    expect(failed).toBe(true);
  });

  it('should find one site in the list and fail for an unknown id', () => {
    let found: Site | undefined;
    let missing = false;
    api.site(4).subscribe((s) => (found = s));
    http.expectOne('/api/sites').flush([site]);
    api.site(99).subscribe({ error: () => (missing = true) });
    http.expectOne('/api/sites').flush([site]);
    expect(found?.code).toBe('CCG');
    expect(missing).toBe(true);
  });

  it('should add a plant under its accession and edit it by its own id', () => {
    api.addPlant(7, { label: 'E2E-07', plantedOn: '2025-01-15' }).subscribe();
    const add = http.expectOne('/api/accessions/7/plants');
    expect(add.request.method).toBe('POST');
    add.flush({});
    api.updatePlant(21, { label: 'E2E-08' }).subscribe();
    const edit = http.expectOne('/api/plants/21');
    expect(edit.request.method).toBe('PATCH');
    edit.flush({});
  });

  it('should change a character with PATCH and never send its code', () => {
    api.updateCharacter(5, { driftThreshold: 2.5, active: false }).subscribe();
    const request = http.expectOne('/api/characters/5');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ driftThreshold: 2.5, active: false });
    request.flush({});
  });
});
