import { provideHttpClient } from '@angular/common/http';
import { HttpEventType } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';

import type { PhotoDto } from '../../../../shared/api/photo-answers.js';
import { PhotosApi, type UploadProgress } from './photos-api';

const photo = { id: 7, width: 4000, height: 3000, sha256: 'a'.repeat(64), sourceProfile: 'Display P3' } as PhotoDto;

describe('PhotosApi', () => {
  let api: PhotosApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideHttpClient(), provideHttpClientTesting()] });
    api = TestBed.inject(PhotosApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should upload the file in the photo field and report progress, then the photo', () => {
    const seen: UploadProgress[] = [];
    api.upload(new Blob(['x'], { type: 'image/jpeg' }), 'leaf.jpg').subscribe((p) => seen.push(p));
    const request = http.expectOne('/api/photos');
    expect(request.request.method).toBe('POST');
    expect((request.request.body as FormData).get('photo')).toBeInstanceOf(Blob);
    expect(request.request.reportProgress).toBe(true);
    request.event({ type: HttpEventType.UploadProgress, loaded: 50, total: 200 });
    request.flush(photo);
    expect(seen).toEqual([
      { kind: 'progress', fraction: 0.25 },
      { kind: 'done', photo },
    ]);
  });

  it('should post the region to the sample route', () => {
    api.sample(7, { region: { shape: 'point', x: 10, y: 20, radius: 5 } }).subscribe();
    const request = http.expectOne('/api/photos/7/sample');
    expect(request.request.body).toEqual({ region: { shape: 'point', x: 10, y: 20, radius: 5 } });
    request.flush({});
  });
});
