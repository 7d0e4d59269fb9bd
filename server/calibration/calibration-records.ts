// An observer's own results, certifications and colour-vision screenings. No req/res.
import type { DataSource, FindOptionsWhere } from 'typeorm';
import type { Certification as CertificationDto, MyCalibrationResult, ObserverStandingRow, Screening } from '../../shared/api/calibration-answers.js';
import type { CreateScreeningBody } from '../../shared/api/calibration.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import { assertMaySee, findSession, latestScreenings, loadResults, runsSessions, today } from './calibration-load.js';
import { score } from './calibration-results.js';
import { CalibrationResponse, CalibrationSession, Specimen } from './calibration-session.entity.js';
import { certificationState, sessionOutcomes } from './certificate-standing.js';
import { Certification, ColourVisionScreening } from './certification.entity.js';

/** The caller's own row and per-specimen picks against the references; 409 while the session is open. */
export async function myResult(ds: DataSource, user: User, sessionId: number): Promise<MyCalibrationResult> {
  const m = ds.manager;
  const session = await findSession(m, sessionId);
  await assertMaySee(m, session, user);
  if (session.status !== 'closed' || !session.closedAt) throw AppError.conflict(`Calibration session ${sessionId} is still open: results come out when the trainer closes it.`);
  const results = await loadResults(m, session);
  const screening = (await latestScreenings(m, [user.id])).get(user.id) ?? null;
  const observer = results.observers.find((o) => o.userId === user.id) ?? {
    userId: user.id,
    name: user.name,
    n: 0,
    complete: false,
    meanDeltaE00: null,
    bias: null,
    fieldHitRate: null,
    qualifies: false,
    certified: false,
    screening,
    failedRules: [{ rule: 'complete', text: 'did not answer in this session' }],
    advice: 'You did not answer in this session.',
  };
  const specimens = await m.find(Specimen, { where: { session: { id: sessionId } }, order: { position: 'ASC' } });
  const mine = await m.find(CalibrationResponse, { where: { session: { id: sessionId }, observer: { id: user.id } } });
  const cert = await m.findOne(Certification, { where: { session: { id: sessionId }, user: { id: user.id } } });
  return {
    sessionId,
    title: session.title,
    referenceSetId: session.referenceSetId,
    closedAt: session.closedAt.toISOString(),
    thresholds: results.thresholds,
    fleissKappa: results.fleissKappa,
    band: results.band,
    observer,
    specimens: specimens.map((s) => {
      const lab = { l: s.l, a: s.a, b: s.b };
      const ref = { id: s.id, label: s.label, position: s.position, lab, referenceFieldCode: s.referenceFieldCode };
      const r = mine.find((x) => x.specimenId === s.id);
      const scored = r ? score({ specimenId: s.id, observerId: user.id, chipCode: r.chipCode, fieldCode: r.fieldCode, lab: { l: r.l, a: r.a, b: r.b } }, ref) : null;
      return {
        specimenId: s.id,
        label: s.label,
        position: s.position,
        referenceLab: [s.l, s.a, s.b],
        referenceHex: displayHex(lab).hex,
        referenceFieldCode: s.referenceFieldCode,
        chipCode: r?.chipCode ?? null,
        chipLab: r ? [r.l, r.a, r.b] : null,
        chipHex: r ? displayHex({ l: r.l, a: r.a, b: r.b }).hex : null,
        deltaE00: scored?.deltaE00 ?? null,
        delta: scored?.delta ?? null,
        fieldHit: scored?.fieldHit ?? null,
      };
    }),
    certification: cert ? (await toCertificationDtos(ds, [cert]))[0]! : null,
  };
}

/** Certifications, newest first: trainers and admins see everyone's (or one user's), others their own. */
export async function listCertifications(ds: DataSource, user: User, userId?: number): Promise<CertificationDto[]> {
  const where: FindOptionsWhere<Certification> = runsSessions(user) ? (userId ? { user: { id: userId } } : {}) : { user: { id: user.id } };
  const rows = await ds.getRepository(Certification).find({ where, order: { certifiedOn: 'DESC', id: 'DESC' } });
  return toCertificationDtos(ds, rows);
}

