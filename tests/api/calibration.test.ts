// Observer calibration (issue 7): a session of three observers whose results are worked out by
// hand here, the role rules, replacement of answers, closing, certification, mail and screenings.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import { readFileSync } from 'node:fs';
import Color from 'colorjs.io';
import type { CalibrationResults, CalibrationSessionDetail, CloseSessionAnswer, MyCalibrationResult } from '../../shared/api/calibration-answers.js';
import type { ReferenceSetFile } from '../../shared/colour/reference-set.js';
import type { User } from '../../server/auth/user.entity.js';
import { assertInvalidFields, assertProblem } from './assert-problem.js';
import { addUser, Client, mailsTo, PASSWORD, rowCounts, startHarness, type Harness } from './harness.js';
import { fromRaw, labOfRgb8, paintScene, uploadPhoto } from './photo-fixtures.js';

type Lab3 = [number, number, number];

/**
 * CIEDE2000 by colorjs.io, an independent implementation (not culori, which the server uses). Its
 * `lab` space has the D50 white, so it is handed the same L*a*b* numbers in that space: the
 * formula is what is compared (as in tests/reference/cross-check.test.ts).
 */
const colorjsDE00 = (p: Lab3, q: Lab3) => new Color('lab', p).deltaE(new Color('lab', q), '2000');
const close = (actual: number | null | undefined, expected: number, tol: number, what: string) => {
  assert.ok(typeof actual === 'number', `${what} is ${actual}`);
  assert.ok(Math.abs(actual - expected) <= tol, `${what}: ${actual} ≠ ${expected}`);
};
const mean = (xs: number[]) => xs.reduce((s, x) => s + x, 0) / xs.length;

// The chips' CIELAB as published in reference-colors/reference-set-v1.json (codes never change meaning).
const CHIPS: Record<string, Lab3> = {
  'F-158': [42.06, 25.91, -12.93], // field chip, mid muted purple
  'F-158.026': [41.21, 26.38, -15.05],
  'F-158.075': [41.21, 25.07, -10.59],
  'F-092': [50.02, -16.12, 13.46], // field chip, light muted green
  'F-092.076': [49.95, -16.02, 15.41],
  'F-092.062': [51.35, -17.79, 13.33],
  'F-053': [90.06, 0.4, 17.18], // field chip, very pale muted yellow
  'F-053.050': [88.33, -0.05, 16.93],
  'F-053.041': [90.53, 1.38, 19.21],
};

/** Three specimens, reference colours entered as instrument readings; their field chips are F-158, F-092, F-053. */
const SPECIMENS: { label: string; lab: Lab3; field: string }[] = [
  { label: 'S1 petiole purple', lab: [42.5, 26.5, -13.5], field: 'F-158' },
  { label: 'S2 leaf green', lab: [50.5, -16.5, 14.0], field: 'F-092' },
  { label: 'S3 corm cream', lab: [89.5, 0.8, 17.5], field: 'F-053' },
];

/** Each observer's final pick per specimen. C first picks F-092.062 for S2, then replaces it with F-053. */
const PICKS: Record<'A' | 'B' | 'C', string[]> = {
  A: ['F-158', 'F-092', 'F-053'],
  B: ['F-158.026', 'F-092.076', 'F-053.050'],
  C: ['F-158.075', 'F-053', 'F-053.041'],
};

