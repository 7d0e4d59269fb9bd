// Answering and closing: an observer's pick per specimen, and the close that freezes the results,
// stores certifications and tells every participant. No req/res.
import type { DataSource, EntityManager } from 'typeorm';
import type { CalibrationResults, CloseSessionAnswer, ResponseCreated } from '../../shared/api/calibration-answers.js';
import type { CreateResponseBody } from '../../shared/api/calibration.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import type { ReferenceSets } from '../reference-sets/reference-sets.js';
import { Notification } from '../reviews/review.entity.js';
import { resultsNotice, resultsOutMail } from './calibration-mail.js';
import { chipOf, fieldCodeOf } from './calibration-chips.js';
import { assertOpen, findSession, loadResults, mayTakePart, participantOf, today } from './calibration-load.js';
import { CalibrationResponse, CalibrationSession, Participant, Specimen } from './calibration-session.entity.js';
import { Certification } from './certification.entity.js';

/**
 * Records the signed-in observer's pick for a specimen; a later pick while the session is open
 * replaces it. 409 once closed, 403 for a restricted session they were not invited to.
 */
export async function respond(ds: DataSource, sets: ReferenceSets, actor: Actor & { id: number }, sessionId: number, body: CreateResponseBody): Promise<ResponseCreated & { created: boolean }> {
  const session = await findSession(ds.manager, sessionId);
  const set = await sets.get(session.referenceSetId);
  return ds.transaction(async (m) => {
    const current = await findSession(m, sessionId);
    assertOpen(current, 'answers can no longer be changed');
    const participant = await participantOf(m, sessionId, actor.id);
    if (!mayTakePart(current, participant)) throw AppError.forbidden(`Calibration session ${sessionId} is only for invited observers.`);
    const specimen = await m.findOneBy(Specimen, { id: body.specimenId, session: { id: sessionId } });
    if (!specimen) throw AppError.badRequest(`Specimen ${body.specimenId} is not part of calibration session ${sessionId}.`, [{ field: 'specimenId', message: 'is not a specimen of this session' }]);
    const chip = chipOf(set, body.chipCode);
    const pick = { chipCode: chip.code, fieldCode: fieldCodeOf(chip), l: chip.lab[0], a: chip.lab[1], b: chip.lab[2] };

    if (!participant) await m.insert(Participant, { session: { id: sessionId }, user: { id: actor.id }, invited: false });
    const earlier = await m.findOneBy(CalibrationResponse, { specimen: { id: specimen.id }, observer: { id: actor.id } });
    const subject = `calibration-session:${sessionId}`;
    if (earlier) {
      await m.update(CalibrationResponse, { id: earlier.id }, { ...pick, updatedAt: new Date() });
      await recordAudit(m, actor, 'calibration.response.replaced', subject, { responseId: earlier.id, specimenId: specimen.id, from: earlier.chipCode, to: chip.code });
      return { id: earlier.id, replaced: true, created: false };
    }
    const row = await m.save(m.create(CalibrationResponse, { session: { id: sessionId }, specimen: { id: specimen.id }, observer: { id: actor.id }, ...pick }));
    await recordAudit(m, actor, 'calibration.response.recorded', subject, { responseId: row.id, specimenId: specimen.id, chipCode: chip.code });
    return { id: row.id, replaced: false, created: true };
  });
}

/**
 * Closes a session in one transaction: computes the results, stores a certification for each
 * observer who answered every specimen and meets both thresholds (group κ ≥ the session's κ
 * threshold and their own mean ΔE00 ≤ its ΔE00 threshold), and audits it all. Then mails every
 * participant that their results are out; a failed mail does not undo the close.
 */
export async function closeSession(ds: DataSource, mailer: Mailer, publicUrl: string, actor: Actor, sessionId: number, logError: (err: unknown) => void = () => {}): Promise<CloseSessionAnswer> {
  const { results, certifiedUserIds, session } = await ds.transaction((m) => certifyAndClose(m, actor, sessionId, new Date()));
  const { mailed, mailFailed } = await mailParticipants(ds, mailer, publicUrl, session, results.observers.map((o) => o.userId), logError);
  return { results, certifiedUserIds, mailed, mailFailed };
}

/** The close itself, inside the caller's transaction (the demo seed uses it too). */
export async function certifyAndClose(m: EntityManager, actor: Actor, sessionId: number, closedAt: Date): Promise<{ results: CalibrationResults; certifiedUserIds: number[]; session: CalibrationSession }> {
  const session = await findSession(m, sessionId);
  assertOpen(session, 'it was closed before');
  const live = await loadResults(m, session, closedAt);
  const certifiedUserIds: number[] = [];
  for (const o of live.observers) {
    if (!o.qualifies) continue;
    await m.insert(Certification, {
      user: { id: o.userId },
      session: { id: sessionId },
      referenceSetId: session.referenceSetId,
      certifiedOn: today(closedAt),
      kappa: live.fleissKappa!,
      meanDeltaE00: o.meanDeltaE00!,
      n: o.n,
      kappaThreshold: session.kappaThreshold,
      deltaE00Threshold: session.deltaE00Threshold,
    });
    await recordAudit(m, actor, 'calibration.certified', `user:${o.userId}`, { sessionId, referenceSetId: session.referenceSetId, kappa: live.fleissKappa, meanDeltaE00: o.meanDeltaE00, n: o.n });
    certifiedUserIds.push(o.userId);
  }
  await m.update(CalibrationSession, { id: sessionId }, { status: 'closed', closedAt, kappaAtClose: live.fleissKappa });
  for (const o of live.observers) {
    const certified = certifiedUserIds.includes(o.userId);
    await m.insert(Notification, { userId: o.userId, kind: 'calibration-results', readingId: null, sessionId, message: resultsNotice(session.title, certified, o.failedRules), readAt: null });
  }
  await recordAudit(m, actor, 'calibration.session.closed', `calibration-session:${sessionId}`, {
    fleissKappa: live.fleissKappa,
    band: live.band,
    responses: live.progress.responses,
    expected: live.progress.expected,
    certified: certifiedUserIds,
  });
  const closed = await findSession(m, sessionId);
  return { results: await loadResults(m, closed), certifiedUserIds, session: closed };
}

async function mailParticipants(ds: DataSource, mailer: Mailer, publicUrl: string, session: CalibrationSession, userIds: number[], logError: (err: unknown) => void) {
  let mailed = 0;
  let mailFailed = 0;
  for (const id of userIds) {
    const user = await ds.getRepository(User).findOneBy({ id });
    if (!user) continue;
    try {
      await mailer.send(resultsOutMail(user.email, user.name, session.title, session.heldOn, publicUrl, session.id));
      mailed++;
    } catch (err) {
      mailFailed++;
      logError(err);
    }
  }
  return { mailed, mailFailed };
}
