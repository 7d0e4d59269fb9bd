import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type {
  AccessionDescriptors,
  Descriptor,
  Observation,
  ObservationPage,
} from '../../../../shared/api/descriptor-answers.js';
import type { CreateDescriptorBody, CreateObservationBody, UpdateDescriptorBody } from '../../../../shared/api/descriptors.js';

/** What an admin sets on a new descriptor; code, kind and ratio parts never change afterwards. */
export type NewDescriptor = CreateDescriptorBody;

/** What an admin may change on a descriptor (categories may be relabelled or added, never removed). */
export type DescriptorChanges = UpdateDescriptorBody;

/** One value as a recorder enters it: a number in its unit, or a category id. */
export type NewObservation = CreateObservationBody;

/** The descriptor catalogue and observations against it. */
@Injectable({ providedIn: 'root' })
export class DescriptorsApi {
  private readonly http = inject(HttpClient);

  descriptors(): Observable<Descriptor[]> {
    return this.http.get<Descriptor[]>('/api/descriptors');
  }

  createDescriptor(body: NewDescriptor): Observable<Descriptor> {
    return this.http.post<Descriptor>('/api/descriptors', body);
  }

  updateDescriptor(id: number, changes: DescriptorChanges): Observable<Descriptor> {
    return this.http.patch<Descriptor>(`/api/descriptors/${id}`, changes);
  }

  /** Records one value; the server converts it to SI and refuses a unit that does not fit, or a ratio. */
  record(body: NewObservation): Observable<Observation> {
    return this.http.post<Observation>('/api/observations', body);
  }

  /** Records several values all or nothing; a refusal names the value (`observations.N.field`) and nothing is stored. */
  recordAll(observations: readonly NewObservation[]): Observable<Observation[]> {
    return this.http.post<Observation[]>('/api/observations/batch', { observations });
  }

  /** Current observations of an accession, newest first. */
  observations(accessionId: number, pageSize = 50): Observable<ObservationPage> {
    const params = new HttpParams().set('accessionId', accessionId).set('pageSize', pageSize);
    return this.http.get<ObservationPage>('/api/observations', { params });
  }

  /** The latest value of each descriptor per plant, with ratios derived within each plant. */
  accessionValues(accessionId: number): Observable<AccessionDescriptors> {
    return this.http.get<AccessionDescriptors>(`/api/accessions/${accessionId}/descriptors`);
  }
}
