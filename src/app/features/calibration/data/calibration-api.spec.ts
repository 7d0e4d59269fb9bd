import { provideHttpClient, withInterceptors } from '@angular/common/http';
import { HttpTestingController, provideHttpClientTesting } from '@angular/common/http/testing';
import { TestBed } from '@angular/core/testing';
import { provideRouter } from '@angular/router';

import type { CalibrationResults, ResponseCreated } from '../../../../../shared/api/calibration-answers.js';
import { ApiError } from '../../../core/http/api-error';
import { errorInterceptor } from '../../../core/http/error-interceptor';
import { CalibrationApi } from './calibration-api';

describe('CalibrationApi', () => {
  let api: CalibrationApi;
  let http: HttpTestingController;

  beforeEach(() => {
    TestBed.configureTestingModule({ providers: [provideRouter([]), provideHttpClient(withInterceptors([errorInterceptor])), provideHttpClientTesting()] });
    api = TestBed.inject(CalibrationApi);
    http = TestBed.inject(HttpTestingController);
  });

  afterEach(() => http.verify());

  it('should create a session with its thresholds', () => {
    let id = 0;
    api.createSession({ title: 'Petiole week', heldOn: '2026-03-02', restricted: true, thresholds: { kappa: 0.61, deltaE00: 1.8 } }).subscribe((a) => (id = a.id));
    const req = http.expectOne('/api/calibration/sessions');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ title: 'Petiole week', heldOn: '2026-03-02', restricted: true, thresholds: { kappa: 0.61, deltaE00: 1.8 } });
    req.flush({ id: 12 }, { status: 201, statusText: 'Created' });
    expect(id).toBe(12);
  });

  it('should add a specimen by L*a*b*, by chip code and by photo region to the session’s own URL', () => {
    api.addSpecimen(3, { label: 'Blade', lab: [50, -20, 30] }).subscribe();
    api.addSpecimen(3, { label: 'Ring', chipCode: 'F-087' }).subscribe();
    api.addSpecimen(3, { label: 'Flesh', photoId: 9, region: { shape: 'rect', x: 1, y: 2, width: 30, height: 40 } }).subscribe();
    const reqs = http.match('/api/calibration/sessions/3/specimens');
    expect(reqs.map((r) => r.request.body.label)).toEqual(['Blade', 'Ring', 'Flesh']);
    expect(reqs[1].request.body).toEqual({ label: 'Ring', chipCode: 'F-087' });
    expect(reqs[2].request.body.photoId).toBe(9);
    reqs.forEach((r, i) => r.flush({ id: i + 1 }));
  });

  it('should send a pick and report whether it replaced an earlier one', () => {
    let answer: ResponseCreated | undefined;
    api.respond(3, { specimenId: 5, chipCode: 'F-087.014' }).subscribe((a) => (answer = a));
    const req = http.expectOne('/api/calibration/sessions/3/responses');
    expect(req.request.method).toBe('POST');
    expect(req.request.body).toEqual({ specimenId: 5, chipCode: 'F-087.014' });
    req.flush({ id: 40, replaced: true });
    expect(answer).toEqual({ id: 40, replaced: true });
  });

  it('should turn a 409 on a closed session into an ApiError carrying the server’s words', () => {
    let error: unknown;
    api.respond(3, { specimenId: 5, chipCode: 'F-001' }).subscribe({ error: (e) => (error = e) });
    http.expectOne('/api/calibration/sessions/3/responses').flush(
      { type: 'about:blank', title: 'Conflict', status: 409, detail: 'Calibration session 3 is closed.' },
      { status: 409, statusText: 'Conflict', headers: { 'content-type': 'application/problem+json' } },
    );
    expect(error).toBeInstanceOf(ApiError);
    expect((error as ApiError).status).toBe(409);
    expect((error as ApiError).message).toContain('closed');
  });

  it('should read the live results, my result, and close', () => {
    let results: CalibrationResults | undefined;
    api.results(3).subscribe((r) => (results = r));
    http.expectOne({ method: 'GET', url: '/api/calibration/sessions/3/results' }).flush({ sessionId: 3, status: 'open' });
    expect(results?.sessionId).toBe(3);
    api.myResult(3).subscribe();
    http.expectOne({ method: 'GET', url: '/api/calibration/sessions/3/results/me' }).flush({});
    api.close(3).subscribe();
    const close = http.expectOne('/api/calibration/sessions/3/close');
    expect(close.request.method).toBe('POST');
    close.flush({ results: {}, certifiedUserIds: [], mailed: 0, mailFailed: 0 });
  });

  it('should invite users by id', () => {
    api.invite(3, [4, 7]).subscribe();
    const req = http.expectOne('/api/calibration/sessions/3/participants');
    expect(req.request.body).toEqual({ userIds: [4, 7] });
    req.flush({ added: 2, participants: [] });
  });

  it('should filter certifications and screenings by user only when asked, and record a screening', () => {
    api.certifications().subscribe();
    http.expectOne('/api/calibration/certifications').flush([]);
    api.screenings(6).subscribe();
    http.expectOne('/api/calibration/screenings?userId=6').flush([]);
    api.recordScreening({ screenedOn: '2026-01-05', method: 'anomaloscope', result: 'normal' }).subscribe();
    const req = http.expectOne({ method: 'POST', url: '/api/calibration/screenings' });
    expect(req.request.body.method).toBe('anomaloscope');
    req.flush({ id: 1 });
  });
});
