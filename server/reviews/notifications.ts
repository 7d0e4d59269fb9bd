// In-app notices (issue 6): a recorder sees what reviewers asked of their readings. Each user sees
// and marks only their own. No req/res here.
import { IsNull, type DataSource } from 'typeorm';
import type { NotificationDto, NotificationList } from '../../shared/api/review-answers.js';
import { recordAudit, type Actor } from '../audit/audit.js';
import { AppError } from '../core/app-error.js';
import { Notification } from './review.entity.js';

/** The most notices listed at once, newest first; the unread count covers them all. */
export const NOTIFICATIONS_LISTED = 100;

/** A user's own notices, newest first, and how many are unread. */
export async function listNotifications(ds: DataSource, userId: number): Promise<NotificationList> {
  const repo = ds.getRepository(Notification);
  const [items, unread] = await Promise.all([
    repo.find({ where: { userId }, order: { createdAt: 'DESC', id: 'DESC' }, take: NOTIFICATIONS_LISTED }),
    repo.countBy({ userId, readAt: IsNull() }),
  ]);
  return { items: items.map(toNotificationDto), unread };
}

/**
 * Marks one of the user's own notices read (once: marking it again keeps the first time). Someone
 * else's notice is answered 404, as if it did not exist, so ids reveal nothing.
 */
export async function markNotificationRead(ds: DataSource, actor: Actor, userId: number, id: number): Promise<void> {
  await ds.transaction(async (m) => {
    const n = await m.findOneBy(Notification, { id, userId });
    if (!n) throw AppError.notFound(`You have no notice ${id}.`);
    if (n.readAt !== null) return;
    await m.update(Notification, { id }, { readAt: new Date() });
    await recordAudit(m, actor, 'notification.read', `notification:${id}`, n.readingId !== null ? { readingId: n.readingId } : { sessionId: n.sessionId });
  });
}

function toNotificationDto(n: Notification): NotificationDto {
  return { id: n.id, kind: n.kind, readingId: n.readingId, sessionId: n.sessionId, message: n.message, createdAt: n.createdAt.toISOString(), readAt: n.readAt?.toISOString() ?? null };
}
