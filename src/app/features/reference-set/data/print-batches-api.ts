import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { PrintBatchDetail, PrintBatchDto, PrintKind } from '../../../../../shared/api/print-batch-answers.js';
import type { LabTuple } from '../../../../../shared/colour/lab.js';

/** The print-batch routes: list, one batch with its patches, record a batch, add measured patches (admins). */
@Injectable({ providedIn: 'root' })
export class PrintBatchesApi {
  private readonly http = inject(HttpClient);

  list(): Observable<PrintBatchDto[]> {
    return this.http.get<PrintBatchDto[]>('/api/print-batches');
  }

  get(id: number): Observable<PrintBatchDetail> {
    return this.http.get<PrintBatchDetail>(`/api/print-batches/${id}`);
  }

  create(body: { setId: string; kind: PrintKind; printedOn: string; note: string }): Observable<PrintBatchDetail> {
    return this.http.post<PrintBatchDetail>('/api/print-batches', body);
  }

  addPatches(id: number, patches: { chipCode: string; lab: LabTuple }[]): Observable<PrintBatchDetail> {
    return this.http.post<PrintBatchDetail>(`/api/print-batches/${id}/patches`, { patches });
  }
}
