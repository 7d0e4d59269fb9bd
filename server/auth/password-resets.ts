import { IsNull, type DataSource } from 'typeorm';
import { recordAudit } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import type { Mailer } from '../mail/mailer.js';
import { passwordResetMail } from '../mail/messages.js';
import { PasswordReset } from './password-reset.entity.js';
import { hashPassword } from './passwords.js';
import { hashToken, newToken } from './tokens.js';
import { User } from './user.entity.js';

/** How long a reset link works (OWASP Forgot Password Cheat Sheet advises a short life; from memory). */
export const RESET_TTL_MS = 60 * 60 * 1000;

/**
 * Mails a reset link when the address belongs to an active account. The caller answers the same
 * either way, so the form does not reveal who has an account.
 */
export async function requestPasswordReset(ds: DataSource, mailer: Mailer, publicUrl: string, email: string, ip: string | null): Promise<void> {
  const user = await ds.getRepository(User).findOneBy({ email });
  if (!user?.active) {
    await recordAudit(ds.manager, { id: null, email, ip }, 'auth.reset-requested-unknown', `email:${email}`);
    return;
  }
  const { token, hash } = newToken();
  const expiresAt = new Date(Date.now() + RESET_TTL_MS);
  await ds.transaction(async (m) => {
    await m.insert(PasswordReset, { user, tokenHash: hash, expiresAt, usedAt: null });
    await recordAudit(m, { id: null, email, ip }, 'auth.reset-requested', `user:${user.id}`);
  });
  await mailer.send(passwordResetMail(user.email, user.name, `${publicUrl}/reset-password/${token}`, expiresAt));
}

/** Sets a new password from a reset link: single use, not after expiry. Returns the user. */
export async function confirmPasswordReset(ds: DataSource, token: string, password: string, ip: string | null): Promise<User> {
  const reset = await ds.getRepository(PasswordReset).findOne({ where: { tokenHash: hashToken(token) }, relations: { user: true } });
  if (!reset) throw AppError.badRequest('This reset link is not known. Ask for a new one.', [{ field: 'token', message: 'is not known' }]);
  if (reset.usedAt) throw AppError.gone('This reset link has already been used. Ask for a new one.');
  if (reset.expiresAt.getTime() <= Date.now()) throw AppError.gone('This reset link has expired. Ask for a new one.');
  const passwordHash = await hashPassword(password);
  await ds.transaction(async (m) => {
    const claimed = await m.update(PasswordReset, { id: reset.id, usedAt: IsNull() }, { usedAt: new Date() });
    if (!claimed.affected) throw AppError.gone('This reset link has already been used. Ask for a new one.');
    await m.update(User, { id: reset.user.id }, { passwordHash });
    await recordAudit(m, { id: reset.user.id, email: reset.user.email, ip }, 'auth.password-reset', `user:${reset.user.id}`);
  });
  return reset.user;
}