/*
 * By hand, with the final picks. Kappa categories are field chips (F-158, F-092, F-053):
 *   S1 [3, 0, 0], S2 [0, 2, 1], S3 [0, 0, 3].
 *   P_1 = 1, P_2 = 2·1/(3·2) = 1/3, P_3 = 1 → P̄ = 7/9.
 *   p = (3/9, 2/9, 4/9) → P̄e = (9 + 4 + 16)/81 = 29/81.
 *   κ = (7/9 − 29/81)/(1 − 29/81) = 34/52 = 17/26 = 0.653846 → Landis & Koch "substantial".
 * Before C's replacement (C picks F-092.062 for S2): every specimen unanimous, P̄ = 1, p = 1/3 each, κ = 1.
 * Bias, mean of chip − reference per axis:
 *   A: S1 (−0.44, −0.59, 0.57), S2 (−0.48, 0.38, −0.54), S3 (0.56, −0.40, −0.32) → (−0.12, −0.203333, −0.096667)
 *   B: S1 (−1.29, −0.12, −1.55), S2 (−0.55, 0.48, 1.41), S3 (−1.17, −0.85, −0.57) → (−1.003333, −0.163333, −0.236667)
 *   C: S1 (−1.29, −1.43, 2.91), S2 (39.56, 16.90, 3.18), S3 (1.03, 0.58, 1.71) → (13.1, 5.35, 2.6)
 * Mean ΔE00 by colorjs.io: A 0.583673, B 1.301022, C 12.597397 (C before the replacement 1.554073).
 * Certified at close (κ 0.6538 ≥ 0.61 and mean ΔE00 ≤ 1.8): A and B; not C.
 * Cohen's κ over field chips: A–B 1 (identical); A–C and B–C: p_o = 2/3, p_e = (1·2 + 1·0 + 1·1)/9 = 1/3 → κ = 1/2.
 */
const BIAS = { A: [-0.12, -0.61 / 3, -0.29 / 3], B: [-3.01 / 3, -0.49 / 3, -0.71 / 3], C: [13.1, 5.35, 2.6] };
const KAPPA = 17 / 26;

function expectedMeanDE(picks: string[]): number {
  return mean(picks.map((code, i) => colorjsDE00(SPECIMENS[i]!.lab, CHIPS[code]!)));
}

