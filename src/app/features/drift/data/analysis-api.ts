import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import type { Observable } from 'rxjs';

import type { DriftAnswer, DriftOverviewAnswer, SiteComparisonAnswer } from '../../../../../shared/api/analysis-answers.js';

/** What the drift view is asked about; the site is optional (all sites when left out). */
export interface DriftSubject {
  accessionId: number;
  characterId: number;
  siteId?: number | null;
}

/** The analysis routes: season drift and site comparison of one accession and character (issue 6). */
@Injectable({ providedIn: 'root' })
export class AnalysisApi {
  private readonly http = inject(HttpClient);

  /** Season groups, their comparisons and every reading as a chart point. */
  drift(subject: DriftSubject): Observable<DriftAnswer> {
    let params = new HttpParams().set('accessionId', subject.accessionId).set('characterId', subject.characterId);
    if (subject.siteId) params = params.set('siteId', subject.siteId);
    return this.http.get<DriftAnswer>('/api/analysis/drift', { params });
  }

  /** Per-site groups and the ΔE00 between every pair of site means; within one season group when one is given. */
  sites(subject: Omit<DriftSubject, 'siteId'>, season?: { season: string; seasonYear: number } | null): Observable<SiteComparisonAnswer> {
    let params = new HttpParams().set('accessionId', subject.accessionId).set('characterId', subject.characterId);
    if (season) params = params.set('season', season.season).set('seasonYear', season.seasonYear);
    return this.http.get<SiteComparisonAnswer>('/api/analysis/sites', { params });
  }

  /** Every flagged accession × character of the collection, largest ΔE00 first. */
  overview(): Observable<DriftOverviewAnswer> {
    return this.http.get<DriftOverviewAnswer>('/api/analysis/overview');
  }
}
