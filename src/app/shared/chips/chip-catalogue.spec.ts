import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import { TEST_CHIPS, TEST_SETS } from '../testing/chip-fixtures';
import { ChipCatalogue } from './chip-catalogue';

describe('ChipCatalogue', () => {
  let catalogue: ChipCatalogue;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    catalogue = TestBed.inject(ChipCatalogue);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function loadTestSet(): void {
    catalogue.load();
    http.expectOne('/api/reference-sets').flush(TEST_SETS);
    http.expectOne('/api/reference-sets/v2/chips').flush(TEST_CHIPS);
  }

  it('should load the chips of the current set, once however often it is asked', () => {
    loadTestSet();
    catalogue.load();
    http.expectNone('/api/reference-sets');
    expect(catalogue.status()).toBe('ready');
    expect(catalogue.set()?.summary.id).toBe('v2');
  });

  it('should group field chips by hue sector and list each field chip’s fine chips, light to dark', () => {
    loadTestSet();
    const set = catalogue.set()!;
    expect(set.fieldGroups.map((g) => [g.family, g.chips.map((c) => c.code)])).toEqual([
      ['wine', ['F-001']],
      ['leaf', ['F-002']],
    ]);
    expect(set.finesOf('F-001').map((c) => c.code)).toEqual(['F-001.001', 'F-001.002']);
  });

  it('should give a chip’s family: a fine chip’s field chip is its parent, a field chip is its own', () => {
    loadTestSet();
    const set = catalogue.set()!;
    const codes = (code: string) => {
      const family = set.family(code);
      return family && [family.chip.code, family.field?.code, family.fines.map((c) => c.code)];
    };
    expect(codes('F-001.002')).toEqual(['F-001.002', 'F-001', ['F-001.001', 'F-001.002']]);
    expect(codes('F-002')).toEqual(['F-002', 'F-002', ['F-002.001']]);
    expect(codes('F-999')).toBeNull();
  });

  it('should list a chip’s nearest neighbours without the chip itself', () => {
    loadTestSet();
    const set = catalogue.set()!;
    const codes = set.neighbours(set.chip('F-001')!, 2).map((n) => n.chip.code);
    expect(codes).toHaveLength(2);
    expect(codes).not.toContain('F-001');
    expect(codes.every((c) => c.startsWith('F-001.'))).toBe(true);
  });

  it('should say so when the chips cannot be loaded, and try again when asked', () => {
    catalogue.load();
    http.expectOne('/api/reference-sets').flush(null, { status: 500, statusText: 'Server Error' });
    expect(catalogue.failed()).toBe(true);
    loadTestSet();
    expect(catalogue.status()).toBe('ready');
  });
});
