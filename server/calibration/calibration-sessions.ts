// Calibration sessions as a business component: create, add specimens, invite, list, show. No req/res.
import { In, type DataSource } from 'typeorm';
import {
  CALIBRATION_DEFAULT_THRESHOLDS,
  SPECIMENS_MAX,
  type CalibrationSessionDetail,
  type CalibrationSessionSummary,
  type ParticipantsAnswer,
  type SpecimenView,
} from '../../shared/api/calibration-answers.js';
import type { CreateSessionBody, CreateSpecimenBody } from '../../shared/api/calibration.js';
import { displayHex } from '../../shared/colour/display-hex.js';
import { labFromTuple, type Lab } from '../../shared/colour/lab.js';
import type { Region } from '../../shared/photo/region.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import { Photo } from '../photos/photo.entity.js';
import { Notification } from '../reviews/review.entity.js';
import { invitedMail, invitedNotice } from './calibration-mail.js';
import type { ReferenceSets } from '../reference-sets/reference-sets.js';
import { chipOf, fieldCodeOf, nearestFieldChip } from './calibration-chips.js';
import { assertMaySee, assertOpen, findSession, mayTakePart, participantsOf, runsSessions, today } from './calibration-load.js';
import { CalibrationResponse, CalibrationSession, Participant, Specimen } from './calibration-session.entity.js';

/** Samples a photo region against a set (photos.ts `samplePhoto` with the session's set); null when the server keeps no photos. */
export type PhotoSampler = ((photoId: number, region: Region, setId: string) => Promise<Lab>) | null;

/** Creates an open session; the reference set defaults to the current one. */
export async function createSession(ds: DataSource, sets: ReferenceSets, actor: Actor & { id: number }, body: CreateSessionBody): Promise<{ id: number }> {
  const set = body.referenceSetId === undefined ? await sets.current() : await getSet(sets, body.referenceSetId);
  return ds.transaction(async (m) => {
    const session = await m.save(
      m.create(CalibrationSession, {
        title: body.title,
        heldOn: body.heldOn ?? today(),
        referenceSetId: set.summary.id,
        restricted: body.restricted ?? false,
        kappaThreshold: body.thresholds?.kappa ?? CALIBRATION_DEFAULT_THRESHOLDS.kappa,
        deltaE00Threshold: body.thresholds?.deltaE00 ?? CALIBRATION_DEFAULT_THRESHOLDS.deltaE00,
        status: 'open',
        createdBy: { id: actor.id },
        closedAt: null,
        kappaAtClose: null,
      }),
    );
    const { title, heldOn, referenceSetId, restricted, kappaThreshold, deltaE00Threshold } = session;
    await recordAudit(m, actor, 'calibration.session.created', `calibration-session:${session.id}`, { title, heldOn, referenceSetId, restricted, kappaThreshold, deltaE00Threshold });
    return { id: session.id };
  });
}

/** A set named in a request; a missing one is a 400 on `referenceSetId`, not a 404 of the route. */
async function getSet(sets: ReferenceSets, id: string) {
  try {
    return await sets.get(id);
  } catch (err) {
    if (err instanceof AppError && err.status === 404) throw AppError.badRequest(`There is no reference set ${id}.`, [{ field: 'referenceSetId', message: 'is not a stored reference set' }]);
    throw err;
  }
}

