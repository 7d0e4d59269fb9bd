// When a certification holds: for CERTIFICATION_VALID_MONTHS after the session that earned it,
// and only until the observer answers in a later session and is not certified by it. Worked out
// on reading rather than stored, so nothing has to run on a timer. No req/res.
import type { EntityManager } from 'typeorm';
import { CERTIFICATION_VALID_MONTHS, type CertificationStatus } from '../../shared/api/calibration-answers.js';
import { CalibrationSession } from './calibration-session.entity.js';
import type { Certification } from './certification.entity.js';

/** "YYYY-MM-DD" plus whole months, clamped to the month's last day (31 Jan + 1 month = 28/29 Feb). */
export function addMonths(day: string, months: number): string {
  const [y, m, d] = day.split('-').map(Number) as [number, number, number];
  const first = new Date(Date.UTC(y, m - 1 + months, 1));
  const last = new Date(Date.UTC(first.getUTCFullYear(), first.getUTCMonth() + 1, 0)).getUTCDate();
  first.setUTCDate(Math.min(d, last));
  return first.toISOString().slice(0, 10);
}

/** The day after a "YYYY-MM-DD". */
function dayAfter(day: string): string {
  const d = new Date(`${day}T00:00:00Z`);
  d.setUTCDate(d.getUTCDate() + 1);
  return d.toISOString().slice(0, 10);
}

/** A certification's standing on a given day. */
export interface CertificationState {
  validUntil: string;
  status: CertificationStatus;
  lapsedOn: string | null;
  lapseReason: string | null;
}

/** Closed sessions each user answered in, with whether that session certified them. */
export interface SessionOutcome {
  userId: number;
  sessionId: number;
  title: string;
  /** "YYYY-MM-DD" (UTC) the session closed. */
  closedOn: string;
  closedAt: number;
  certified: boolean;
}

/** Every closed session each of the users answered in, oldest first. */
export async function sessionOutcomes(m: EntityManager, userIds: readonly number[]): Promise<SessionOutcome[]> {
  if (!userIds.length) return [];
  const rows: { userId: number; sessionId: number; certified: number }[] = await m.query(
    `SELECT DISTINCT r."observerId" AS userId, r."sessionId" AS sessionId,
            EXISTS (SELECT 1 FROM certification c WHERE c."sessionId" = r."sessionId" AND c."userId" = r."observerId") AS certified
       FROM calibration_response r JOIN calibration_session s ON s.id = r."sessionId"
      WHERE s.status = 'closed' AND r."observerId" IN (${userIds.map(() => '?').join(',')})`,
    [...userIds],
  );
  const sessions = new Map((await m.find(CalibrationSession, { where: { status: 'closed' } })).map((s) => [s.id, s]));
  return rows
    .flatMap((r) => {
      const s = sessions.get(r.sessionId);
      if (!s?.closedAt) return [];
      return [{ userId: r.userId, sessionId: r.sessionId, title: s.title, closedOn: s.closedAt.toISOString().slice(0, 10), closedAt: s.closedAt.getTime(), certified: Boolean(r.certified) }];
    })
    .sort((a, b) => a.closedAt - b.closedAt);
}

/**
 * A certification's state on `today`: lapsed on the day a later closed session did not certify
 * the observer, or the day after `validUntil`, whichever comes first; else current. The reason
 * names no date: the screens write `lapsedOn` and `certifiedOn` beside it in the reader's own style.
 */
export function certificationState(cert: Pick<Certification, 'userId' | 'sessionId' | 'certifiedOn'>, earnedAt: number, outcomes: readonly SessionOutcome[], today: string): CertificationState {
  const validUntil = addMonths(cert.certifiedOn, CERTIFICATION_VALID_MONTHS);
  const failed = outcomes.find((o) => o.userId === cert.userId && o.sessionId !== cert.sessionId && o.closedAt > earnedAt && !o.certified);
  const expiry = dayAfter(validUntil);
  if (failed && failed.closedOn <= today && failed.closedOn <= expiry) {
    return { validUntil, status: 'lapsed', lapsedOn: failed.closedOn, lapseReason: `not certified by the later session "${failed.title}"` };
  }
  if (expiry <= today) return { validUntil, status: 'lapsed', lapsedOn: expiry, lapseReason: `${CERTIFICATION_VALID_MONTHS} months passed since it was earned: calibrate again` };
  return { validUntil, status: 'current', lapsedOn: null, lapseReason: null };
}
