import { HttpClient, HttpEventType } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, map } from 'rxjs';

import { PHOTO_FIELD, type PhotoDto, type PhotoSample, type SampleRequest } from '../../../../shared/api/photo-answers.js';

/** Where an upload has got to. */
export type UploadProgress = { kind: 'progress'; fraction: number | null } | { kind: 'done'; photo: PhotoDto };

/** The photo routes: upload with progress, and sampling a region. */
@Injectable({ providedIn: 'root' })
export class PhotosApi {
  private readonly http = inject(HttpClient);

  /** Uploads a photo as multipart field `photo`, reporting the share of bytes sent, then the stored photo. */
  upload(file: Blob, name = 'photo.jpg'): Observable<UploadProgress> {
    const form = new FormData();
    form.append(PHOTO_FIELD, file, name);
    return this.http.post<PhotoDto>('/api/photos', form, { reportProgress: true, observe: 'events' }).pipe(
      map((event): UploadProgress | null => {
        if (event.type === HttpEventType.UploadProgress) return { kind: 'progress', fraction: event.total ? event.loaded / event.total : null };
        if (event.type === HttpEventType.Response && event.body) return { kind: 'done', photo: event.body };
        return null;
      }),
      filter((progress): progress is UploadProgress => progress !== null),
    );
  }

  /** A stored photo's facts. */
  get(photoId: number): Observable<PhotoDto> {
    return this.http.get<PhotoDto>(`/api/photos/${photoId}`);
  }

  /** The server's reading of a region (the one a reading stores). */
  sample(photoId: number, body: SampleRequest): Observable<PhotoSample> {
    return this.http.post<PhotoSample>(`/api/photos/${photoId}/sample`, body);
  }
}
