import type { EntityManager } from 'typeorm';
import { AuditEvent } from './audit-event.entity.js';

/** Who did something and from where. */
export interface Actor {
  id: number | null;
  email: string | null;
  ip: string | null;
}

/** The actor for work the system does itself (seeding, start-up). */
export const SYSTEM: Actor = { id: null, email: null, ip: null };

/** Records one audit event; pass the transaction's manager so the event commits with the change. */
export async function recordAudit(
  manager: EntityManager,
  actor: Actor,
  action: string,
  subject: string | null = null,
  detail: Record<string, unknown> | null = null,
): Promise<void> {
  await manager.save(manager.create(AuditEvent, { actorId: actor.id, actorEmail: actor.email, ip: actor.ip, action, subject, detail }));
}
