import session from 'express-session';
import { LessThan, type DataSource, type Repository } from 'typeorm';
import { SessionRecord } from './session.entity.js';

/** Name of the session cookie. */
export const SESSION_COOKIE = 'hueledger.sid';

/** Default lifetime when a cookie has no expiry of its own: one day. */
const DEFAULT_TTL_MS = 24 * 60 * 60 * 1000;

/**
 * express-session store over the app's own SQLite database (through TypeORM), so sessions
 * survive a restart. Expired rows are removed lazily on read and by `prune()`; no timers, so
 * test processes end cleanly.
 */
export class SqliteSessionStore extends session.Store {
  private readonly repo: Repository<SessionRecord>;

  constructor(ds: DataSource) {
    super();
    this.repo = ds.getRepository(SessionRecord);
  }

  override get(sid: string, cb: (err: unknown, s?: session.SessionData | null) => void): void {
    this.repo
      .findOneBy({ sid })
      .then(async (row) => {
        if (!row) return cb(null, null);
        if (row.expiresAt <= Date.now()) {
          await this.repo.delete({ sid });
          return cb(null, null);
        }
        cb(null, JSON.parse(row.data) as session.SessionData);
      })
      .catch((err) => cb(err));
  }

  override set(sid: string, data: session.SessionData, cb?: (err?: unknown) => void): void {
    this.repo
      .upsert({ sid, data: JSON.stringify(data), expiresAt: expiryOf(data), userId: userOf(data) }, ['sid'])
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  override destroy(sid: string, cb?: (err?: unknown) => void): void {
    this.repo
      .delete({ sid })
      .then(() => cb?.())
      .catch((err) => cb?.(err));
  }

  override touch(sid: string, data: session.SessionData, cb?: () => void): void {
    this.repo
      .update({ sid }, { expiresAt: expiryOf(data) })
      .then(() => cb?.())
      .catch(() => cb?.());
  }

  /** Deletes expired sessions; returns how many. */
  async prune(now = Date.now()): Promise<number> {
    const result = await this.repo.delete({ expiresAt: LessThan(now) });
    return result.affected ?? 0;
  }

  /** Ends every session of one user (after a password change or deactivation). */
  async destroyForUser(userId: number, exceptSid?: string): Promise<void> {
    const qb = this.repo.createQueryBuilder().delete().where('userId = :userId', { userId });
    if (exceptSid) qb.andWhere('sid != :exceptSid', { exceptSid });
    await qb.execute();
  }
}

function userOf(data: session.SessionData): number | null {
  const user = (data as { passport?: { user?: unknown } }).passport?.user;
  return typeof user === 'number' ? user : null;
}

function expiryOf(data: session.SessionData): number {
  const expires = data.cookie?.expires;
  return expires ? new Date(expires).getTime() : Date.now() + DEFAULT_TTL_MS;
}