/** Certifications as the API shows them, with their standing on `on` (default today, UTC). */
export async function toCertificationDtos(ds: DataSource, rows: Certification[], on = today()): Promise<CertificationDto[]> {
  if (!rows.length) return [];
  const m = ds.manager;
  const userIds = [...new Set(rows.map((r) => r.userId))];
  const names = await namesOf(ds, userIds);
  const screenings = await latestScreenings(m, userIds);
  const outcomes = await sessionOutcomes(m, userIds);
  const sessions = new Map<number, CalibrationSession>();
  for (const id of new Set(rows.map((r) => r.sessionId))) sessions.set(id, await findSession(m, id));
  return rows.map((r) => ({
    ...certificationState(r, sessions.get(r.sessionId)?.closedAt?.getTime() ?? r.createdAt.getTime(), outcomes, on),
    id: r.id,
    userId: r.userId,
    name: names.get(r.userId) ?? '',
    referenceSetId: r.referenceSetId,
    sessionId: r.sessionId,
    sessionTitle: sessions.get(r.sessionId)?.title ?? '',
    certifiedOn: r.certifiedOn,
    kappa: r.kappa,
    meanDeltaE00: r.meanDeltaE00,
    n: r.n,
    thresholds: { kappa: r.kappaThreshold, deltaE00: r.deltaE00Threshold },
    screening: screenings.get(r.userId) ?? null,
  }));
}

/** Every active user with their latest certification's standing: current, lapsed or never certified. */
export async function listStandings(ds: DataSource, on = today()): Promise<ObserverStandingRow[]> {
  const users = await ds.getRepository(User).find({ where: { active: true }, order: { name: 'ASC', id: 'ASC' } });
  const certs = await ds.getRepository(Certification).find({ order: { certifiedOn: 'DESC', id: 'DESC' } });
  const latest = new Map<number, Certification>();
  for (const c of certs) if (!latest.has(c.userId)) latest.set(c.userId, c);
  const dtos = new Map((await toCertificationDtos(ds, [...latest.values()], on)).map((d) => [d.userId, d]));
  return users.map((u) => {
    const cert = dtos.get(u.id) ?? null;
    return { userId: u.id, name: u.name, role: u.role, standing: cert ? cert.status : 'never', latest: cert };
  });
}

/** One certification the user may see (their own; trainers and admins any); 404 otherwise. */
export async function findCertification(ds: DataSource, user: User, id: number): Promise<CertificationDto> {
  const row = await ds.getRepository(Certification).findOneBy({ id });
  if (!row || (row.userId !== user.id && !runsSessions(user))) throw AppError.notFound(`There is no certificate ${id}.`);
  return (await toCertificationDtos(ds, [row]))[0]!;
}

async function namesOf(ds: DataSource, ids: number[]): Promise<Map<number, string>> {
  const users = await ds.getRepository(User).find({ where: [...new Set(ids)].map((id) => ({ id })) });
  return new Map(users.map((u) => [u.id, u.name]));
}

/** Screenings, newest first: trainers and admins see everyone's (or one user's), others their own. */
export async function listScreenings(ds: DataSource, user: User, userId?: number): Promise<Screening[]> {
  const where: FindOptionsWhere<ColourVisionScreening> = runsSessions(user) ? (userId ? { user: { id: userId } } : {}) : { user: { id: user.id } };
  const rows = await ds.getRepository(ColourVisionScreening).find({ where, order: { screenedOn: 'DESC', id: 'DESC' } });
  if (!rows.length) return [];
  const names = await namesOf(ds, rows.flatMap((r) => [r.userId, r.recordedById]));
  return rows.map((r) => ({
    id: r.id,
    userId: r.userId,
    name: names.get(r.userId) ?? '',
    screenedOn: r.screenedOn,
    method: r.method,
    result: r.result,
    notes: r.notes,
    recordedById: r.recordedById,
    recordedByName: names.get(r.recordedById) ?? '',
    createdAt: r.createdAt.toISOString(),
  }));
}

/** Records a self-reported screening: an observer their own, a trainer or admin anyone's. */
export async function recordScreening(ds: DataSource, user: User, actor: Actor, body: CreateScreeningBody): Promise<{ id: number }> {
  const userId = body.userId ?? user.id;
  if (userId !== user.id && !runsSessions(user)) throw AppError.forbidden('Only trainers and admins record a screening for someone else.');
  if (body.screenedOn > today()) throw AppError.badRequest('A screening cannot be dated in the future.', [{ field: 'screenedOn', message: 'is in the future' }]);
  return ds.transaction(async (m) => {
    if (!(await m.existsBy(User, { id: userId }))) throw AppError.badRequest(`There is no user ${userId}.`, [{ field: 'userId', message: 'is not a user' }]);
    const row = await m.save(m.create(ColourVisionScreening, { user: { id: userId }, screenedOn: body.screenedOn, method: body.method, result: body.result, notes: body.notes || null, recordedBy: { id: user.id } }));
    await recordAudit(m, actor, 'calibration.screening.recorded', `user:${userId}`, { screeningId: row.id, screenedOn: body.screenedOn, method: body.method, result: body.result });
    return { id: row.id };
  });
}
