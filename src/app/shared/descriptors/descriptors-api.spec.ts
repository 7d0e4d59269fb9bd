import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { DescriptorsApi } from './descriptors-api';

describe('DescriptorsApi', () => {
  let api: DescriptorsApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(DescriptorsApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should read the catalogue', () => {
    let count = 0;
    api.descriptors().subscribe((list) => (count = list.length));
    const request = http.expectOne('/api/descriptors');
    expect(request.request.method).toBe('GET');
    request.flush([{ id: 1 }, { id: 2 }]);
    expect(count).toBe(2);
  });

  it('should post a value with the unit it was typed in, leaving SI to the server', () => {
    api.record({ accessionId: 3, plantId: 9, descriptorId: 1, value: 40, unit: 'in' }).subscribe();
    const request = http.expectOne('/api/observations');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ accessionId: 3, plantId: 9, descriptorId: 1, value: 40, unit: 'in' });
    request.flush({ id: 1 });
  });

  it('should send several values in one request, so they are saved all or nothing', () => {
    const values = [
      { accessionId: 3, plantId: 9, descriptorId: 1, value: 40, unit: 'in' as const },
      { accessionId: 3, plantId: 9, descriptorId: 2, category: 'round' },
    ];
    api.recordAll(values).subscribe();
    const request = http.expectOne('/api/observations/batch');
    expect(request.request.method).toBe('POST');
    expect(request.request.body).toEqual({ observations: values });
    request.flush([]);
  });

  it('should ask for one accession’s observations with the page size', () => {
    api.observations(3, 20).subscribe();
    const request = http.expectOne((r) => r.url === '/api/observations');
    expect(request.request.params.get('accessionId')).toBe('3');
    expect(request.request.params.get('pageSize')).toBe('20');
    request.flush({ items: [], total: 0 });
  });

  it('should read an accession’s latest values per plant', () => {
    api.accessionValues(3).subscribe();
    http.expectOne('/api/accessions/3/descriptors').flush({ accessionId: 3, plants: [] });
  });

  it('should change a descriptor with PATCH', () => {
    api.updateDescriptor(4, { active: false }).subscribe();
    const request = http.expectOne('/api/descriptors/4');
    expect(request.request.method).toBe('PATCH');
    expect(request.request.body).toEqual({ active: false });
    request.flush({ id: 4 });
  });
});
