// Calibration results people can act on (issue 17): κ with its interval and a small-sample
// warning, each observer's pick per specimen, the failed rule and what to practise, certificates
// as PDF that lapse by time and after a failed session, and the standings of every observer.
import { after, before, describe, test } from 'node:test';
import assert from 'node:assert/strict';
import Color from 'colorjs.io';
import type { CalibrationResults, Certification, ObserverStandingRow } from '../../shared/api/calibration-answers.js';
import { certificationState } from '../../server/calibration/certificate-standing.js';
import { assertProblem } from './assert-problem.js';
import type { NotificationList } from '../../shared/api/review-answers.js';
import { addUser, Client, mailsTo, PASSWORD, startHarness, type Harness } from './harness.js';

type Lab3 = [number, number, number];
/** CIEDE2000 by colorjs.io, independent of the server's culori (same L*a*b* numbers, the formula compared). */
const colorjsDE00 = (p: Lab3, q: Lab3) => new Color('lab', p).deltaE(new Color('lab', q), '2000');

// Chips as published in reference-colors/reference-set-v1.json (see tests/api/calibration.test.ts).
const CHIPS: Record<string, Lab3> = {
  'F-158': [42.06, 25.91, -12.93],
  'F-158.026': [41.21, 26.38, -15.05],
  'F-092': [50.02, -16.12, 13.46],
  'F-092.076': [49.95, -16.02, 15.41],
  'F-053': [90.06, 0.4, 17.18],
  'F-053.050': [88.33, -0.05, 16.93],
};
const SPECIMENS: { label: string; lab: Lab3 }[] = [
  { label: 'S1 petiole purple', lab: [42.5, 26.5, -13.5] },
  { label: 'S2 leaf green', lab: [50.5, -16.5, 14.0] },
  { label: 'S3 corm cream', lab: [89.5, 0.8, 17.5] },
];

/** The words of an uncompressed pdfkit page: its text is written as hex strings inside TJ arrays. */
function pdfText(pdf: Buffer): string {
  const body = pdf.toString('latin1');
  return [...body.matchAll(/<([0-9a-f]+)>/gi)].map((m) => Buffer.from(m[1]!, 'hex').toString('latin1')).join('');
}

