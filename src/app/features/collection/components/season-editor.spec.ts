import { TestBed } from '@angular/core/testing';
import { NonNullableFormBuilder } from '@angular/forms';

import { seasonArray } from '../data/season-form';
import { SeasonEditor } from './season-editor';

describe('SeasonEditor', () => {
  function render(seasons: { name: string; start: string; end: string }[]) {
    const array = seasonArray(TestBed.inject(NonNullableFormBuilder), seasons);
    const fixture = TestBed.createComponent(SeasonEditor);
    fixture.componentRef.setInput('seasons', array);
    fixture.detectChanges();
    return { array, fixture, element: fixture.nativeElement as HTMLElement };
  }

  it('should say every day is covered by one season for wet across the year end and dry', () => {
    const { element } = render([
      { name: 'Wet', start: '11-01', end: '04-30' },
      { name: 'Dry', start: '05-01', end: '10-31' },
    ]);
    expect(element.querySelector('.problem.ok')?.textContent).toContain('Every day of the year falls in exactly one season.');
    expect(element.querySelectorAll('hl-year-ring path.arc').length).toBe(2);
  });

  it('should show an overlap in words with an icon as soon as a date is typed', () => {
    const { array, fixture, element } = render([
      { name: 'Wet', start: '11-01', end: '04-30' },
      { name: 'Dry', start: '05-01', end: '10-31' },
    ]);
    array.at(1).controls.start.setValue('04-15');
    fixture.detectChanges();
    const problem = element.querySelector('.problem:not(.ok)');
    expect(problem?.textContent).toContain('Overlap:');
    expect(problem?.textContent).toContain('“Wet” and “Dry” both cover 15 Apr–30 Apr');
    expect(problem?.querySelector('mat-icon')?.textContent).toBe('layers');
    // The overlapping season moves to an inner track of the ring.
    expect(element.querySelectorAll('hl-year-ring circle.track').length).toBe(2);
  });

  it('should hatch and mark uncovered days, and list them as a gap', () => {
    const { element } = render([{ name: 'Long', start: '01-11', end: '11-30' }]);
    expect(element.querySelector('.problem.warning')?.textContent).toContain('No season covers 1 Dec–10 Jan');
    expect(element.querySelectorAll('hl-year-ring path.gap').length).toBe(1);
    expect(element.querySelectorAll('hl-year-ring .gap-mark').length).toBe(1);
  });

  it('should add and remove rows', () => {
    const { array, fixture, element } = render([{ name: 'Wet', start: '11-01', end: '04-30' }]);
    (element.querySelector('.hl-actions button') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(array.length).toBe(2);
    (element.querySelector('button[aria-label="Remove season 1"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(array.length).toBe(1);
    expect(array.at(0).controls.name.value).toBe('');
  });
});
