import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import {
  bookletUrl,
  chipsUrl,
  fieldCardUrl,
  type ChipDto,
  type MatchAnswer,
  type MatchRequest,
  type ReferenceSetSummary,
} from '../../../../shared/api/reference-set-answers.js';

/** The reference-set routes: the sets, one set's chips (one cacheable answer), matching, the printable card. */
@Injectable({ providedIn: 'root' })
export class ReferenceSetApi {
  private readonly http = inject(HttpClient);

  /** Every stored set, newest first; the current one is marked. */
  sets(): Observable<ReferenceSetSummary[]> {
    return this.http.get<ReferenceSetSummary[]>('/api/reference-sets');
  }

  /** Makes a stored set the current one (admins only); answers the sets as they now stand. */
  chooseCurrent(setId: string): Observable<ReferenceSetSummary[]> {
    return this.http.put<ReferenceSetSummary[]>('/api/reference-sets/current', { setId });
  }

  /** All chips of a set in code order; the browser may answer from its cache (ETag, a day's max-age). */
  chips(setId: string): Observable<ChipDto[]> {
    return this.http.get<ChipDto[]>(chipsUrl(setId));
  }

  /** The server's authoritative match of a hex or CIELAB colour. */
  match(request: MatchRequest): Observable<MatchAnswer> {
    return this.http.post<MatchAnswer>('/api/match', request);
  }

  /** Where the set's printable field card (PDF) is downloaded. */
  cardUrl(setId: string): string {
    return fieldCardUrl(setId);
  }

  /** Where the set's fine-chip booklet (PDF, one page per field chip) is downloaded. */
  bookletUrl(setId: string): string {
    return bookletUrl(setId);
  }
}
