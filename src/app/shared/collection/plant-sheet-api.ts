import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type { CollectionProgress, PlantProgress, PlantSheet, SheetSkip, WalkEntry } from '../../../../shared/api/plant-sheet-answers.js';

/** What a skip names: one colour character or one descriptor, and why. */
export type NewSkip = { characterId: number; reason: string } | { descriptorId: number; reason: string };

/** The plant sheet, per-plant progress and the walk order the sheet follows. */
@Injectable({ providedIn: 'root' })
export class PlantSheetApi {
  private readonly http = inject(HttpClient);

  /** Every row of the walk for one plant, this season. */
  sheet(plantId: number): Observable<PlantSheet> {
    return this.http.get<PlantSheet>(`/api/plants/${plantId}/sheet`);
  }

  /** Sets a row aside for the plant this season. */
  skip(plantId: number, body: NewSkip): Observable<SheetSkip> {
    return this.http.post<SheetSkip>(`/api/plants/${plantId}/skips`, body);
  }

  /** Each plant of an accession, this season. */
  accessionProgress(accessionId: number): Observable<PlantProgress[]> {
    return this.http.get<PlantProgress[]>(`/api/accessions/${accessionId}/progress`);
  }

  /** Every plant of the collection (or of one site), this season. */
  progress(siteId?: number | null): Observable<CollectionProgress> {
    const params = siteId ? new HttpParams().set('siteId', siteId) : undefined;
    return this.http.get<CollectionProgress>('/api/progress', { params });
  }

  walkOrder(): Observable<WalkEntry[]> {
    return this.http.get<WalkEntry[]>('/api/catalogue/order');
  }

  /** Saves the whole walk in the order given (admin). */
  setWalkOrder(entries: readonly WalkEntry[]): Observable<WalkEntry[]> {
    return this.http.put<WalkEntry[]>('/api/catalogue/order', { items: entries.map((e) => ({ kind: e.kind, id: e.id })) });
  }
}
