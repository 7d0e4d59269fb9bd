import { HttpClient, HttpHeaders } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { firstValueFrom } from 'rxjs';

import { IDEMPOTENCY_HEADER } from '../../../../shared/api/idempotency.js';
import { PHOTO_FIELD, type PhotoDto } from '../../../../shared/api/photo-answers.js';
import type { CreateReadingRequest, ReadingDetail } from '../../../../shared/api/reading-answers.js';
import { ServerStatus } from '../http/server-status';
import type { QueueTransport } from './sync-runner';

/** The queue's requests through HttpClient (so the XSRF header and the error interceptor apply), each with its Idempotency-Key. */
@Injectable({ providedIn: 'root' })
export class HttpQueueTransport implements QueueTransport {
  private readonly http = inject(HttpClient);
  private readonly status = inject(ServerStatus);

  /** GET /api/health: the server is there, and the XSRF cookie is fresh even after the browser was closed. */
  reachable(): Promise<boolean> {
    return firstValueFrom(this.status.check());
  }

  uploadPhoto(blob: Blob, name: string, key: string): Promise<PhotoDto> {
    const form = new FormData();
    form.append(PHOTO_FIELD, blob, name);
    return firstValueFrom(this.http.post<PhotoDto>('/api/photos', form, { headers: keyed(key) }));
  }

  createReading(body: CreateReadingRequest, key: string): Promise<ReadingDetail> {
    return firstValueFrom(this.http.post<ReadingDetail>('/api/readings', body, { headers: keyed(key) }));
  }
}

function keyed(key: string): HttpHeaders {
  return new HttpHeaders({ [IDEMPOTENCY_HEADER]: key });
}
