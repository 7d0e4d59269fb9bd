// Reading a session's rows for the results and the access rules every calibration route shares.
import { In, type EntityManager } from 'typeorm';
import type { CalibrationResults, Participant as ParticipantDto, ScreeningSummary } from '../../shared/api/calibration-answers.js';
import type { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import { CalibrationResponse, CalibrationSession, Participant, Specimen } from './calibration-session.entity.js';
import { Certification, ColourVisionScreening } from './certification.entity.js';
import { computeResults } from './calibration-results.js';

/** Whether the user runs sessions (sees every answer and result). */
export function runsSessions(user: User): boolean {
  return user.role === 'trainer' || user.role === 'admin';
}

/** Today's date, "YYYY-MM-DD" (UTC). */
export function today(now = new Date()): string {
  return now.toISOString().slice(0, 10);
}

/** The session; 404 when there is none. */
export async function findSession(m: EntityManager, id: number): Promise<CalibrationSession> {
  const session = await m.findOneBy(CalibrationSession, { id });
  if (!session) throw AppError.notFound(`There is no calibration session ${id}.`);
  return session;
}

/** 409 unless the session is open. */
export function assertOpen(session: CalibrationSession, what: string): void {
  if (session.status !== 'open') throw AppError.conflict(`Calibration session ${session.id} is closed: ${what}.`);
}

/** The user's participant row in a session, if any. */
export function participantOf(m: EntityManager, sessionId: number, userId: number): Promise<Participant | null> {
  return m.findOneBy(Participant, { session: { id: sessionId }, user: { id: userId } });
}

/** Whether the user may take part: the session is unrestricted or they were invited. */
export function mayTakePart(session: CalibrationSession, participant: Participant | null): boolean {
  return !session.restricted || participant?.invited === true;
}

/** 403 for a restricted session the user was not invited to and does not run. */
export async function assertMaySee(m: EntityManager, session: CalibrationSession, user: User): Promise<Participant | null> {
  const participant = await participantOf(m, session.id, user.id);
  if (runsSessions(user) || mayTakePart(session, participant) || participant) return participant;
  throw AppError.forbidden(`Calibration session ${session.id} is only for invited observers.`);
}

/** Each user's latest screening (by screening date, then by when it was recorded). */
export async function latestScreenings(m: EntityManager, userIds: readonly number[]): Promise<Map<number, ScreeningSummary>> {
  const latest = new Map<number, ScreeningSummary>();
  if (!userIds.length) return latest;
  const rows = await m.find(ColourVisionScreening, { where: { user: { id: In([...userIds]) } }, order: { screenedOn: 'DESC', id: 'DESC' } });
  for (const r of rows) if (!latest.has(r.userId)) latest.set(r.userId, { screenedOn: r.screenedOn, method: r.method, result: r.result });
  return latest;
}

/** A session's participants with names and answer counts, by name. */
export async function participantsOf(m: EntityManager, sessionId: number): Promise<ParticipantDto[]> {
  const rows: { userId: number; name: string; invited: number | boolean; responses: number }[] = await m.query(
    `SELECT p."userId" AS userId, u.name AS name, p.invited AS invited,
            (SELECT COUNT(*) FROM calibration_response r WHERE r."sessionId" = p."sessionId" AND r."observerId" = p."userId") AS responses
       FROM calibration_participant p JOIN "user" u ON u.id = p."userId"
      WHERE p."sessionId" = ? ORDER BY u.name, p."userId"`,
    [sessionId],
  );
  return rows.map((r) => ({ userId: r.userId, name: r.name, invited: Boolean(r.invited), responses: Number(r.responses) }));
}

/** Loads everything a session's results need and computes them. */
export async function loadResults(m: EntityManager, session: CalibrationSession, now = new Date()): Promise<CalibrationResults> {
  const specimens = await m.find(Specimen, { where: { session: { id: session.id } }, order: { position: 'ASC' } });
  const observers = await participantsOf(m, session.id);
  const responses = await m.find(CalibrationResponse, { where: { session: { id: session.id } }, order: { id: 'ASC' } });
  const certifications = await m.find(Certification, { where: { session: { id: session.id } } });
  const screenings = await latestScreenings(m, observers.map((o) => o.userId));
  return computeResults({
    session,
    specimens: specimens.map((s) => ({ id: s.id, label: s.label, position: s.position, lab: { l: s.l, a: s.a, b: s.b }, referenceFieldCode: s.referenceFieldCode })),
    observers,
    responses: responses.map((r) => ({ specimenId: r.specimenId, observerId: r.observerId, chipCode: r.chipCode, fieldCode: r.fieldCode, lab: { l: r.l, a: r.a, b: r.b } })),
    certified: new Set(certifications.map((c) => c.userId)),
    screenings,
    computedAt: session.closedAt ?? now,
  });
}
