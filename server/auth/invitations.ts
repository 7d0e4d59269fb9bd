import { IsNull, type DataSource } from 'typeorm';
import type { AcceptInvitationBody, InvitationRow, InvitationView, InviteBody } from '../../shared/api/auth.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import { invitationMail } from '../mail/messages.js';
import { Invitation } from './invitation.entity.js';
import { hashPassword } from './passwords.js';
import { hashToken, newToken } from './tokens.js';
import { User } from './user.entity.js';

/** How long an invitation link works. */
export const INVITATION_TTL_MS = 7 * 24 * 60 * 60 * 1000;

/** Creates an invitation and mails its link; refuses an address that already has an account. */
export async function invite(ds: DataSource, mailer: Mailer, publicUrl: string, actor: Actor & { id: number }, body: InviteBody): Promise<InvitationRow> {
  if (await ds.getRepository(User).existsBy({ email: body.email })) {
    throw new AppError(409, 'Conflict', `An account for ${body.email} already exists.`, [{ field: 'email', message: 'already has an account' }]);
  }
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + INVITATION_TTL_MS);
  const inviter = await ds.getRepository(User).findOneByOrFail({ id: actor.id });
  const saved = await ds.transaction(async (m) => {
    const inv = await m.save(m.create(Invitation, { email: body.email, name: body.name, role: body.role, tokenHash: hash, invitedBy: inviter, expiresAt, acceptedAt: null }));
    await recordAudit(m, actor, 'invitation.created', `invitation:${inv.id}`, { email: body.email, role: body.role });
    return inv;
  });
  // Mail goes after the commit: a failed send leaves a pending invitation the admin can see and resend.
  await mailer.send(invitationMail(body.email, body.name, body.role, inviter.name, `${publicUrl}/invitation/${token}`, expiresAt));
  return toInvitationRow(saved);
}

/** Pending and accepted invitations, newest first. */
export async function listInvitations(ds: DataSource): Promise<InvitationRow[]> {
  const rows = await ds.getRepository(Invitation).find({ relations: { invitedBy: true }, order: { id: 'DESC' } });
  return rows.map(toInvitationRow);
}

/** What the invitation page shows; 404 unknown token, 410 used or expired. */
export async function viewInvitation(ds: DataSource, token: string): Promise<InvitationView> {
  const inv = await usableInvitation(ds, token);
  return { email: inv.email, name: inv.name, role: inv.role, expiresAt: inv.expiresAt.toISOString() };
}

/** Accepts an invitation: creates the account and uses up the token, in one transaction. */
export async function acceptInvitation(ds: DataSource, ip: string | null, body: AcceptInvitationBody): Promise<User> {
  const inv = await usableInvitation(ds, body.token);
  const passwordHash = await hashPassword(body.password);
  return ds.transaction(async (m) => {
    // Claim the token first: of two racing accepts only one updates the row.
    const claimed = await m.update(Invitation, { id: inv.id, acceptedAt: IsNull() }, { acceptedAt: new Date() });
    if (!claimed.affected) throw AppError.gone('This invitation has already been used.');
    if (await m.existsBy(User, { email: inv.email })) throw AppError.conflict(`${inv.email} already has an account.`);
    const user = await m.save(m.create(User, { email: inv.email, name: inv.name, role: inv.role, passwordHash, active: true, lastLoginAt: null }));
    await recordAudit(m, { id: user.id, email: user.email, ip }, 'invitation.accepted', `user:${user.id}`, { invitationId: inv.id, role: user.role });
    return user;
  });
}

async function usableInvitation(ds: DataSource, token: string): Promise<Invitation> {
  const inv = await ds.getRepository(Invitation).findOneBy({ tokenHash: hashToken(token) });
  if (!inv) throw AppError.notFound('This invitation link is not known. Ask an admin for a new one.');
  if (inv.acceptedAt) throw AppError.gone('This invitation has already been used. Sign in instead.');
  if (inv.expiresAt.getTime() <= Date.now()) throw AppError.gone('This invitation has expired. Ask an admin for a new one.');
  return inv;
}

function toInvitationRow(inv: Invitation): InvitationRow {
  return {
    id: inv.id,
    email: inv.email,
    name: inv.name,
    role: inv.role,
    invitedBy: inv.invitedBy?.name ?? '',
    createdAt: inv.createdAt.toISOString(),
    expiresAt: inv.expiresAt.toISOString(),
    acceptedAt: inv.acceptedAt?.toISOString() ?? null,
  };
}
