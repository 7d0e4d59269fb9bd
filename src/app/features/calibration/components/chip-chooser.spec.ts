import { TestBed } from '@angular/core/testing';

import { ChipSet } from '../../../shared/chips/chip-catalogue';
import { TEST_CHIPS, TEST_SETS } from '../../../shared/testing/chip-fixtures';
import { ChipChooser } from './chip-chooser';

describe('ChipChooser', () => {
  const set = new ChipSet(TEST_SETS[0], TEST_CHIPS);

  function render(value: string | null = null) {
    const fixture = TestBed.createComponent(ChipChooser);
    fixture.componentRef.setInput('set', set);
    fixture.componentRef.setInput('value', value);
    const confirmed: string[] = [];
    fixture.componentInstance.confirmed.subscribe((code) => confirmed.push(code));
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const tap = (code: string) => {
      el.querySelector<HTMLButtonElement>(`[data-code="${code}"]`)!.click();
      fixture.detectChanges();
    };
    const confirmButton = () => el.querySelector<HTMLButtonElement>('button.confirm');
    return { fixture, el, tap, confirmed, confirmButton };
  }

  it('should show only field chips first, codes under the swatches', () => {
    const { el, confirmButton } = render();
    expect(el.textContent).toContain('Step 1 of 2');
    const codes = Array.from(el.querySelectorAll('hl-swatch-grid .code')).map((c) => c.textContent?.trim());
    expect(codes).toEqual(['F-001', 'F-002']);
    expect(confirmButton()).toBeNull();
  });

  it('should open the fine chips of the field chip tapped, then confirm the fine chip picked', () => {
    const { el, tap, confirmed, confirmButton } = render();
    tap('F-001');
    expect(el.textContent).toContain('Step 2 of 2: fine chips of F-001');
    const fines = Array.from(el.querySelectorAll('hl-swatch-grid .code')).map((c) => c.textContent?.trim());
    expect(fines).toEqual(['F-001.001', 'F-001.002']);
    tap('F-001.002');
    expect(el.querySelector('.confirm-bar')!.textContent).toContain('F-001.002');
    expect(confirmed).toEqual([]);
    confirmButton()!.click();
    expect(confirmed).toEqual(['F-001.002']);
  });

  it('should let the field chip itself be kept and confirmed', () => {
    const { tap, confirmed, confirmButton } = render();
    tap('F-002');
    confirmButton()!.click();
    expect(confirmed).toEqual(['F-002']);
  });

  it('should go back to the field chips without a pick', () => {
    const { el, tap, fixture } = render();
    tap('F-002');
    el.querySelector<HTMLButtonElement>('button.back')!.click();
    fixture.detectChanges();
    expect(el.textContent).toContain('Step 1 of 2');
    expect(el.querySelector('button.confirm')).toBeNull();
  });

  it('should start at an earlier pick and only allow confirming a different chip', () => {
    const { el, tap, confirmed, confirmButton } = render('F-001.001');
    expect(el.textContent).toContain('fine chips of F-001');
    expect(el.textContent).toContain('your current pick');
    expect(confirmButton()!.disabled).toBe(true);
    tap('F-001.002');
    expect(confirmButton()!.disabled).toBe(false);
    confirmButton()!.click();
    expect(confirmed).toEqual(['F-001.002']);
  });

  it('should start afresh for the next specimen even when neither has a pick', () => {
    const { fixture, el, tap } = render();
    fixture.componentRef.setInput('key', 1);
    fixture.detectChanges();
    tap('F-001');
    tap('F-001.001');
    fixture.componentRef.setInput('key', 2);
    fixture.detectChanges();
    expect(el.textContent).toContain('Step 1 of 2');
    expect(el.querySelector('button.confirm')).toBeNull();
  });

  it('should not confirm once choosing is closed', () => {
    const { fixture, tap, confirmButton } = render();
    fixture.componentRef.setInput('enabled', false);
    tap('F-002');
    expect(confirmButton()!.disabled).toBe(true);
  });
});
