import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { ProgressSummary } from './progress-summary';

describe('ProgressSummary', () => {
  beforeEach(() => TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] }));

  it('should say how many of all the plants are characterised this season, and lead to the table', async () => {
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ProgressSummary);
    fixture.detectChanges();
    http.expectOne('/api/progress').flush({ plants: [], counts: { complete: 3, partial: 2, 'not-started': 7 } });
    await fixture.whenStable();
    fixture.detectChanges();
    const link = (fixture.nativeElement as HTMLElement).querySelector('a')!;
    expect(link.textContent?.replace(/\s+/g, ' ')).toContain('3 of 12 plants characterised this season · 2 partly, 7 not started');
    expect(link.getAttribute('href')).toBe('/collection/progress');
    http.verify();
  });

  it('should show nothing, and throw nothing, when the count cannot be had (no connection)', async () => {
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ProgressSummary);
    fixture.detectChanges();
    http.expectOne('/api/progress').error(new ProgressEvent('error'));
    await fixture.whenStable();
    expect(() => fixture.detectChanges()).not.toThrow();
    expect((fixture.nativeElement as HTMLElement).querySelector('a')).toBeNull();
    http.verify();
  });
});
