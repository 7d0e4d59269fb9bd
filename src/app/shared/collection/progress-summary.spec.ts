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

  it('should hold the summary’s place while the count loads, so the page does not jump under a tap', () => {
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ProgressSummary);
    fixture.detectChanges();
    const pending = (fixture.nativeElement as HTMLElement).querySelector('.summary');
    expect(pending?.getAttribute('aria-busy')).toBe('true');
    expect(pending?.textContent).toContain('Counting this season');
    http.expectOne('/api/progress');
  });

  it('should show nothing, and throw nothing, when the count cannot be had (no connection)', async () => {
    const http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ProgressSummary);
    fixture.detectChanges();
    http.expectOne('/api/progress').error(new ProgressEvent('error'));
    await fixture.whenStable();
    expect(() => fixture.detectChanges()).not.toThrow();
    expect((fixture.nativeElement as HTMLElement).querySelector('.summary')).toBeNull();
    http.verify();
  });
});
