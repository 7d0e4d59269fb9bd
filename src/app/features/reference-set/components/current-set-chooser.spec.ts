import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { ReferenceSetSummary } from '../../../../../shared/api/reference-set-answers.js';
import { TEST_SETS } from '../../../shared/testing/chip-fixtures';
import { CurrentSetChooser } from './current-set-chooser';

describe('CurrentSetChooser', () => {
  it('should send the chosen set and say that new readings will be matched against it', async () => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(CurrentSetChooser);
    const emitted: string[] = [];
    fixture.componentInstance.changed.subscribe((id) => emitted.push(id));
    const sets: ReferenceSetSummary[] = TEST_SETS.map((s) => ({ ...s, current: s.id === 'v1' }));
    http.expectOne('/api/reference-sets').flush(sets);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    const button = el.querySelector('button')!;
    expect(button.disabled).toBe(true);
    (fixture.componentInstance as unknown as { chosen: { set(v: string): void } }).chosen.set('v2');
    fixture.detectChanges();
    expect(button.disabled).toBe(false);
    button.click();
    const put = http.expectOne('/api/reference-sets/current');
    expect(put.request.method).toBe('PUT');
    expect(put.request.body).toEqual({ setId: 'v2' });
    put.flush(TEST_SETS);
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el.querySelector('[role=status]')?.textContent).toContain('Set v2 is now current');
    expect(emitted).toEqual(['v2']);
    http.verify();
  });
});
