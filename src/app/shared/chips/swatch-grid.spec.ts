import { ComponentFixture, TestBed } from '@angular/core/testing';

import { TEST_CHIPS } from '../testing/chip-fixtures';
import { SwatchGrid } from './swatch-grid';

describe('SwatchGrid', () => {
  let fixture: ComponentFixture<SwatchGrid>;
  let element: HTMLElement;
  let chosen: string[];

  beforeEach(async () => {
    fixture = TestBed.createComponent(SwatchGrid);
    fixture.componentRef.setInput('chips', TEST_CHIPS);
    fixture.componentRef.setInput('label', 'test chips');
    fixture.componentRef.setInput('selected', 'F-001.001');
    chosen = [];
    fixture.componentInstance.chosen.subscribe((code) => chosen.push(code));
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
  });

  const buttons = () => Array.from(element.querySelectorAll<HTMLButtonElement>('button.chip'));

  it('should show every chip as a button with its code beneath', () => {
    expect(buttons().map((b) => b.querySelector('.code')?.textContent?.trim())).toEqual(TEST_CHIPS.map((c) => c.code));
    expect(buttons()[0].getAttribute('aria-label')).toBe('F-001, wine L45 C45');
  });

  it('should mark the chosen chip as pressed, not by colour alone', () => {
    expect(buttons().filter((b) => b.getAttribute('aria-pressed') === 'true').map((b) => b.dataset['code'])).toEqual(['F-001.001']);
  });

  it('should open a chip when it is clicked', () => {
    buttons()[3].click();
    expect(chosen).toEqual(['F-002']);
  });

  it('should move focus with the arrow keys, Home and End', () => {
    buttons()[1].focus();
    buttons()[1].dispatchEvent(new KeyboardEvent('keydown', { key: 'ArrowRight', bubbles: true }));
    expect(document.activeElement).toBe(buttons()[2]);
    buttons()[2].dispatchEvent(new KeyboardEvent('keydown', { key: 'End', bubbles: true }));
    expect(document.activeElement).toBe(buttons()[4]);
    buttons()[4].dispatchEvent(new KeyboardEvent('keydown', { key: 'Home', bubbles: true }));
    expect(document.activeElement).toBe(buttons()[0]);
  });
});
