import { provideHttpClient } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { ComponentFixture, TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { MatchAnswer } from '../../../../../shared/api/reference-set-answers.js';
import { TEST_CHIPS, TEST_SETS } from '../../../shared/testing/chip-fixtures';
import { MatchPage } from './match-page';

describe('MatchPage', () => {
  let fixture: ComponentFixture<MatchPage>;
  let http: HttpTestingController;
  let element: HTMLElement;

  beforeEach(async () => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(), provideHttpClientTesting()] });
    http = TestBed.inject(HttpTestingController);
    fixture = TestBed.createComponent(MatchPage);
    element = fixture.nativeElement as HTMLElement;
    await fixture.whenStable();
    http.expectOne('/api/reference-sets').flush(TEST_SETS);
    http.expectOne('/api/reference-sets/v2/chips').flush(TEST_CHIPS);
    await fixture.whenStable();
  });

  afterEach(() => http.verify());

  async function typeHex(text: string): Promise<void> {
    const input = element.querySelector<HTMLInputElement>('input[formcontrolname="hex"]')!;
    input.value = text;
    input.dispatchEvent(new Event('input'));
    await fixture.whenStable();
  }

  const strip = () => Array.from(element.querySelectorAll('hl-match-strip .code')).map((e) => e.textContent?.trim());

  it('should show the nearest chips at once from the loaded set, then the server’s answer when it comes', async () => {
    await typeHex('#ad4c4b');
    expect(strip()[0]).toBe('F-001');
    expect(element.textContent).toContain('checking with the server');
    expect(element.textContent).toContain('indistinguishable');

    await new Promise((resolve) => setTimeout(resolve, 350));
    const req = http.expectOne('/api/match');
    expect(req.request.body).toEqual({ hex: '#ad4c4b', k: 5 });
    const serverAnswer: MatchAnswer = {
      input: { lab: [45, 40, 20], lch: [45, 44.72, 26.57], hex: '#ad4c4b', inGamut: true },
      matches: [
        { code: 'F-001.002', parent: 'F-001', name: 'wine L44 C42', hex: '#a44a4a', lab: [44, 38, 18], deltaE00: 1.2, verdict: 'close' },
        { code: 'F-001', parent: null, name: 'wine L45 C45', hex: '#ad4c4b', lab: [45, 40, 20], deltaE00: 2.5, verdict: 'clearly different' },
      ],
      between: { a: 'F-001.002', b: 'F-001', t: 0.3 },
      setId: 'v2',
    };
    req.flush(serverAnswer);
    await fixture.whenStable();

    // The server's answer is the one shown, even where it differs from the device's.
    expect(strip()).toEqual(['F-001.002', 'F-001']);
    expect(element.textContent).toContain('Checked by the server against set v2');
    expect(element.textContent).toContain('between F-001.002 and F-001, nearer F-001.002');
    expect(element.textContent).toContain('clearly different');
  });

  it('should show nothing and ask nobody for text that is not a hex colour', async () => {
    await typeHex('#a4504');
    await new Promise((resolve) => setTimeout(resolve, 350));
    http.expectNone('/api/match');
    expect(strip()).toEqual([]);
    expect(element.textContent).toContain('Enter a colour');
  });

  it('should keep the device’s answer and say so when the server cannot be reached', async () => {
    await typeHex('#368741');
    await new Promise((resolve) => setTimeout(resolve, 350));
    http.expectOne('/api/match').error(new ProgressEvent('error'));
    await fixture.whenStable();
    expect(strip()[0]).toBe('F-002');
    expect(element.textContent).toContain('Worked out on this device');
    expect(element.textContent).toContain('the server did not answer');
  });

  it('should carry the screen caution beside the swatches', async () => {
    await typeHex('#ad4c4b');
    expect(element.textContent).toContain('Screen colours are approximate; judge against the physical chip in good light.');
    await new Promise((resolve) => setTimeout(resolve, 350));
    http.expectOne('/api/match');
  });
});
