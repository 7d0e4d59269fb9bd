import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { UNIT_PREFERENCE_KEY, UnitPreference } from './unit-preference';

describe('UnitPreference', () => {
  beforeEach(() => localStorage.clear());
  afterEach(() => localStorage.clear());

  it('should start metric when nothing is stored', () => {
    expect(TestBed.inject(UnitPreference).system()).toBe('metric');
  });

  it('should read a stored imperial choice', () => {
    localStorage.setItem(UNIT_PREFERENCE_KEY, 'imperial');
    expect(TestBed.inject(UnitPreference).system()).toBe('imperial');
  });

  it('should ignore a stored value it does not know', () => {
    localStorage.setItem(UNIT_PREFERENCE_KEY, 'furlongs');
    expect(TestBed.inject(UnitPreference).system()).toBe('metric');
  });

  it('should remember a choice for the next visit', () => {
    TestBed.inject(UnitPreference).choose('imperial');
    expect(localStorage.getItem(UNIT_PREFERENCE_KEY)).toBe('imperial');
    TestBed.resetTestingModule();
    expect(TestBed.inject(UnitPreference).system()).toBe('imperial');
  });

  it('should keep a choice on the server and take the person’s units from it on another device', () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const units = TestBed.inject(UnitPreference);
    const http = TestBed.inject(HttpTestingController);
    units.chooseAndKeep('imperial');
    const put = http.expectOne('/api/account/preferences');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ unitSystem: 'imperial' });
    put.flush({ unitSystem: 'imperial' });
    // Another phone: its browser says metric, the server says imperial.
    localStorage.setItem(UNIT_PREFERENCE_KEY, 'metric');
    units.choose('metric');
    units.loadFromServer();
    http.expectOne({ method: 'GET', url: '/api/account/preferences' }).flush({ unitSystem: 'imperial' });
    expect(units.system()).toBe('imperial');
    http.verify();
  });
});
