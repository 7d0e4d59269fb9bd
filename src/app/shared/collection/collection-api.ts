import { HttpClient } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable, map, switchMap } from 'rxjs';

import type {
  Accession,
  Character,
  CreateAccessionBody,
  CreateCharacterBody,
  CreatePlantBody,
  CreateSiteBody,
  Plant,
  SavedSite,
  Site,
  UpdateAccessionBody,
  UpdateCharacterBody,
  UpdatePlantBody,
  UpdateSiteBody,
} from '../../../../shared/api/collection.js';

/** Where the MCPD passport CSV of every accession is downloaded (`GET /api/accessions/mcpd.csv`). */
export const PASSPORT_CSV_URL = '/api/accessions/mcpd.csv';


/** The collection: sites with their seasons, the character catalogue, accessions and plants; writes are admin-only on the server. */
@Injectable({ providedIn: 'root' })
export class CollectionApi {
  private readonly http = inject(HttpClient);

  sites(): Observable<Site[]> {
    return this.http.get<Site[]>('/api/sites');
  }

  /** One site, found in the list (there is no single-site route; the list is small). */
  site(id: number): Observable<Site> {
    return this.sites().pipe(map((sites) => findOrFail(sites, id, 'site')));
  }

  /** Creates a site with its season scheme; the answer carries the scheme's warnings (uncovered days). */
  createSite(body: CreateSiteBody): Observable<SavedSite> {
    return this.http.post<SavedSite>('/api/sites', body);
  }

  /** Saves a site's fields, then replaces its whole season scheme. */
  updateSite(id: number, body: CreateSiteBody): Observable<SavedSite> {
    const { seasons, ...fields } = body;
    return this.http
      .patch<Site>(`/api/sites/${id}`, fields satisfies UpdateSiteBody)
      .pipe(switchMap(() => this.http.put<SavedSite>(`/api/sites/${id}/seasons`, { seasons })));
  }

  characters(): Observable<Character[]> {
    return this.http.get<Character[]>('/api/characters');
  }

  createCharacter(body: CreateCharacterBody): Observable<Character> {
    return this.http.post<Character>('/api/characters', body);
  }

  updateCharacter(id: number, changes: UpdateCharacterBody): Observable<Character> {
    return this.http.patch<Character>(`/api/characters/${id}`, changes);
  }

  accessions(): Observable<Accession[]> {
    return this.http.get<Accession[]>('/api/accessions');
  }

  /** One accession with its plants. */
  accession(id: number): Observable<Accession> {
    return this.http.get<Accession>(`/api/accessions/${id}`);
  }

  /** Creates an accession; genus, species and crop default to taro on the server. */
  createAccession(body: CreateAccessionBody): Observable<Accession> {
    return this.http.post<Accession>('/api/accessions', body);
  }

  updateAccession(id: number, changes: UpdateAccessionBody): Observable<Accession> {
    return this.http.patch<Accession>(`/api/accessions/${id}`, changes);
  }

  addPlant(accessionId: number, body: CreatePlantBody): Observable<Plant> {
    return this.http.post<Plant>(`/api/accessions/${accessionId}/plants`, body);
  }

  updatePlant(id: number, changes: UpdatePlantBody): Observable<Plant> {
    return this.http.patch<Plant>(`/api/plants/${id}`, changes);
  }
}

function findOrFail<T extends { id: number }>(items: readonly T[], id: number, what: string): T {
  const item = items.find((candidate) => candidate.id === id);
  if (!item) throw new Error(`There is no ${what} ${id}.`);
  return item;
}