describe('calibration results people can act on', () => {
  let h: Harness;
  let trainer: Client;
  const obs = {} as Record<'A' | 'B' | 'C', { client: Client; id: number }>;
  let first: number;
  const specimenIds: number[] = [];

  const join = async (who: 'A' | 'B' | 'C', role: 'recorder' | 'reviewer') => {
    const user = await addUser(h.ds, role, `loop-${who.toLowerCase()}@test.example`);
    await h.ds.query('UPDATE "user" SET name = ? WHERE id = ?', [`Observer ${who}`, user.id]);
    obs[who] = { id: user.id, client: await new Client(h.app).signIn(user.email, PASSWORD) };
  };
  const pick = (who: 'A' | 'B' | 'C', session: number, specimenId: number, chipCode: string) =>
    obs[who].client.post(`/api/calibration/sessions/${session}/responses`, { specimenId, chipCode }).expect(201);
  const results = async (id: number) => (await trainer.get(`/api/calibration/sessions/${id}/results`).expect(200)).body as CalibrationResults;

  before(async () => {
    h = await startHarness();
    const t = await addUser(h.ds, 'trainer', 'loop-trainer@test.example');
    trainer = await new Client(h.app).signIn(t.email, PASSWORD);
    await join('A', 'recorder');
    await join('B', 'reviewer');
    await join('C', 'recorder');
    first = (await trainer.post('/api/calibration/sessions', { title: 'Small group' }).expect(201)).body.id;
    for (const s of SPECIMENS) specimenIds.push((await trainer.post(`/api/calibration/sessions/${first}/specimens`, { label: s.label, lab: s.lab }).expect(201)).body.id);
    // A and B pick the nearest chips; C picks the right field chips' centres on S1 and S3 and a wrong field chip on S2.
    for (const [i, code] of ['F-158.026', 'F-092.076', 'F-053.050'].entries()) await pick('A', first, specimenIds[i]!, code);
    for (const [i, code] of ['F-158', 'F-092', 'F-053'].entries()) await pick('B', first, specimenIds[i]!, code);
    for (const [i, code] of ['F-158', 'F-053', 'F-053'].entries()) await pick('C', first, specimenIds[i]!, code);
  });
  after(() => h.close());

  test("should give κ a 95 % bootstrap interval that holds κ, and say 3 specimens are too few to judge", async () => {
    const r = await results(first);
    assert.ok(r.fleissKappa !== null);
    assert.ok(r.kappaInterval, 'an interval');
    assert.equal(r.kappaInterval.method, 'percentile bootstrap over specimens');
    assert.equal(r.kappaInterval.level, 0.95);
    assert.ok(r.kappaInterval.lower <= r.fleissKappa && r.fleissKappa <= r.kappaInterval.upper);
    assert.ok(r.sampleWarnings.some((w) => /^Sample too small to judge: κ rests on 3 specimens/.test(w)), r.sampleWarnings.join(' | '));
  });

  test("should show each observer's pick beside the reference with its ΔE00 (checked by colorjs.io)", async () => {
    const r = await results(first);
    const s2 = r.specimens[1]!;
    assert.deepEqual(s2.picks.map((p) => [p.name, p.chipCode, p.fieldHit]), [['Observer A', 'F-092.076', true], ['Observer B', 'F-092', true], ['Observer C', 'F-053', false]]);
    for (const p of s2.picks) assert.ok(Math.abs(p.deltaE00 - colorjsDE00(SPECIMENS[1]!.lab, CHIPS[p.chipCode]!)) < 1e-6, `${p.name} ΔE00`);
    assert.match(s2.picks[0]!.chipHex, /^#[0-9a-f]{6}$/);
  });

  test('should name the failed rule and what to practise for an observer who is not certified', async () => {
    const r = await results(first);
    const c = r.observers.find((o) => o.userId === obs.C.id)!;
    assert.equal(c.qualifies, false);
    const mean = colorjsDE00(SPECIMENS[0]!.lab, CHIPS['F-158']!) / 3 + colorjsDE00(SPECIMENS[1]!.lab, CHIPS['F-053']!) / 3 + colorjsDE00(SPECIMENS[2]!.lab, CHIPS['F-053']!) / 3;
    assert.deepEqual(c.failedRules.map((f) => f.rule), ['deltaE00']);
    assert.equal(c.failedRules[0]!.text, `mean ΔE00 ${mean.toFixed(2)} is above the limit 1.8`);
    assert.match(c.advice, /missed the reference's field chip on 33 % of specimens \(S2 leaf green\)/);
    assert.match(c.advice, /practise the field card first/);
    const a = r.observers.find((o) => o.userId === obs.A.id)!;
    assert.deepEqual(a.failedRules, []);
    assert.match(a.advice, /close to the references/);
  });

  test('should explain a right field chip with a high mean ΔE00 in one sentence: the field chip is a coarse cell', async () => {
    // B picks the field chips' centres: every field chip right; its ΔE00 against a tight limit fails.
    const id = (await trainer.post('/api/calibration/sessions', { title: 'Tight limit', thresholds: { deltaE00: 0.5 } }).expect(201)).body.id;
    const spec = (await trainer.post(`/api/calibration/sessions/${id}/specimens`, { label: 'S1', lab: SPECIMENS[0]!.lab }).expect(201)).body.id;
    await pick('B', id, spec, 'F-158');
    const b = (await results(id)).observers.find((o) => o.userId === obs.B.id)!;
    assert.equal(b.fieldHitRate, 1);
    assert.match(b.advice, /picked the reference's field chip on 100 % of specimens, but the chips they picked sit on average [0-9.]+ ΔE00 from the references \(limit 0.5\): a field chip is a coarse cell/);
  });

  test('should serve the certificate PDF to its holder and trainers (observer, session, rules, figures, valid until), 404 to others', async () => {
    await trainer.post(`/api/calibration/sessions/${first}/close`).expect(200);
    const [cert] = (await obs.A.client.get('/api/calibration/certifications').expect(200)).body as Certification[];
    assert.ok(cert);
    assert.equal(cert.status, 'current');
    const year = Number(cert.certifiedOn.slice(0, 4));
    assert.equal(cert.validUntil, `${year + 1}${cert.certifiedOn.slice(4)}`.replace(/-02-29$/, '-02-28'));
    const res = await obs.A.client.get(`/api/calibration/certifications/${cert.id}/certificate.pdf`).expect(200);
    assert.equal(res.headers['content-type'], 'application/pdf');
    const body = res.body as Buffer;
    assert.equal(body.subarray(0, 5).toString('latin1'), '%PDF-');
    const text = pdfText(body);
    // Days in words, day, short month, year (en-GB's style; the PDF has no reader's language), written here by Intl.
    const day = (iso: string) => new Intl.DateTimeFormat('en-GB', { day: 'numeric', month: 'short', year: 'numeric', timeZone: 'UTC' }).format(new Date(`${iso}T00:00:00Z`));
    for (const words of ['Observer A', 'Small group', `Valid until: ${day(cert.validUntil)}`, 'rule at least 0.61', 'limit 1.8', `Certified on: ${day(cert.certifiedOn)}`]) assert.ok(text.includes(words), `the PDF says "${words}"`);
    assert.doesNotMatch(text, /\b\d{4}-\d{2}-\d{2}\b/, 'no ISO date in the certificate');
    await trainer.get(`/api/calibration/certifications/${cert.id}/certificate.pdf`).expect(200);
    assertProblem(await obs.C.client.get(`/api/calibration/certifications/${cert.id}/certificate.pdf`), 404);
  });

  test('should tell each observer in the app that the results are out, with their own outcome', async () => {
    const a = (await obs.A.client.get('/api/notifications').expect(200)).body as NotificationList;
    const c = (await obs.C.client.get('/api/notifications').expect(200)).body as NotificationList;
    const resultsOf = (list: NotificationList) => list.items.filter((n) => n.kind === 'calibration-results' && n.sessionId === first);
    assert.equal(resultsOf(a).length, 1);
    assert.match(resultsOf(a)[0]!.message, /^The results of "Small group" are out, and you are certified\./);
    assert.equal(resultsOf(a)[0]!.readingId, null);
    assert.match(resultsOf(c)[0]!.message, /you are not certified: mean ΔE00 [0-9.]+ is above the limit 1.8/);
    assert.ok(c.unread >= 1);
    assert.equal((await mailsTo(h.ds, 'loop-c@test.example')).filter((m) => /calibration results are out: Small group/.test(m.subject)).length, 1);
  });

  test('should tell an invited observer in the app and by mail, once', async () => {
    const id = (await trainer.post('/api/calibration/sessions', { title: 'Invited group', heldOn: '2026-04-02', restricted: true }).expect(201)).body.id;
    const answer = (await trainer.post(`/api/calibration/sessions/${id}/participants`, { userIds: [obs.C.id] }).expect(200)).body as { added: number; mailed: number };
    assert.deepEqual([answer.added, answer.mailed], [1, 1]);
    await trainer.post(`/api/calibration/sessions/${id}/participants`, { userIds: [obs.C.id] }).expect(200);
    const notices = ((await obs.C.client.get('/api/notifications').expect(200)).body as NotificationList).items.filter((n) => n.kind === 'calibration-invited' && n.sessionId === id);
    assert.equal(notices.length, 1, 'inviting again sends nothing more');
    assert.equal(notices[0]!.message, 'You are invited to the calibration session "Invited group": open it and pick a chip for each specimen.');
    const mails = (await mailsTo(h.ds, 'loop-c@test.example')).filter((m) => m.subject === 'You are invited to a calibration session: Invited group');
    assert.equal(mails.length, 1);
    assert.match(mails[0]!.text, new RegExp(`/calibration/sessions/${id}/take`));
    assert.match(mails[0]!.text, /gloves/);
    assert.match(mails[0]!.text, /calibration session "Invited group" of 2 Apr 2026\./, 'the day in words, not ISO');
  });

  test('should lapse a certification when a later session does not certify the observer, and list current, lapsed and never-certified observers', async () => {
    // Any κ passes here, so B's standing turns on B's own ΔE00 alone.
    const id = (await trainer.post('/api/calibration/sessions', { title: 'Refresher', thresholds: { kappa: -1 } }).expect(201)).body.id;
    const ids: number[] = [];
    for (const s of SPECIMENS) ids.push((await trainer.post(`/api/calibration/sessions/${id}/specimens`, { label: s.label, lab: s.lab }).expect(201)).body.id);
    // A now misses two field chips; B stays right.
    for (const [i, code] of ['F-158.026', 'F-053', 'F-092'].entries()) await pick('A', id, ids[i]!, code);
    for (const [i, code] of ['F-158', 'F-092', 'F-053'].entries()) await pick('B', id, ids[i]!, code);
    await trainer.post(`/api/calibration/sessions/${id}/close`).expect(200);
    const [certA] = (await obs.A.client.get('/api/calibration/certifications').expect(200)).body as Certification[];
    assert.equal(certA!.status, 'lapsed');
    assert.equal(certA!.lapsedOn, new Date().toISOString().slice(0, 10));
    assert.match(certA!.lapseReason!, /not certified by the later session "Refresher"/);
    const standings = (await trainer.get('/api/calibration/standings').expect(200)).body as ObserverStandingRow[];
    const of = (who: 'A' | 'B' | 'C') => standings.find((s) => s.userId === obs[who].id)!.standing;
    assert.deepEqual([of('A'), of('B'), of('C')], ['lapsed', 'current', 'never']);
    assertProblem(await obs.A.client.get('/api/calibration/standings'), 403);
  });

  test('should lapse a certification the day after it has held 12 months (end of month clamped)', () => {
    const cert = { userId: 1, sessionId: 1, certifiedOn: '2025-01-31' };
    const held = certificationState(cert, Date.parse('2025-01-31T12:00:00Z'), [], '2026-01-31');
    assert.deepEqual([held.status, held.validUntil], ['current', '2026-01-31']);
    const gone = certificationState(cert, Date.parse('2025-01-31T12:00:00Z'), [], '2026-02-01');
    assert.deepEqual([gone.status, gone.lapsedOn], ['lapsed', '2026-02-01']);
    assert.equal(certificationState({ ...cert, certifiedOn: '2024-02-29' }, 0, [], '2024-03-01').validUntil, '2025-02-28');
  });
});

describe('the demo observer with every field chip right and a high mean ΔE00', () => {
  let h: Harness;
  before(async () => {
    h = await startHarness({ demo: true });
  });
  after(() => h.close());

  test('should be told in one sentence why both figures hold and what to practise', async () => {
    const trainer = await new Client(h.app).signIn('trainer@demo.test', 'demo-pass-2026');
    const sessions = (await trainer.get('/api/calibration/sessions').expect(200)).body as { id: number; status: string }[];
    const closed = sessions.find((s) => s.status === 'closed')!;
    const r = (await trainer.get(`/api/calibration/sessions/${closed.id}/results`).expect(200)).body as CalibrationResults;
    const tamsin = r.observers.find((o) => o.name === 'Tamsin Orrowby')!;
    assert.equal(tamsin.fieldHitRate, 1);
    assert.ok(tamsin.meanDeltaE00! > r.thresholds.deltaE00);
    assert.deepEqual(tamsin.failedRules.map((f) => f.rule), ['deltaE00']);
    assert.match(tamsin.advice, /field chip is a coarse cell, so practise choosing the nearest fine chip within it/);
  });
});
