import type { DataSource } from 'typeorm';
import { AppError } from '../core/app-error.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { decoyHash, hashPassword, verifyPassword } from './passwords.js';
import { User } from './user.entity.js';

/** Checks an e-mail and password; the same work is done for unknown addresses (no timing oracle). */
export async function authenticate(ds: DataSource, email: string, password: string): Promise<User | null> {
  const user = await ds.getRepository(User).findOneBy({ email: email.toLowerCase() });
  const ok = await verifyPassword(password, user?.passwordHash ?? (await decoyHash()));
  return user && ok && user.active ? user : null;
}

/** Records a successful sign-in. */
export async function noteSignIn(ds: DataSource, user: User, ip: string | null): Promise<void> {
  await ds.transaction(async (m) => {
    await m.update(User, { id: user.id }, { lastLoginAt: new Date() });
    await recordAudit(m, { id: user.id, email: user.email, ip }, 'auth.sign-in', `user:${user.id}`);
  });
}

/** Records a refused sign-in (no password in the record). */
export async function noteFailedSignIn(ds: DataSource, email: string, ip: string | null, reason: string): Promise<void> {
  await recordAudit(ds.manager, { id: null, email, ip }, 'auth.sign-in-failed', `email:${email}`, { reason });
}

/** Changes one's own password after checking the current one. */
export async function changePassword(ds: DataSource, actor: Actor & { id: number }, current: string, next: string): Promise<void> {
  const user = await ds.getRepository(User).findOneByOrFail({ id: actor.id });
  if (!(await verifyPassword(current, user.passwordHash))) {
    throw AppError.badRequest('The current password is not right.', [{ field: 'currentPassword', message: 'is not right' }]);
  }
  const passwordHash = await hashPassword(next);
  await ds.transaction(async (m) => {
    await m.update(User, { id: user.id }, { passwordHash });
    await recordAudit(m, actor, 'user.password-changed', `user:${user.id}`);
  });
}
