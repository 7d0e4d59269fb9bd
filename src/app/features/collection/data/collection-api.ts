import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type { Accession, Character, Site } from '../../../../../shared/api/collection.js';

/** Read access to the collection: sites with their seasons, the character catalogue, accessions. */
@Injectable({ providedIn: 'root' })
export class CollectionApi {
  private readonly http = inject(HttpClient);

  sites(): Observable<Site[]> {
    return this.http.get<Site[]>('/api/sites');
  }

  characters(): Observable<Character[]> {
    return this.http.get<Character[]>('/api/characters');
  }

  accessions(): Observable<Accession[]> {
    return this.http.get<Accession[]>('/api/accessions');
  }
}
