import { HttpClient, HttpParams } from '@angular/common/http';
import { Injectable, inject } from '@angular/core';
import { Observable } from 'rxjs';

import type { UserRow } from '../../../../../shared/api/auth.js';
import type {
  CalibrationResults,
  CalibrationSessionDetail,
  CalibrationSessionSummary,
  Certification,
  CloseSessionAnswer,
  CreateCalibrationSessionRequest,
  CreatedId,
  CreateResponseRequest,
  CreateScreeningRequest,
  CreateSpecimenRequest,
  MyCalibrationResult,
  ObserverStandingRow,
  ParticipantsAnswer,
  ResponseCreated,
  Screening,
} from '../../../../../shared/api/calibration-answers.js';

const BASE = '/api/calibration';

/** The calibration routes: sessions, specimens, picks, results, certifications and screenings. */
@Injectable({ providedIn: 'root' })
export class CalibrationApi {
  private readonly http = inject(HttpClient);

  /** Sessions the caller may see: trainers and admins all; others the open ones they may join and their own. */
  sessions(): Observable<CalibrationSessionSummary[]> {
    return this.http.get<CalibrationSessionSummary[]>(`${BASE}/sessions`);
  }

  /** One session; references are hidden from trainees while it is open. */
  session(id: number): Observable<CalibrationSessionDetail> {
    return this.http.get<CalibrationSessionDetail>(`${BASE}/sessions/${id}`);
  }

  createSession(body: CreateCalibrationSessionRequest): Observable<CreatedId> {
    return this.http.post<CreatedId>(`${BASE}/sessions`, body);
  }

  addSpecimen(sessionId: number, body: CreateSpecimenRequest): Observable<CreatedId> {
    return this.http.post<CreatedId>(`${BASE}/sessions/${sessionId}/specimens`, body);
  }

  invite(sessionId: number, userIds: number[]): Observable<ParticipantsAnswer> {
    return this.http.post<ParticipantsAnswer>(`${BASE}/sessions/${sessionId}/participants`, { userIds });
  }

  /** The signed-in observer's pick for one specimen; a second pick replaces the first while open. */
  respond(sessionId: number, body: CreateResponseRequest): Observable<ResponseCreated> {
    return this.http.post<ResponseCreated>(`${BASE}/sessions/${sessionId}/responses`, body);
  }

  close(sessionId: number): Observable<CloseSessionAnswer> {
    return this.http.post<CloseSessionAnswer>(`${BASE}/sessions/${sessionId}/close`, {});
  }

  /** Everybody's results (trainers and admins), live while the session is open. */
  results(sessionId: number): Observable<CalibrationResults> {
    return this.http.get<CalibrationResults>(resultsUrl(sessionId));
  }

  /** The caller's own result, once the session is closed (409 before). */
  myResult(sessionId: number): Observable<MyCalibrationResult> {
    return this.http.get<MyCalibrationResult>(`${BASE}/sessions/${sessionId}/results/me`);
  }

  /** Certifications: the caller's own, or (trainers, admins) everyone's or one user's. */
  certifications(userId?: number): Observable<Certification[]> {
    return this.http.get<Certification[]>(`${BASE}/certifications`, { params: userParams(userId) });
  }

  /** Every active user's standing: current, lapsed or never certified (trainers, admins). */
  standings(): Observable<ObserverStandingRow[]> {
    return this.http.get<ObserverStandingRow[]>(`${BASE}/standings`);
  }

  /** Colour-vision screenings, newest first, scoped as certifications are. */
  screenings(userId?: number): Observable<Screening[]> {
    return this.http.get<Screening[]>(`${BASE}/screenings`, { params: userParams(userId) });
  }

  recordScreening(body: CreateScreeningRequest): Observable<CreatedId> {
    return this.http.post<CreatedId>(`${BASE}/screenings`, body);
  }

  /** Every user (admins only: the server refuses others). */
  users(): Observable<UserRow[]> {
    return this.http.get<UserRow[]>('/api/users');
  }
}

/** Where a certificate's PDF is downloaded. */
export function certificatePdfUrl(certificationId: number): string {
  return `${BASE}/certifications/${certificationId}/certificate.pdf`;
}

/** Where a session's live results are read. */
export function resultsUrl(sessionId: number): string {
  return `${BASE}/sessions/${sessionId}/results`;
}

function userParams(userId: number | undefined): HttpParams {
  return userId === undefined ? new HttpParams() : new HttpParams().set('userId', userId);
}
