import type { DataSource } from 'typeorm';
import type { CreateUserBody, UpdateUserBody, UserRow } from '../../shared/api/auth.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { hashPassword } from '../auth/passwords.js';
import { toRow, User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';

/** Every user, by name. */
export async function listUsers(ds: DataSource): Promise<UserRow[]> {
  const users = await ds.getRepository(User).find({ order: { name: 'ASC' } });
  return users.map(toRow);
}

/** Creates a user directly (an admin's alternative to an invitation). 409 if the e-mail is taken. */
export async function createUser(ds: DataSource, actor: Actor, body: CreateUserBody): Promise<UserRow> {
  const passwordHash = await hashPassword(body.password);
  return ds.transaction(async (m) => {
    if (await m.existsBy(User, { email: body.email })) throw new AppError(409, 'Conflict', `An account for ${body.email} already exists.`, [{ field: 'email', message: 'already has an account' }]);
    const user = await m.save(m.create(User, { email: body.email, name: body.name, role: body.role, passwordHash, active: true, lastLoginAt: null }));
    await recordAudit(m, actor, 'user.created', `user:${user.id}`, { email: user.email, role: user.role });
    return toRow(user);
  });
}

/**
 * Changes a user's name, role or active flag. Admins cannot deactivate or demote themselves, so
 * a collection never loses its last way in by accident. Returns the row and whether the user's
 * sessions must end (deactivated).
 */
export async function updateUser(ds: DataSource, actor: Actor, id: number, body: UpdateUserBody): Promise<{ row: UserRow; endSessions: boolean }> {
  return ds.transaction(async (m) => {
    const user = await m.findOneBy(User, { id });
    if (!user) throw AppError.notFound(`No user ${id}.`);
    if (id === actor.id && (body.active === false || (body.role && body.role !== user.role))) {
      throw AppError.conflict('You cannot deactivate your own account or change your own role; ask another admin.');
    }
    const before = { name: user.name, role: user.role, active: user.active };
    Object.assign(user, body);
    await m.save(user);
    await recordAudit(m, actor, 'user.updated', `user:${id}`, { before, after: { name: user.name, role: user.role, active: user.active } });
    return { row: toRow(user), endSessions: before.active && !user.active };
  });
}