describe('calibration sessions', () => {
  let h: Harness;
  let trainer: Client;
  let admin: Client;
  const observers = {} as Record<'A' | 'B' | 'C' | 'D', { client: Client; user: User }>;
  let sessionId: number;
  const specimenIds: number[] = [];

  const signIn = async (role: 'recorder' | 'reviewer' | 'trainer' | 'admin', email: string) => {
    const user = await addUser(h.ds, role, email);
    return { user, client: await new Client(h.app).signIn(email, PASSWORD) };
  };
  const results = async () => (await trainer.get(`/api/calibration/sessions/${sessionId}/results`).expect(200)).body as CalibrationResults;
  const pick = (who: 'A' | 'B' | 'C' | 'D', specimen: number, chipCode: string) =>
    observers[who].client.post(`/api/calibration/sessions/${sessionId}/responses`, { specimenId: specimenIds[specimen], chipCode });

  before(async () => {
    h = await startHarness();
    trainer = (await signIn('trainer', 'trainer@test.example')).client;
    admin = (await signIn('admin', 'admin@test.example')).client;
    observers.A = await signIn('recorder', 'observer-a@test.example');
    observers.B = await signIn('reviewer', 'observer-b@test.example');
    observers.C = await signIn('recorder', 'observer-c@test.example');
    observers.D = await signIn('recorder', 'outsider-d@test.example');
  });
  after(() => h.close());

  test('should have the chips this file states, as the reference-set file publishes them', () => {
    const file = JSON.parse(readFileSync(new URL('../../reference-colors/reference-set-v1.json', import.meta.url), 'utf8')) as ReferenceSetFile;
    for (const [code, lab] of Object.entries(CHIPS)) assert.deepEqual(file.chips.find((c) => c.code === code)?.lab, lab, code);
    // Each specimen's field chip is its nearest field chip by ΔE00 (colorjs.io), checked over every field chip.
    for (const s of SPECIMENS) {
      const fields = file.chips.filter((c) => c.parent === null);
      const nearest = fields.reduce((a, b) => (colorjsDE00(s.lab, b.lab) < colorjsDE00(s.lab, a.lab) ? b : a));
      assert.equal(nearest.code, s.field, s.label);
    }
  });

  test('should create a session with default thresholds and the current set (trainer)', async () => {
    const res = await trainer.post('/api/calibration/sessions', { title: 'Morning group', heldOn: '2026-03-05' }).expect(201);
    sessionId = res.body.id;
    for (const s of SPECIMENS) specimenIds.push((await trainer.post(`/api/calibration/sessions/${sessionId}/specimens`, { label: s.label, lab: s.lab }).expect(201)).body.id);
    const detail = (await trainer.get(`/api/calibration/sessions/${sessionId}`).expect(200)).body as CalibrationSessionDetail;
    assert.deepEqual(detail.thresholds, { kappa: 0.61, deltaE00: 1.8 });
    assert.equal(detail.referenceSetId, 'v1');
    assert.equal(detail.status, 'open');
    assert.deepEqual(detail.specimens.map((s) => s.referenceLab), SPECIMENS.map((s) => s.lab));
  });

  test('should refuse bad input with 400 naming the field, writing nothing', async () => {
    const before = await rowCounts(h.ds);
    const base = `/api/calibration/sessions/${sessionId}`;
    assertInvalidFields(await trainer.post('/api/calibration/sessions', { title: '  ' }), 'title');
    assertInvalidFields(await trainer.post('/api/calibration/sessions', { title: 'x', thresholds: { kappa: 2 } }), 'thresholds.kappa');
    assertInvalidFields(await trainer.post('/api/calibration/sessions', { title: 'x', heldOn: '5 March' }), 'heldOn');
    assertInvalidFields(await trainer.post('/api/calibration/sessions', { title: 'x', referenceSetId: 'v99' }), 'referenceSetId');
    assertInvalidFields(await trainer.post(`${base}/specimens`, { label: 'x', lab: [50, 0, 0], chipCode: 'F-001' }), 'lab');
    assertInvalidFields(await trainer.post(`${base}/specimens`, { label: 'x' }), 'lab');
    assertInvalidFields(await trainer.post(`${base}/specimens`, { label: 'x', lab: [120, 0, 0] }), 'lab.0');
    assertInvalidFields(await trainer.post(`${base}/specimens`, { label: 'x', chipCode: 'F-999' }), 'chipCode');
    assertInvalidFields(await trainer.post(`${base}/specimens`, { label: 'x', photoId: 999, region: { shape: 'rect', x: 0, y: 0, width: 4, height: 4 } }), 'photoId');
    assertInvalidFields(await trainer.post(`${base}/specimens`, { label: 'x', photoId: 1 }), 'region');
    assertInvalidFields(await pick('A', 0, 'F-158.999'), 'chipCode');
    assertInvalidFields(await pick('A', 0, 'purple'), 'chipCode');
    assertInvalidFields(await observers.A.client.post(`${base}/responses`, { specimenId: 99999, chipCode: 'F-158' }), 'specimenId');
    assertInvalidFields(await trainer.post(`${base}/participants`, { userIds: [observers.A.user.id, 99999] }), 'userIds');
    assertInvalidFields(await observers.A.client.post('/api/calibration/screenings', { screenedOn: '2026-01-01', method: 'guess', result: 'normal' }), 'method');
    assertInvalidFields(await observers.A.client.post('/api/calibration/screenings', { screenedOn: '2999-01-01', method: 'anomaloscope', result: 'normal' }), 'screenedOn');
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should keep the reference colour and other answers from a trainee while open', async () => {
    await pick('A', 0, PICKS.A[0]!).expect(201);
    await pick('B', 0, PICKS.B[0]!).expect(201);
    const detail = (await observers.A.client.get(`/api/calibration/sessions/${sessionId}`).expect(200)).body as CalibrationSessionDetail;
    assert.ok(detail.specimens.every((s) => s.referenceLab === null && s.referenceHex === null && s.chipCode === null && s.photoId === null));
    assert.deepEqual(detail.myPicks.map((p) => p.chipCode), [PICKS.A[0]]);
    assert.deepEqual(detail.participants, []);
    assert.equal(detail.canRespond, true);
  });

  test('should refuse the whole results table to a trainee (403) and a closed session\'s own result before close (409)', async () => {
    const before = await rowCounts(h.ds);
    assertProblem(await observers.A.client.get(`/api/calibration/sessions/${sessionId}/results`), 403);
    assertProblem(await observers.A.client.get(`/api/calibration/sessions/${sessionId}/results/me`), 409);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test('should compute κ = 1 while every specimen is unanimous, then recompute when C replaces a pick', async () => {
    for (const [i, code] of PICKS.A.entries()) if (i > 0) await pick('A', i, code).expect(201);
    for (const [i, code] of PICKS.B.entries()) if (i > 0) await pick('B', i, code).expect(201);
    await pick('C', 0, PICKS.C[0]!).expect(201);
    await pick('C', 1, 'F-092.062').expect(201);
    await pick('C', 2, PICKS.C[2]!).expect(201);
    const first = await results();
    close(first.fleissKappa, 1, 1e-12, 'κ before');
    assert.equal(first.band, 'almost-perfect');
    close(first.observers.find((o) => o.userId === observers.C.user.id)!.meanDeltaE00, expectedMeanDE(['F-158.075', 'F-092.062', 'F-053.041']), 1e-6, 'C mean ΔE00 before');

    const replaced = await pick('C', 1, PICKS.C[1]!).expect(200);
    assert.equal(replaced.body.replaced, true);
    const r = await results();
    close(r.fleissKappa, KAPPA, 1e-12, 'κ');
    close(r.observedAgreement, 7 / 9, 1e-12, 'P̄');
    close(r.chanceAgreement, 29 / 81, 1e-12, 'P̄e');
    assert.equal(r.band, 'substantial');
    assert.deepEqual(r.progress, { specimens: 3, observers: 3, responses: 9, expected: 9 });
    assert.deepEqual(r.specimens[1]!.counts, [{ fieldCode: 'F-092', count: 2 }, { fieldCode: 'F-053', count: 1 }]);
    close(r.specimens[1]!.agreement, 1 / 3, 1e-12, 'P_2');
    assert.deepEqual(r.specimens.map((s) => s.referenceFieldCode), SPECIMENS.map((s) => s.field));
    for (const who of ['A', 'B', 'C'] as const) {
      const row = r.observers.find((o) => o.userId === observers[who].user.id)!;
      assert.equal(row.n, 3);
      close(row.meanDeltaE00, expectedMeanDE(PICKS[who]), 1e-6, `${who} mean ΔE00`);
      BIAS[who].forEach((v, k) => close(row.bias![k], v, 1e-9, `${who} bias ${'Lab'[k]}`));
      assert.equal(row.certified, false, 'nobody is certified while open');
      assert.equal(row.screening, null, 'not screened');
    }
    close(expectedMeanDE(PICKS.A), 0.583673, 5e-7, 'A by colorjs.io');
    close(expectedMeanDE(PICKS.C), 12.597397, 5e-7, 'C by colorjs.io');
    const pairKappa = (x: 'A' | 'B' | 'C', y: 'A' | 'B' | 'C') =>
      r.pairs.find((p) => [p.a, p.b].sort().join() === [observers[x].user.id, observers[y].user.id].sort().join())!.kappa;
    close(pairKappa('A', 'B'), 1, 1e-12, 'A–B');
    close(pairKappa('A', 'C'), 0.5, 1e-12, 'A–C');
    close(pairKappa('B', 'C'), 0.5, 1e-12, 'B–C');
    assert.deepEqual(r.observers.filter((o) => o.qualifies).map((o) => o.userId).sort(), [observers.A.user.id, observers.B.user.id].sort());
  });

  test('should close: certify A and B with the date, audit, and mail every participant', async () => {
    const res = await trainer.post(`/api/calibration/sessions/${sessionId}/close`).expect(200);
    const answer = res.body as CloseSessionAnswer;
    assert.deepEqual(answer.certifiedUserIds.sort(), [observers.A.user.id, observers.B.user.id].sort());
    assert.equal(answer.mailed, 3);
    assert.equal(answer.results.status, 'closed');
    const today = new Date().toISOString().slice(0, 10);
    const rows: { userId: number; certifiedOn: string; kappa: number; meanDeltaE00: number }[] = await h.ds.query('SELECT "userId", "certifiedOn", kappa, "meanDeltaE00" FROM certification ORDER BY "userId"');
    assert.equal(rows.length, 2);
    for (const row of rows) {
      assert.equal(row.certifiedOn, today);
      close(row.kappa, KAPPA, 1e-12, 'stored κ');
    }
    for (const who of ['A', 'B', 'C'] as const) {
      const mails = await mailsTo(h.ds, observers[who].user.email);
      assert.equal(mails.length, 1, `${who} got one mail`);
      assert.match(mails[0]!.subject, /calibration results are out: Morning group/);
      assert.match(mails[0]!.text, new RegExp(`/calibration/sessions/${sessionId}`));
    }
    const audit: { action: string }[] = await h.ds.query(`SELECT action FROM audit_event WHERE action LIKE 'calibration.%' ORDER BY id`);
    const actions = audit.map((a) => a.action);
    assert.equal(actions.filter((a) => a === 'calibration.certified').length, 2);
    assert.ok(actions.includes('calibration.session.closed') && actions.includes('calibration.response.replaced'));
    const after = await results();
    assert.deepEqual(after.observers.filter((o) => o.certified).map((o) => o.userId).sort(), answer.certifiedUserIds.sort());
  });

  test('should refuse answers, specimens, invitations and a second close once closed (409), writing nothing', async () => {
    const before = await rowCounts(h.ds);
    assertProblem(await pick('A', 0, 'F-158.026'), 409);
    assertProblem(await trainer.post(`/api/calibration/sessions/${sessionId}/specimens`, { label: 'late', lab: [50, 0, 0] }), 409);
    assertProblem(await trainer.post(`/api/calibration/sessions/${sessionId}/participants`, { userIds: [observers.D.user.id] }), 409);
    assertProblem(await admin.post(`/api/calibration/sessions/${sessionId}/close`), 409);
    assert.deepEqual(await rowCounts(h.ds), before);
  });

  test("should give each observer their own result after close, with their chip against each reference", async () => {
    const mine = (await observers.C.client.get(`/api/calibration/sessions/${sessionId}/results/me`).expect(200)).body as MyCalibrationResult;
    assert.equal(mine.observer.userId, observers.C.user.id);
    assert.equal(mine.observer.certified, false);
    assert.equal(mine.certification, null);
    mine.specimens.forEach((s, i) => {
      assert.equal(s.chipCode, PICKS.C[i]);
      assert.deepEqual(s.chipLab, CHIPS[PICKS.C[i]!]);
      close(s.deltaE00, colorjsDE00(SPECIMENS[i]!.lab, CHIPS[PICKS.C[i]!]!), 1e-6, `C ΔE00 S${i + 1}`);
    });
    assert.deepEqual(mine.specimens.map((s) => s.fieldHit), [true, false, true]);
    const a = (await observers.A.client.get(`/api/calibration/sessions/${sessionId}/results/me`).expect(200)).body as MyCalibrationResult;
    assert.equal(a.certification?.certifiedOn, new Date().toISOString().slice(0, 10));
    const detail = (await observers.A.client.get(`/api/calibration/sessions/${sessionId}`).expect(200)).body as CalibrationSessionDetail;
    assert.deepEqual(detail.specimens.map((s) => s.referenceLab), SPECIMENS.map((s) => s.lab), 'references are shown once closed');
  });

  test('should list certifications (own for observers, all for trainers) and show "not screened" until a screening is recorded', async () => {
    const own = (await observers.A.client.get('/api/calibration/certifications').expect(200)).body;
    assert.equal(own.length, 1);
    assert.equal(own[0].referenceSetId, 'v1');
    assert.equal(own[0].sessionId, sessionId);
    close(own[0].meanDeltaE00, expectedMeanDE(PICKS.A), 1e-6, 'certified mean ΔE00');
    assert.equal(own[0].screening, null);
    assert.equal((await observers.C.client.get('/api/calibration/certifications').expect(200)).body.length, 0);
    assert.equal((await trainer.get('/api/calibration/certifications').expect(200)).body.length, 2);

    await observers.A.client.post('/api/calibration/screenings', { screenedOn: '2026-02-01', method: 'pseudoisochromatic-plates', result: 'normal', notes: 'self-reported' }).expect(201);
    const before = await rowCounts(h.ds);
    assertProblem(await observers.A.client.post('/api/calibration/screenings', { userId: observers.B.user.id, screenedOn: '2026-02-01', method: 'other', result: 'normal' }), 403);
    assert.deepEqual(await rowCounts(h.ds), before);
    await trainer.post('/api/calibration/screenings', { userId: observers.B.user.id, screenedOn: '2026-02-02', method: 'anomaloscope', result: 'unsure' }).expect(201);
    const mine = (await observers.A.client.get('/api/calibration/screenings').expect(200)).body;
    assert.deepEqual(mine.map((s: { userId: number }) => s.userId), [observers.A.user.id]);
    assert.equal((await trainer.get('/api/calibration/screenings').expect(200)).body.length, 2);
    const certs = (await trainer.get(`/api/calibration/certifications?userId=${observers.A.user.id}`).expect(200)).body;
    assert.deepEqual(certs[0].screening, { screenedOn: '2026-02-01', method: 'pseudoisochromatic-plates', result: 'normal' });
    const r = await results();
    assert.equal(r.observers.find((o) => o.userId === observers.C.user.id)!.screening, null, 'C is not screened');
  });

  test('should admit only invited observers to a restricted session', async () => {
    const id = (await trainer.post('/api/calibration/sessions', { title: 'Invited only', restricted: true, thresholds: { deltaE00: 2.5 } }).expect(201)).body.id;
    const specimen = (await trainer.post(`/api/calibration/sessions/${id}/specimens`, { label: 'chip specimen', chipCode: 'F-092.076' }).expect(201)).body.id;
    const invited = await trainer.post(`/api/calibration/sessions/${id}/participants`, { userIds: [observers.A.user.id] }).expect(200);
    assert.equal(invited.body.added, 1);
    const before = await rowCounts(h.ds);
    assertProblem(await observers.D.client.post(`/api/calibration/sessions/${id}/responses`, { specimenId: specimen, chipCode: 'F-092' }), 403);
    assertProblem(await observers.D.client.get(`/api/calibration/sessions/${id}`), 403);
    assert.deepEqual(await rowCounts(h.ds), before);
    await observers.A.client.post(`/api/calibration/sessions/${id}/responses`, { specimenId: specimen, chipCode: 'F-092' }).expect(201);
    const listD = (await observers.D.client.get('/api/calibration/sessions').expect(200)).body as { id: number }[];
    assert.ok(!listD.some((s) => s.id === id), 'an outsider does not see a restricted session');
    const listA = (await observers.A.client.get('/api/calibration/sessions').expect(200)).body as { id: number; canRespond: boolean }[];
    assert.equal(listA.find((s) => s.id === id)?.canRespond, true);
    const r = (await admin.get(`/api/calibration/sessions/${id}/results`).expect(200)).body as CalibrationResults;
    assert.deepEqual(r.thresholds, { kappa: 0.61, deltaE00: 2.5 });
    assert.equal(r.specimens[0]!.referenceFieldCode, 'F-092');
    assert.deepEqual(r.specimens[0]!.referenceLab, CHIPS['F-092.076']);
    assert.equal(r.fleissKappa, null, 'one answer: no agreement to measure');
  });

  test("should sample a photo region on the server for a specimen's reference", async () => {
    const rgb: [number, number, number] = [120, 60, 110];
    const bytes = await fromRaw(paintScene(32, 32, rgb, []), 32, 32).png().toBuffer();
    const photoId = (await uploadPhoto(trainer, bytes, 'tissue.png', 'image/png').expect(201)).body.id;
    const id = (await trainer.post('/api/calibration/sessions', { title: 'Photo specimens' }).expect(201)).body.id;
    await trainer.post(`/api/calibration/sessions/${id}/specimens`, { label: 'photo', photoId, region: { shape: 'rect', x: 4, y: 4, width: 20, height: 20 } }).expect(201);
    const detail = (await trainer.get(`/api/calibration/sessions/${id}`).expect(200)).body as CalibrationSessionDetail;
    const expected = labOfRgb8(rgb); // a uniform sRGB patch: its CIELAB through culori
    close(detail.specimens[0]!.referenceLab![0], expected.l, 0.05, 'L*');
    close(detail.specimens[0]!.referenceLab![1], expected.a, 0.05, 'a*');
    close(detail.specimens[0]!.referenceLab![2], expected.b, 0.05, 'b*');
    assert.equal(detail.specimens[0]!.source, 'photo');
    assert.equal(detail.specimens[0]!.photoId, photoId);
  });
});
