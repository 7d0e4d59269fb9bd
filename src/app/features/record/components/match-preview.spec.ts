import { signal } from '@angular/core';
import { TestBed } from '@angular/core/testing';

import { ChipCatalogue, ChipSet } from '../../../shared/chips/chip-catalogue';
import { TEST_CHIPS, TEST_SETS } from '../../../shared/testing/chip-fixtures';
import { MatchPreview } from './match-preview';

describe('MatchPreview', () => {
  function render(lab: { l: number; a: number; b: number } | null, eyeChipCode: string | null = null): HTMLElement {
    TestBed.configureTestingModule({ providers: [{ provide: ChipCatalogue, useValue: { set: signal(new ChipSet(TEST_SETS[0], TEST_CHIPS)), load: () => undefined } }] });
    const fixture = TestBed.createComponent(MatchPreview);
    fixture.componentRef.setInput('lab', lab);
    fixture.componentRef.setInput('eyeChipCode', eyeChipCode);
    fixture.detectChanges();
    return fixture.nativeElement as HTMLElement;
  }

  it('should show the nearest chip, its words and ΔE00 before saving', () => {
    const el = render({ l: 46, a: 41, b: 21 });
    expect(el.textContent).toContain('F-001.001');
    expect(el.textContent).toMatch(/ΔE00 0\.00/);
    expect(el.querySelector('.hl-swatch-surround .swatch')).not.toBeNull();
  });

  it('should warn, not block, when the chip picked by eye is more than ΔE00 1.8 from the measured colour', () => {
    // A green eye pick for a red measurement: far apart.
    expect(render({ l: 46, a: 41, b: 21 }, 'F-002').querySelector('[role=alert]')?.textContent).toContain('more than 1.8');
  });

  it('should say nothing when the eye pick is close', () => {
    expect(render({ l: 46, a: 41, b: 21 }, 'F-001.001').querySelector('[role=alert]')).toBeNull();
  });
});
