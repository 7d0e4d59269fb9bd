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
});
