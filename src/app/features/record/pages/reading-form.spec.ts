import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { signal } from '@angular/core';
import { TestBed, type ComponentFixture } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import { AuthStore } from '../../../core/auth/auth-store';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { IS_ONLINE } from '../../../core/offline/offline-queue';
import { CUT_SECONDS_WARN } from '../../../../../shared/api/reading-answers.js';
import { READING_DRAFT_KEY, READING_MEMORY_KEY } from '../data/reading-memory';
import { TEST_ACCESSIONS, TEST_CHARACTERS, TEST_SITES } from '../../../shared/testing/collection-fixtures';
import { TEST_CHIPS, TEST_SETS } from '../../../shared/testing/chip-fixtures';
import { ReadingForm } from './reading-form';

/** What GET /api/progress answers in these tests: 4 of 10 plants fully characterised. */
const PROGRESS_COUNTS = { complete: 4, partial: 1, 'not-started': 5 };

describe('ReadingForm', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    localStorage.clear();
    sessionStorage.clear();
    TestBed.configureTestingModule({
      providers: [
        provideRouter([]),
        provideHttpClient(withInterceptors([errorInterceptor])),
        provideHttpClientTesting(),
        // New readings are saved through the offline queue, which keeps who saved them.
        { provide: AuthStore, useValue: { currentUser: signal({ id: 7, email: 'rec@demo.test', name: 'Rowan Field', role: 'recorder' }), forget: () => undefined } },
      ],
    });
  });

  /** Lets the offline queue store the reading before it sends it, and take in the answer after. */
  const settle = () => new Promise((resolve) => setTimeout(resolve, 0));

  afterEach(() => {
    vi.useRealTimers();
    // The match preview loads the chips once a colour is typed; these tests do not look at it.
    http.match((r) => r.url.startsWith('/api/reference-sets')).forEach((r) => r.flush([]));
    // "Next plant" brings the season's count back, which asks again.
    http.match('/api/progress').forEach((r) => r.flush({ plants: [], counts: PROGRESS_COUNTS }));
    http.verify();
  });

  async function open(queryParams: Record<string, string> = {}): Promise<{ fixture: ComponentFixture<ReadingForm>; el: HTMLElement }> {
    http = TestBed.inject(HttpTestingController);
    const fixture = TestBed.createComponent(ReadingForm);
    // The router binds the address's query parameters to inputs of the same name.
    for (const [name, value] of Object.entries(queryParams)) fixture.componentRef.setInput(name, value);
    fixture.detectChanges();
    http.expectOne('/api/accessions').flush(TEST_ACCESSIONS);
    http.expectOne('/api/sites').flush(TEST_SITES);
    http.expectOne('/api/characters').flush(TEST_CHARACTERS);
    if (queryParams['correct']) http.expectOne(`/api/readings/${queryParams['correct']}`).flush(savedReading());
    // The season's count sits on top of a new reading (not on a correction or from a plant sheet).
    http.match('/api/progress').forEach((r) => r.flush({ plants: [], counts: PROGRESS_COUNTS }));
    await fixture.whenStable();
    fixture.detectChanges();
    return { fixture, el: fixture.nativeElement as HTMLElement };
  }

  function click(el: HTMLElement, text: string): void {
    const button = [...el.querySelectorAll('button')].find((b) => b.textContent?.includes(text));
    if (!button) throw new Error(`no button "${text}"`);
    button.click();
  }

  function form(fixture: ComponentFixture<ReadingForm>) {
    return (fixture.componentInstance as unknown as { form: ReturnType<typeof import('../data/reading-draft').buildReadingForm> }).form;
  }

  it('should start from the remembered accession, character and light, with the site of the accession', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture, el } = await open();
    expect(form(fixture).getRawValue()).toMatchObject({ accessionId: 1, characterId: 5, light: 'overcast', siteId: 1 });
    expect((el.querySelector('hl-accession-picker input') as HTMLInputElement).value).toBe('HL-0001 · Purple Dawn');
    expect(el.querySelector('.lights [aria-checked=true]')?.textContent).toContain('Overcast');
    expect(el.textContent).toContain('Read the outer face below the blade.');
  });

  it('should show this season’s count of characterised plants on Record, the recorder’s home', async () => {
    const { el } = await open();
    expect(el.querySelector('hl-progress-summary')?.textContent?.replace(/\s+/g, ' ')).toContain('4 of 10 plants characterised this season');
  });

  it('should ask an instrument reading for the illuminant/observer instead of the light, and say 10° and 2° cannot be converted', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture, el } = await open();
    expect(el.querySelector('.lights')).not.toBeNull();
    click(el, 'Instrument L*a*b*');
    fixture.detectChanges();
    expect(el.querySelector('.lights')).toBeNull();
    expect(el.textContent).not.toContain('Choose the light you read in.');
    expect([...el.querySelectorAll('.illuminants [role=radio]')].map((b) => b.querySelector('.choice-label')?.textContent?.trim())).toEqual(['D65 / 10°', 'D65 / 2°', 'D50 / 2°', 'Other']);
    expect(el.querySelector('.illuminant-note')?.textContent).toContain('cannot be converted exactly without the spectrum');
    form(fixture).controls.lab.setValue({ l: 40, a: 10, b: 5 });
    click(el, 'Save reading');
    fixture.detectChanges();
    expect(el.textContent).toContain('Choose the illuminant/observer the instrument reports');
    click(el, 'D50 / 2°');
    click(el, 'Save reading');
    await settle();
    const request = http.expectOne('/api/readings');
    expect(request.request.body).toMatchObject({ method: 'instrument', lab: [40, 10, 5], illuminant: 'D50/2' });
    expect('light' in request.request.body).toBe(false);
    request.flush(savedReading());
  });

  it('should take the site from the plant', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture } = await open();
    form(fixture).controls.plantId.setValue(12);
    expect(form(fixture).controls.siteId.value).toBe(2);
  });

  it('should send nothing while answers are missing, and say what is missing', async () => {
    const { fixture, el } = await open();
    click(el, 'Save reading');
    fixture.detectChanges();
    expect(el.querySelector('.problems')?.textContent).toContain('missing');
    expect(el.textContent).toContain('Choose how you read the colour.');
    expect(el.textContent).toContain('Choose the light you read in.');
  });

  it('should mark the missing accession, and put the cursor in it, the first field with a problem', async () => {
    const { fixture, el } = await open();
    const input = el.querySelector('hl-accession-picker input') as HTMLInputElement;
    expect(input.required).toBe(true);
    click(el, 'Save reading');
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el.querySelector('hl-accession-picker .field-error')?.textContent).toContain('Choose the accession');
    expect(input.getAttribute('aria-invalid')).toBe('true');
    expect(document.activeElement).toBe(input);
  });

  it('should take a negative a* typed as text, and flip b* with the ± key', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture, el } = await open();
    click(el, 'Instrument L*a*b*');
    fixture.detectChanges();
    const inputs = [...el.querySelectorAll('hl-lab-fields input')] as HTMLInputElement[];
    expect(inputs.map((i) => i.type)).toEqual(['text', 'text', 'text']);
    const type = (input: HTMLInputElement, text: string) => {
      input.value = text;
      input.dispatchEvent(new Event('input'));
    };
    type(inputs[0]!, '41,5');
    type(inputs[1]!, '\u221212.5');
    type(inputs[2]!, '8');
    (el.querySelector('button[aria-label="Change the sign of b*"]') as HTMLButtonElement).click();
    fixture.detectChanges();
    expect(form(fixture).controls.lab.getRawValue()).toEqual({ l: 41.5, a: -12.5, b: -8 });
    expect(inputs[2]!.value).toBe('-8');
    type(inputs[1]!, '12-');
    fixture.detectChanges();
    expect(form(fixture).controls.lab.controls.a.hasError('number')).toBe(true);
  });

  it('should open on the plant and character of the sheet, and offer the next character on that plant after saving', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 2, characterId: 7, light: 'overcast', method: 'instrument', instrument: 'Bench spectro A', illuminant: 'D65/10' }));
    const { fixture, el } = await open({ sheet: '11', character: '5' });
    const f = form(fixture);
    expect(f.getRawValue()).toMatchObject({ accessionId: 1, plantId: 11, characterId: 5, method: 'instrument', light: 'overcast', instrument: 'Bench spectro A', illuminant: 'D65/10', siteId: 1 });
    f.controls.lab.setValue({ l: 40, a: 10, b: 5 });
    click(el, 'Save reading');
    await settle();
    http.expectOne('/api/readings').flush(savedReading());
    await settle();
    fixture.detectChanges();
    expect(el.textContent).not.toContain('Next plant');
    click(el, 'Next character on this plant');
    const sheet = http.expectOne('/api/plants/11/sheet');
    const row = (id: number, status: string) => ({ key: `c${id}`, sortOrder: id, colour: { characterId: id, code: `c${id}`, label: `C${id}`, organ: 'corm', caution: null, status, reading: null, skip: null }, descriptor: null });
    sheet.flush({ plant: { id: 11 }, accession: { id: 1 }, site: { id: 1 }, rows: [row(5, 'done'), row(7, 'todo')], progress: {} });
    await fixture.whenStable();
    fixture.detectChanges();
    expect(f.getRawValue()).toMatchObject({ accessionId: 1, plantId: 11, characterId: 7, method: 'instrument', light: 'overcast', instrument: 'Bench spectro A', illuminant: 'D65/10', lab: { l: null, a: null, b: null } });
    expect(el.textContent).toContain('Save reading');
  });

  it('should say there is no connection before anything is saved, and drop the notice once it is back', async () => {
    let online = false;
    TestBed.overrideProvider(IS_ONLINE, { useValue: () => online });
    const { fixture, el } = await open();
    expect(el.querySelector('.offline-banner')?.textContent).toContain('No connection');
    online = true;
    window.dispatchEvent(new Event('online'));
    fixture.detectChanges();
    expect(el.querySelector('.offline-banner')).toBeNull();
  });

  it('should show the server’s refusal beside the field it names', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture, el } = await open();
    click(el, 'Instrument L*a*b*');
    fixture.detectChanges();
    click(el, 'D65 / 10°');
    form(fixture).controls.lab.setValue({ l: 40, a: 10, b: 5 });
    click(el, 'Save reading');
    await settle();
    const request = http.expectOne('/api/readings');
    expect(request.request.body).toMatchObject({ method: 'instrument', lab: [40, 10, 5], accessionId: 1, characterId: 5, siteId: 1, illuminant: 'D65/10' });
    expect(request.request.body.light).toBeUndefined();
    const key = request.request.headers.get('Idempotency-Key');
    expect(key).toMatch(/^[A-Za-z0-9_-]{16,100}$/);
    request.flush(
      { type: 'about:blank', title: 'Invalid request', status: 400, errors: [{ field: 'lab.1', message: 'a* is not what the instrument can read' }] },
      { status: 400, statusText: 'Bad Request', headers: { 'Content-Type': 'application/problem+json' } },
    );
    await settle();
    fixture.detectChanges();
    const errors = [...el.querySelectorAll('hl-lab-fields mat-error')].map((e) => e.textContent?.trim());
    expect(errors).toEqual(['a* is not what the instrument can read']);
    // Corrected answers are a new request, with a new key.
    form(fixture).controls.lab.controls.a.setValue(12);
    click(el, 'Save reading');
    await settle();
    const again = http.expectOne('/api/readings');
    expect(again.request.headers.get('Idempotency-Key')).not.toBe(key);
    again.flush(savedReading());
  });

  it('should remember the choices after saving and keep them for the next plant', async () => {
    const { fixture, el } = await open();
    const f = form(fixture);
    f.patchValue({ accessionId: 1, plantId: 11, characterId: 5 });
    click(el, 'Overcast');
    click(el, 'Instrument L*a*b*');
    fixture.detectChanges();
    click(el, 'D50 / 2°');
    f.controls.lab.setValue({ l: 40, a: 10, b: 5 });
    f.controls.notes.setValue('after rain');
    expect(sessionStorage.getItem(READING_DRAFT_KEY)).toContain('after rain');
    click(el, 'Save reading');
    await settle();
    http.expectOne('/api/readings').flush(savedReading());
    await settle();
    fixture.detectChanges();
    expect(el.textContent).toContain('Saved as reading 31');
    expect(el.textContent).toContain('F-150.004');
    expect(el.textContent).toContain('close');
    expect(JSON.parse(localStorage.getItem(READING_MEMORY_KEY)!)).toEqual({ accessionId: 1, characterId: 5, light: 'overcast', method: 'instrument', instrument: null, illuminant: 'D50/2' });
    expect(sessionStorage.getItem(READING_DRAFT_KEY)).toBeNull();
    click(el, 'Next plant');
    fixture.detectChanges();
    expect(f.getRawValue()).toMatchObject({ accessionId: 1, characterId: 5, light: 'overcast', method: 'instrument', illuminant: 'D50/2', plantId: null, notes: null, lab: { l: null, a: null, b: null } });
  });

  it('should keep the reading on the phone and say "Saved — waiting to send" when there is no connection', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture, el } = await open();
    click(el, 'Instrument L*a*b*');
    fixture.detectChanges();
    click(el, 'D65 / 2°');
    form(fixture).controls.lab.setValue({ l: 40, a: 10, b: 5 });
    click(el, 'Save reading');
    await settle();
    http.expectOne('/api/readings').error(new ProgressEvent('error'));
    await settle();
    fixture.detectChanges();
    expect(el.querySelector('.saved.queued')?.textContent).toContain('Saved — waiting to send.');
    expect(el.querySelector('a[href="/queue"]')).not.toBeNull();
    expect(el.textContent).toContain('Next plant');
    // No chips on this phone yet: the screen says the server will match.
    expect(el.querySelector('.provisional-none')?.textContent).toContain('worked out when the reading reaches the server');
  });

  it('should show the provisional chip, worked out on the phone, on the "saved — waiting to send" screen', async () => {
    localStorage.setItem(READING_MEMORY_KEY, JSON.stringify({ accessionId: 1, characterId: 5, light: 'overcast' }));
    const { fixture, el } = await open();
    click(el, 'Instrument L*a*b*');
    fixture.detectChanges();
    click(el, 'D65 / 2°');
    form(fixture).controls.lab.setValue({ l: 45.5, a: 40.2, b: 20.3 });
    fixture.detectChanges();
    // The chips the phone holds (the match preview asked for them once a colour was typed).
    http.expectOne('/api/reference-sets').flush(TEST_SETS);
    http.expectOne('/api/reference-sets/v2/chips').flush(TEST_CHIPS);
    click(el, 'Save reading');
    await settle();
    http.expectOne('/api/readings').error(new ProgressEvent('error'));
    await settle();
    fixture.detectChanges();
    const shown = el.querySelector('.saved.queued .provisional');
    // Nearest of the five invented chips to L*a*b* 45.5, 40.2, 20.3 by ΔE00: F-001 (45, 40, 20).
    expect(shown?.querySelector('.chip-code')?.textContent?.trim()).toBe('F-001');
    expect(shown?.querySelector('.hl-swatch-surround .swatch')?.getAttribute('aria-label')).toBe('Chip F-001');
    expect(shown?.textContent).toContain('Provisional:');
    expect(shown?.textContent).toContain('server\'s match replaces it');
    expect(el.querySelector('.provisional-none')).toBeNull();
  });

  it('should open a correction filled in, ask the reason and post it to the supersede route', async () => {
    const { fixture, el } = await open({ correct: '31' });
    expect(el.querySelector('h1')?.textContent).toContain('Correct reading 31');
    expect(form(fixture).getRawValue()).toMatchObject({ accessionId: 1, plantId: 11, characterId: 5, method: 'instrument', lab: { l: 40, a: 10, b: 5 }, light: 'overcast', instrument: 'Meter 2' });
    click(el, 'Save correction');
    fixture.detectChanges();
    expect(el.textContent).toContain('Say why the reading is corrected.');
    form(fixture).controls.reason.setValue('wrong plant');
    form(fixture).controls.plantId.setValue(12);
    click(el, 'Save correction');
    const request = http.expectOne('/api/readings/31/supersede');
    expect(request.request.body).toMatchObject({ reason: 'wrong plant', plantId: 12, siteId: 2, method: 'instrument', lab: [40, 10, 5], instrument: 'Meter 2' });
    request.flush({ ...savedReading(), id: 32 });
    fixture.detectChanges();
    expect(el.textContent).toContain('Saved as reading 32');
  });

  it('should count seconds from the cut for a corm character and warn past the limit', async () => {
    const { fixture, el } = await open();
    vi.useFakeTimers();
    expect(el.querySelector('hl-cut-timer')).toBeNull();
    form(fixture).controls.characterId.setValue(7);
    fixture.detectChanges();
    expect(el.textContent).toContain('Wear gloves and never taste raw tissue.');
    click(el, 'Cut now');
    vi.advanceTimersByTime(CUT_SECONDS_WARN * 1000);
    fixture.detectChanges();
    expect(form(fixture).controls.secondsSinceCut.value).toBe(CUT_SECONDS_WARN);
    expect(el.querySelector('hl-cut-timer [role=alert]')).toBeNull();
    vi.advanceTimersByTime(2000);
    fixture.detectChanges();
    expect(form(fixture).controls.secondsSinceCut.value).toBe(CUT_SECONDS_WARN + 2);
    expect(el.querySelector('hl-cut-timer [role=alert]')?.textContent).toContain('since the cut');
  });
});

function savedReading() {
  return {
    id: 31,
    accessionId: 1,
    plantId: 11,
    characterId: 5,
    siteId: 1,
    light: 'overcast',
    secondsSinceCut: null,
    leafPosition: null,
    notes: null,
    provenance: { instrument: 'Meter 2', illuminant: 'D65/2', reportedLab: null, source: null, photoId: null, region: null, neutralRegion: null },
    accessionNumber: 'HL-0001',
    plantLabel: 'P1',
    characterLabel: 'Petiole, upper third',
    method: 'instrument',
    hex: '#7a3f6e',
    lab: [40, 10, 5],
    lch: [40, 11.2, 26.6],
    inGamut: true,
    bestChip: 'F-150.004',
    deltaE00: 1.2,
    verdict: 'close',
    eyeChipCode: null,
    matches: [],
    between: null,
  };
}
