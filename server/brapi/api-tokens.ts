import { createHash, randomBytes } from 'node:crypto';
import type { DataSource } from 'typeorm';
import type { ApiTokenRow, CreateApiTokenBody, IssuedApiToken } from '../../shared/api/api-tokens.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { User } from '../auth/user.entity.js';
import { AppError } from '../core/app-error.js';
import { ApiToken } from './api-token.entity.js';

/** Marks our tokens, so one pasted into the wrong place is recognisable (and secret scanners can find it). */
const TOKEN_PREFIX = 'hlb_';

/** 32 random bytes: 256 bits, beyond guessing; base64url keeps it safe in a header. */
const TOKEN_BYTES = 32;

/** How many characters of the token the admin table shows. */
const SHOWN_CHARS = TOKEN_PREFIX.length + 6;

/** Last-use times are written at most this often per token, so a busy client does not write on every request. */
const LAST_USED_RESOLUTION_MS = 60_000;

/** SHA-256 (hex) of a token: what is stored and looked up. */
export function hashToken(token: string): string {
  return createHash('sha256').update(token, 'utf8').digest('hex');
}

function toRow(t: ApiToken): ApiTokenRow {
  return {
    id: t.id,
    userId: t.userId,
    userEmail: t.user!.email,
    userName: t.user!.name,
    label: t.label,
    prefix: t.prefix,
    createdAt: t.createdAt.toISOString(),
    createdByEmail: t.createdBy!.email,
    lastUsedAt: t.lastUsedAt?.toISOString() ?? null,
    revokedAt: t.revokedAt?.toISOString() ?? null,
  };
}

/** Every token, newest first, without the secrets (only hashes are kept). */
export async function listApiTokens(ds: DataSource): Promise<ApiTokenRow[]> {
  const tokens = await ds.getRepository(ApiToken).find({ relations: { user: true, createdBy: true }, order: { id: 'DESC' } });
  return tokens.map(toRow);
}

/** Issues a token to an active user; the answer carries the token once, and only its hash is stored. */
export async function issueApiToken(ds: DataSource, actor: Actor, body: CreateApiTokenBody): Promise<IssuedApiToken> {
  const token = TOKEN_PREFIX + randomBytes(TOKEN_BYTES).toString('base64url');
  return ds.transaction(async (m) => {
    const user = await m.findOneBy(User, { id: body.userId });
    if (!user) throw AppError.badRequest(`No user ${body.userId}.`, [{ field: 'userId', message: 'no such user' }]);
    if (!user.active) throw AppError.conflict(`${user.email} is deactivated; activate the account before issuing a token.`);
    const saved = await m.save(
      m.create(ApiToken, { userId: user.id, label: body.label, tokenHash: hashToken(token), prefix: token.slice(0, SHOWN_CHARS), createdById: actor.id!, lastUsedAt: null, revokedAt: null }),
    );
    await recordAudit(m, actor, 'api-token.issued', `api-token:${saved.id}`, { userId: user.id, label: body.label, prefix: saved.prefix });
    const row = await m.findOneOrFail(ApiToken, { where: { id: saved.id }, relations: { user: true, createdBy: true } });
    return { ...toRow(row), token };
  });
}

/** Revokes a token at once; revoking it again changes nothing and answers the same row. */
export async function revokeApiToken(ds: DataSource, actor: Actor, id: number): Promise<ApiTokenRow> {
  return ds.transaction(async (m) => {
    const row = await m.findOne(ApiToken, { where: { id }, relations: { user: true, createdBy: true } });
    if (!row) throw AppError.notFound(`No API token ${id}.`);
    if (!row.revokedAt) {
      row.revokedAt = new Date();
      await m.save(row);
      await recordAudit(m, actor, 'api-token.revoked', `api-token:${id}`, { userId: row.userId, prefix: row.prefix });
    }
    return toRow(row);
  });
}

/** The active user a presented token belongs to, or null when the token is unknown, revoked, or its user deactivated. */
export async function userOfApiToken(ds: DataSource, token: string): Promise<User | null> {
  const row = await ds.getRepository(ApiToken).findOne({ where: { tokenHash: hashToken(token) }, relations: { user: true } });
  if (!row || row.revokedAt || !row.user?.active) return null;
  const now = Date.now();
  if (!row.lastUsedAt || now - row.lastUsedAt.getTime() > LAST_USED_RESOLUTION_MS) {
    await ds.getRepository(ApiToken).update({ id: row.id }, { lastUsedAt: new Date(now) });
  }
  return row.user;
}
