import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpEventType } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { By } from '@angular/platform-browser';
import { provideRouter, Router } from '@angular/router';

import type { PhotoDto, PhotoSample } from '../../../../../shared/api/photo-answers.js';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { PhotoCanvas } from '../../../shared/photos/photo-canvas';
import { PhotoPage } from './photo-page';

const photo: PhotoDto = {
  id: 12,
  width: 4000,
  height: 3000,
  sha256: 'b'.repeat(64),
  sourceProfile: 'Display P3',
  mime: 'image/jpeg',
  capturedAt: null,
  orientation: 6,
  byteSize: 1000,
  uploadedById: 1,
  createdAt: '2026-03-14T00:00:00.000Z',
  imageUrl: '/api/photos/12/image',
  thumbUrl: '/api/photos/12/thumb',
};

describe('PhotoPage', () => {
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({
      providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()],
    });
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  function choose(fixture: ReturnType<typeof TestBed.createComponent<PhotoPage>>): void {
    const input = fixture.nativeElement.querySelector('input[type=file]:not([capture])') as HTMLInputElement;
    Object.defineProperty(input, 'files', { value: [new File(['x'], 'petiole.jpg', { type: 'image/jpeg' })] });
    input.dispatchEvent(new Event('change'));
    fixture.detectChanges();
  }

  it('should show upload progress, then the photo, and remember it in the address', async () => {
    const fixture = TestBed.createComponent(PhotoPage);
    fixture.detectChanges();
    const el = fixture.nativeElement as HTMLElement;
    expect(el.textContent).toContain('Take photo');
    choose(fixture);
    const request = http.expectOne('/api/photos');
    request.event({ type: HttpEventType.UploadProgress, loaded: 1, total: 4 });
    fixture.detectChanges();
    expect(el.textContent).toContain('Uploading 25 %');
    request.flush(photo);
    fixture.detectChanges();
    await fixture.whenStable();
    expect(el.querySelector('hl-photo-canvas img')?.getAttribute('src')).toBe('/api/photos/12/image');
    expect(el.textContent).toContain('New photo');
    expect(TestBed.inject(Router).url).toBe('/?photo=12');
  });

  it('should ask the server for the reading of a drawn region, balanced on the card once one is marked', () => {
    const fixture = TestBed.createComponent(PhotoPage);
    fixture.detectChanges();
    choose(fixture);
    http.expectOne('/api/photos').flush(photo);
    fixture.detectChanges();
    const canvas = fixture.debugElement.query(By.directive(PhotoCanvas)).componentInstance as PhotoCanvas;

    const region = { shape: 'rect' as const, x: 100, y: 100, width: 400, height: 300 };
    canvas.regionDrawn.emit(region);
    const first = http.expectOne('/api/photos/12/sample');
    expect(first.request.body).toEqual({ region });
    first.flush({ ...sampleAnswer(), correction: { kind: 'none' } });
    fixture.detectChanges();
    expect((fixture.nativeElement as HTMLElement).textContent).toContain('F-150.004');

    (fixture.nativeElement.querySelector('.marking mat-button-toggle:nth-child(2) button') as HTMLButtonElement).click();
    fixture.detectChanges();
    const card = { shape: 'rect' as const, x: 3000, y: 100, width: 300, height: 300 };
    canvas.regionDrawn.emit(card);
    const second = http.expectOne('/api/photos/12/sample');
    expect(second.request.body).toEqual({ region, neutral: { region: card } });
    second.flush(sampleAnswer());
  });

  it('should show a refusal in words', () => {
    const fixture = TestBed.createComponent(PhotoPage);
    fixture.detectChanges();
    choose(fixture);
    http.expectOne('/api/photos').flush(
      { type: 'x', title: 'Not a photo', status: 415, detail: 'The file is not an image the server can read.' },
      { status: 415, statusText: 'Unsupported Media Type' },
    );
    fixture.detectChanges();
    expect((fixture.nativeElement as HTMLElement).querySelector('[role=alert]')?.textContent).toContain('not an image');
  });
});

function sampleAnswer(): PhotoSample {
  return {
    photoId: 12,
    region: { shape: 'rect', x: 100, y: 100, width: 400, height: 300 },
    lab: [32, 30, -12],
    lch: [32, 32.3, 338],
    hex: '#6b2d5c',
    inGamut: true,
    pixelCount: 120000,
    pixelsDropped: 0,
    clipped: 0,
    dark: 0,
    spreadDeltaE00: 1,
    spreadPixels: 5000,
    uniform: true,
    clusters: [],
    correction: { kind: 'none' },
    matches: [{ code: 'F-150.004', parent: 'F-150', name: 'plum L32 C32', hex: '#6a2e5b', lab: [32, 30, -12], deltaE00: 0.4, verdict: 'indistinguishable' }],
    between: null,
    setId: 'v1',
    pipeline: 'photo-sample/1',
  };
}