/** Adds a specimen whose reference colour is a CIELAB value, a photo region sampled on the server, or a chip of the session's set. */
export async function addSpecimen(ds: DataSource, sets: ReferenceSets, sample: PhotoSampler, actor: Actor, sessionId: number, body: CreateSpecimenBody): Promise<{ id: number }> {
  const session = await findSession(ds.manager, sessionId);
  assertOpen(session, 'no more specimens can be added');
  const set = await sets.get(session.referenceSetId);
  let lab: Lab;
  let referenceFieldCode: string;
  let source: Specimen['source'];
  if (body.chipCode !== undefined) {
    const chip = chipOf(set, body.chipCode);
    [lab, referenceFieldCode, source] = [labFromTuple(chip.lab), fieldCodeOf(chip), 'chip'];
  } else if (body.photoId !== undefined && body.region !== undefined) {
    if (!sample) throw new AppError(503, 'Photos unavailable', 'This server was started without a data folder for photos.', undefined, 'no-photo-storage');
    if (!(await ds.getRepository(Photo).existsBy({ id: body.photoId }))) throw AppError.badRequest(`There is no photo ${body.photoId}.`, [{ field: 'photoId', message: 'is not a stored photo' }]);
    lab = await sample(body.photoId, body.region, set.summary.id);
    [referenceFieldCode, source] = [fieldCodeOf(nearestFieldChip(set, lab)), 'photo'];
  } else {
    lab = labFromTuple(body.lab!);
    [referenceFieldCode, source] = [fieldCodeOf(nearestFieldChip(set, lab)), 'lab'];
  }
  return ds.transaction(async (m) => {
    // Re-read inside the transaction: the session may have closed while the photo was sampled.
    assertOpen(await findSession(m, sessionId), 'no more specimens can be added');
    const count = await m.countBy(Specimen, { session: { id: sessionId } });
    if (count >= SPECIMENS_MAX) throw AppError.conflict(`A session holds at most ${SPECIMENS_MAX} specimens.`);
    const specimen = await m.save(
      m.create(Specimen, {
        session: { id: sessionId },
        label: body.label,
        position: count + 1,
        source,
        l: lab.l,
        a: lab.a,
        b: lab.b,
        referenceFieldCode,
        chipCode: body.chipCode ?? null,
        photo: body.photoId !== undefined ? { id: body.photoId } : null,
        region: body.region ?? null,
      }),
    );
    await recordAudit(m, actor, 'calibration.specimen.added', `calibration-session:${sessionId}`, { specimenId: specimen.id, label: body.label, source, lab: [lab.l, lab.a, lab.b], referenceFieldCode, chipCode: body.chipCode ?? null, photoId: body.photoId ?? null });
    return { id: specimen.id };
  });
}

/** Where invitation mails go and how a failed one is logged. */
export interface InviteMail {
  mailer: Mailer;
  publicUrl: string;
  logError?: (err: unknown) => void;
}

/**
 * Invites users to a session (restricted sessions admit only them); already-invited users are left
 * as they are. Each newly invited user gets an in-app notice (with the invitation, in one
 * transaction) and then a mail; a failed mail does not undo the invitation.
 */
export async function inviteParticipants(ds: DataSource, actor: Actor, sessionId: number, userIds: readonly number[], mail?: InviteMail): Promise<ParticipantsAnswer> {
  const unique = [...new Set(userIds)];
  const newly: User[] = [];
  const session = await findSession(ds.manager, sessionId);
  const added = await ds.transaction(async (m) => {
    assertOpen(await findSession(m, sessionId), 'nobody more can be invited');
    const users = await m.find(User, { where: { id: In(unique), active: true } });
    const missing = unique.filter((id) => !users.some((u) => u.id === id));
    if (missing.length) throw AppError.badRequest(`No active user has the id ${missing.join(', ')}.`, [{ field: 'userIds', message: `${missing.join(', ')} ${missing.length === 1 ? 'is not an active user' : 'are not active users'}` }]);
    const existing = await m.find(Participant, { where: { session: { id: sessionId }, user: { id: In(unique) } } });
    let count = 0;
    for (const id of unique) {
      const row = existing.find((p) => p.userId === id);
      if (row?.invited) continue;
      if (row) await m.update(Participant, { id: row.id }, { invited: true });
      else await m.insert(Participant, { session: { id: sessionId }, user: { id }, invited: true });
      await m.insert(Notification, { userId: id, kind: 'calibration-invited', readingId: null, sessionId, message: invitedNotice(session.title), readAt: null });
      newly.push(users.find((u) => u.id === id)!);
      count++;
    }
    if (count) await recordAudit(m, actor, 'calibration.participants.invited', `calibration-session:${sessionId}`, { userIds: unique });
    return count;
  });
  let mailed = 0;
  for (const user of mail ? newly : []) {
    try {
      await mail!.mailer.send(invitedMail(user.email, user.name, session.title, session.heldOn, mail!.publicUrl, sessionId));
      mailed++;
    } catch (err) {
      mail!.logError?.(err);
    }
  }
  return { added, mailed, participants: await participantsOf(ds.manager, sessionId) };
}

interface SummaryRow {
  id: number;
  specimenCount: number;
  participantCount: number;
  responseCount: number;
  myResponseCount: number;
  invited: number | null;
  createdByName: string;
}

