import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { AccessionDescriptors } from '../../../../shared/api/descriptor-answers.js';
import { UnitPreference } from '../../core/units/unit-preference';
import { PlantValues } from './plant-values';

const answer: AccessionDescriptors = {
  accessionId: 3,
  plants: [
    {
      plantId: 9,
      plantLabel: 'P1',
      values: [
        {
          descriptorId: 1,
          code: 'petiole.length',
          label: 'Petiole length',
          kind: 'length',
          valueSi: 1.016,
          category: null,
          categoryLabel: null,
          formatted: { metric: '101.6 cm', imperial: '40.0 in' },
          observedAt: '2026-03-14T09:30:00Z',
          observationId: 11,
          derived: false,
          from: null,
        },
        {
          descriptorId: 3,
          code: 'sheath.petiole.ratio',
          label: 'Sheath-to-petiole ratio',
          kind: 'ratio',
          valueSi: 0.7,
          category: null,
          categoryLabel: null,
          formatted: { metric: '0.70', imperial: '0.70' },
          observedAt: '2026-03-14T09:30:00Z',
          observationId: null,
          derived: true,
          from: { numeratorId: 12, denominatorId: 11 },
        },
      ],
    },
    { plantId: 10, plantLabel: 'P2', values: [] },
  ],
};

describe('PlantValues', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => {
    http.verify();
    localStorage.clear();
  });

  async function render(plantId?: number | null): Promise<HTMLElement> {
    const fixture = TestBed.createComponent(PlantValues);
    fixture.componentRef.setInput('accessionId', 3);
    if (plantId !== undefined) fixture.componentRef.setInput('plantId', plantId);
    fixture.detectChanges();
    http.expectOne('/api/accessions/3/descriptors').flush(answer);
    await fixture.whenStable();
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('should show lengths in centimetres for a metric person', async () => {
    const text = (await render()).textContent ?? '';
    expect(text).toContain('101.6 cm');
    expect(text).not.toContain('40.0 in');
  });

  it('should show the same value in inches once the person chooses imperial', async () => {
    TestBed.inject(UnitPreference).choose('imperial');
    const text = (await render()).textContent ?? '';
    expect(text).toContain('40.0 in');
  });

  it('should mark a derived ratio as computed, in words', async () => {
    const element = await render();
    const ratioRow = [...element.querySelectorAll('dd')].find((dd) => dd.textContent?.includes('0.70'));
    expect(ratioRow?.textContent).toContain('computed');
  });

  it('should leave out plants with no values, and show one plant alone when asked', async () => {
    const element = await render(9);
    expect(element.querySelectorAll('.plant').length).toBe(1);
    expect(element.textContent).not.toContain('Plant P2');
  });
});
