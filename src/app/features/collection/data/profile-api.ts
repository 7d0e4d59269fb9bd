import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { AccessionProfile, DuplicatesAnswer, SimilarAnswer } from '../../../../../shared/api/profile-answers.js';

/** Where one accession's printable characterisation record is downloaded. */
export function profilePdfUrl(accessionId: number): string {
  return `/api/accessions/${accessionId}/profile.pdf`;
}

/** Where the whole collection's characterisation workbook is downloaded. */
export const CHARACTERISATION_XLSX_URL = '/api/accessions/characterisation.xlsx';

/** The characterisation of accessions: one record, the accessions that look like one, the collection's possible duplicates. */
@Injectable({ providedIn: 'root' })
export class ProfileApi {
  private readonly http = inject(HttpClient);

  profile(accessionId: number): Observable<AccessionProfile> {
    return this.http.get<AccessionProfile>(`/api/accessions/${accessionId}/profile`);
  }

  similar(accessionId: number, limit = 20): Observable<SimilarAnswer> {
    return this.http.get<SimilarAnswer>(`/api/accessions/${accessionId}/similar`, { params: new HttpParams().set('limit', limit) });
  }

  duplicates(): Observable<DuplicatesAnswer> {
    return this.http.get<DuplicatesAnswer>('/api/accessions/duplicates');
  }
}