/** Sessions as the user may see them: all for trainers and admins; for others, open ones they may join and ones they took part in. Newest first. */
export async function listSessions(ds: DataSource, user: User): Promise<CalibrationSessionSummary[]> {
  const rows: SummaryRow[] = await ds.query(
    `SELECT s.id AS id, u.name AS createdByName,
            (SELECT COUNT(*) FROM calibration_specimen x WHERE x."sessionId" = s.id) AS specimenCount,
            (SELECT COUNT(*) FROM calibration_participant x WHERE x."sessionId" = s.id) AS participantCount,
            (SELECT COUNT(*) FROM calibration_response x WHERE x."sessionId" = s.id) AS responseCount,
            (SELECT COUNT(*) FROM calibration_response x WHERE x."sessionId" = s.id AND x."observerId" = ?) AS myResponseCount,
            p.invited AS invited
       FROM calibration_session s
       JOIN "user" u ON u.id = s."createdById"
       LEFT JOIN calibration_participant p ON p."sessionId" = s.id AND p."userId" = ?
      WHERE ? = 1 OR p.id IS NOT NULL OR (s.status = 'open' AND s.restricted = 0)
      ORDER BY s."heldOn" DESC, s.id DESC`,
    [user.id, user.id, runsSessions(user) ? 1 : 0],
  );
  if (!rows.length) return [];
  const sessions = await ds.getRepository(CalibrationSession).findBy({ id: In(rows.map((r) => r.id)) });
  const byId = new Map(sessions.map((s) => [s.id, s]));
  return rows.map((r) => toSummary(byId.get(r.id)!, r));
}

function toSummary(s: CalibrationSession, r: Omit<SummaryRow, 'id'>): CalibrationSessionSummary {
  const invited = r.invited === null ? null : Boolean(r.invited);
  return {
    id: s.id,
    title: s.title,
    heldOn: s.heldOn,
    referenceSetId: s.referenceSetId,
    restricted: s.restricted,
    status: s.status,
    thresholds: { kappa: s.kappaThreshold, deltaE00: s.deltaE00Threshold },
    createdById: s.createdById,
    createdByName: r.createdByName,
    createdAt: s.createdAt.toISOString(),
    closedAt: s.closedAt?.toISOString() ?? null,
    specimenCount: Number(r.specimenCount),
    participantCount: Number(r.participantCount),
    responseCount: Number(r.responseCount),
    canRespond: s.status === 'open' && (!s.restricted || invited === true),
    myResponseCount: Number(r.myResponseCount),
  };
}

/** One session with its specimens; trainees see no reference colour while it is open, and only their own picks. */
export async function sessionDetail(ds: DataSource, user: User, id: number): Promise<CalibrationSessionDetail> {
  const m = ds.manager;
  const session = await findSession(m, id);
  const participant = await assertMaySee(m, session, user);
  const summary = (await listSessions(ds, user)).find((s) => s.id === id) ?? toSummary(session, await summaryCounts(ds, session, user));
  const reveal = runsSessions(user) || session.status === 'closed';
  const specimens = await m.find(Specimen, { where: { session: { id } }, order: { position: 'ASC' } });
  const mine = await m.find(CalibrationResponse, { where: { session: { id }, observer: { id: user.id } }, order: { id: 'ASC' } });
  return {
    ...summary,
    canRespond: session.status === 'open' && mayTakePart(session, participant),
    specimens: specimens.map((s) => specimenView(s, reveal)),
    myPicks: mine.map((r) => ({ specimenId: r.specimenId, chipCode: r.chipCode, respondedAt: r.updatedAt.toISOString() })),
    participants: runsSessions(user) ? await participantsOf(m, id) : [],
  };
}

/** Counts for a session the list leaves out (a closed unrestricted session a trainee never joined). */
async function summaryCounts(ds: DataSource, session: CalibrationSession, user: User): Promise<Omit<SummaryRow, 'id'>> {
  const m = ds.manager;
  const creator = await m.findOneByOrFail(User, { id: session.createdById });
  return {
    createdByName: creator.name,
    specimenCount: await m.countBy(Specimen, { session: { id: session.id } }),
    participantCount: await m.countBy(Participant, { session: { id: session.id } }),
    responseCount: await m.countBy(CalibrationResponse, { session: { id: session.id } }),
    myResponseCount: await m.countBy(CalibrationResponse, { session: { id: session.id }, observer: { id: user.id } }),
    invited: null,
  };
}

function specimenView(s: Specimen, reveal: boolean): SpecimenView {
  const lab = { l: s.l, a: s.a, b: s.b };
  return {
    id: s.id,
    label: s.label,
    position: s.position,
    source: s.source,
    referenceLab: reveal ? [s.l, s.a, s.b] : null,
    referenceHex: reveal ? displayHex(lab).hex : null,
    chipCode: reveal ? s.chipCode : null,
    photoId: reveal ? s.photoId : null,
    region: reveal ? s.region : null,
  };
}
