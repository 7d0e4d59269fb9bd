import { HttpEventType, HttpHeaders, provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { DownloadProgress } from './blob-download';
import { filenameFrom } from './blob-download';
import { ReadingsApi } from './readings-api';

describe('ReadingsApi', () => {
  let api: ReadingsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(ReadingsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should list with only the filters that are set', () => {
    let total = -1;
    api.list({ accessionId: 3, method: 'chip', includeSuperseded: false, season: '', sort: 'observedAt', dir: 'desc', page: 2, pageSize: 25 }).subscribe((list) => (total = list.total));
    const request = http.expectOne((r) => r.url === '/api/readings');
    expect(request.request.method).toBe('GET');
    expect(request.request.params.keys().sort()).toEqual(['accessionId', 'dir', 'method', 'page', 'pageSize', 'sort']);
    expect(request.request.params.get('accessionId')).toBe('3');
    request.flush({ items: [], total: 41 });
    expect(total).toBe(41);
  });

  it('should create a reading and post a correction to the supersede route', () => {
    const body = { accessionId: 1, characterId: 2, siteId: 3, method: 'chip' as const, chipCode: 'F-087', light: 'overcast' as const };
    api.create(body, 'key-1').subscribe();
    const create = http.expectOne('/api/readings');
    expect(create.request.method).toBe('POST');
    expect(create.request.body).toEqual(body);
    expect(create.request.headers.get('Idempotency-Key')).toBe('key-1');
    create.flush({});
    api.supersede(9, { ...body, reason: 'wrong plant' }).subscribe();
    const supersede = http.expectOne('/api/readings/9/supersede');
    expect(supersede.request.method).toBe('POST');
    expect(supersede.request.body.reason).toBe('wrong plant');
    supersede.flush({});
  });

  it('should get one reading', () => {
    api.get(12).subscribe();
    http.expectOne({ method: 'GET', url: '/api/readings/12' }).flush({});
  });

  it('should download an export of the filters with progress, without the page, named as the server says', () => {
    const seen: DownloadProgress[] = [];
    api.export('csv', { observerId: 4, page: 3, pageSize: 50 }).subscribe((step) => seen.push(step));
    const request = http.expectOne((r) => r.url === '/api/readings/export.csv');
    expect(request.request.params.keys()).toEqual(['observerId']);
    expect(request.request.reportProgress).toBe(true);
    expect(request.request.responseType).toBe('blob');
    request.event({ type: HttpEventType.DownloadProgress, loaded: 512, total: 2048 });
    const blob = new Blob(['id,lab\n'], { type: 'text/csv' });
    request.flush(blob, { headers: { 'Content-Disposition': 'attachment; filename="readings-2026-03-14.csv"' } });
    expect(seen[0]).toEqual({ kind: 'progress', loaded: 512, fraction: 0.25 });
    expect(seen[1]).toMatchObject({ kind: 'done', filename: 'readings-2026-03-14.csv' });
  });

  it('should read the RFC 6266 extended file name first and never a path', () => {
    expect(filenameFrom(new HttpHeaders({ 'Content-Disposition': `attachment; filename="a.csv"; filename*=UTF-8''r%C3%A9sultats.csv` }), 'x.csv')).toBe('résultats.csv');
    expect(filenameFrom(new HttpHeaders({ 'Content-Disposition': 'attachment; filename="../../etc/passwd.csv"' }), 'x.csv')).toBe('passwd.csv');
    expect(filenameFrom(new HttpHeaders(), 'readings.xlsx')).toBe('readings.xlsx');
  });
});
