import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, filter, map } from 'rxjs';

import { IDEMPOTENCY_HEADER } from '../../../../shared/api/idempotency.js';
import { downloadStep, type DownloadProgress } from './blob-download';
import type { CreatedReadings, CreateReadingRequest, CreateReadingsRequest, ReadingDetail, ReadingDto, ReadingList, ReadingListQuery, SupersedeReadingRequest } from '../../../../shared/api/reading-answers.js';

/** The export formats offered. */
export type ExportFormat = 'csv' | 'xlsx';

/** A list query as HTTP parameters: empty and unset filters are left out. */
export function queryParams(query: ReadingListQuery): HttpParams {
  let params = new HttpParams();
  for (const [key, value] of Object.entries(query)) {
    if (value === undefined || value === null || value === '' || value === false) continue;
    params = params.set(key, String(value));
  }
  return params;
}

function keyHeader(key: string | undefined): Record<string, string> {
  return key ? { [IDEMPOTENCY_HEADER]: key } : {};
}

/** A fresh idempotency key: a UUID where the browser offers one (secure contexts), else 32 random hex digits. */
export function newIdempotencyKey(): string {
  if (typeof crypto.randomUUID === 'function') return crypto.randomUUID();
  return Array.from(crypto.getRandomValues(new Uint8Array(16)), (b) => b.toString(16).padStart(2, '0')).join('');
}

/** The readings routes: create, correct (supersede), list, one reading with its history, and the exports. */
@Injectable({ providedIn: 'root' })
export class ReadingsApi {
  private readonly http = inject(HttpClient);

  /**
   * Saves a new reading; the answer carries the server's match. With a key, a resend after a
   * dropped connection is answered from the first save instead of saving twice.
   */
  create(body: CreateReadingRequest, idempotencyKey?: string): Observable<ReadingDetail> {
    return this.http.post<ReadingDetail>('/api/readings', body, { headers: keyHeader(idempotencyKey) });
  }

  /** Saves several readings together, all or nothing (the colours of one photo region as readings of their characters). */
  createBatch(body: CreateReadingsRequest, idempotencyKey?: string): Observable<CreatedReadings> {
    return this.http.post<CreatedReadings>('/api/readings/batch', body, { headers: keyHeader(idempotencyKey) });
  }

  /** Saves a correction: a new reading that supersedes reading `id`, with the reason. */
  supersede(id: number, body: SupersedeReadingRequest, idempotencyKey?: string): Observable<ReadingDetail> {
    return this.http.post<ReadingDetail>(`/api/readings/${id}/supersede`, body, { headers: keyHeader(idempotencyKey) });
  }

  /** One server page of readings with the filters and sort given. */
  list(query: ReadingListQuery): Observable<ReadingList> {
    return this.http.get<ReadingList>('/api/readings', { params: queryParams(query) });
  }

  /** One reading with its provenance, versions and history. */
  get(id: number): Observable<ReadingDetail> {
    return this.http.get<ReadingDetail>(`/api/readings/${id}`);
  }

  /** The readings the filters select as a file, with download progress (page and page size are not sent: the export holds all). */
  export(format: ExportFormat, query: ReadingListQuery): Observable<DownloadProgress> {
    const { page: _page, pageSize: _size, ...filters } = query;
    return this.http
      .get(`/api/readings/export.${format}`, { params: queryParams(filters), responseType: 'blob', reportProgress: true, observe: 'events' })
      .pipe(
        map((event) => downloadStep(event, `readings.${format}`)),
        filter((step): step is DownloadProgress => step !== null),
      );
  }
}

export type { ReadingDto };
