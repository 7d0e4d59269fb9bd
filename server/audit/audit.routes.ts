import { Router } from 'express';
import { In } from 'typeorm';
import { z } from 'zod';
import type { AuditEventRow } from '../../shared/api/auth.js';
import { User } from '../auth/user.entity.js';
import { allow } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { AuditEvent } from './audit-event.entity.js';
import { auditSentence } from './audit-sentence.js';

const date = z.iso.date({ message: 'must be a date YYYY-MM-DD' });

/** Filters of the audit trail: who (actor's e-mail or name, part of it), what (an action or its family, e.g. "reading"), when (from/to, UTC days). */
const query = z
  .object({
    page: z.coerce.number({ message: 'must be a whole number' }).int({ message: 'must be a whole number' }).min(1, { message: 'must be at least 1' }).max(100000).default(1),
    pageSize: z.coerce.number({ message: 'must be a whole number' }).int({ message: 'must be a whole number' }).min(1, { message: 'must be at least 1' }).max(200, { message: 'must be at most 200' }).default(50),
    action: z.string().trim().max(60, { message: 'must be at most 60 characters' }).optional(),
    who: z.string().trim().max(254, { message: 'must be at most 254 characters' }).optional(),
    from: date.optional(),
    to: date.optional(),
  })
  .refine((q) => !q.from || !q.to || q.from <= q.to, { path: ['to'], message: 'must not be before from' });

/** /api/audit (admin): the audit trail, newest first, filtered and paginated, each event as a sentence. */
export function auditRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', allow('admin'), async (req, res) => {
    const q = parse(query, req.query, 'query');
    const qb = ctx.ds.getRepository(AuditEvent).createQueryBuilder('e').leftJoin(User, 'u', 'u.id = e.actorId');
    // An action family ("reading") matches its actions ("reading.created"); a full action matches itself.
    if (q.action) qb.andWhere('(e.action = :action OR e.action LIKE :family)', { action: q.action, family: `${q.action.replace(/[%_]/g, '')}.%` });
    if (q.who) qb.andWhere('(LOWER(e.actorEmail) LIKE :who OR LOWER(u.name) LIKE :who)', { who: `%${q.who.toLowerCase().replace(/[%_]/g, '')}%` });
    if (q.from) qb.andWhere('e.at >= :from', { from: `${q.from} 00:00:00` });
    if (q.to) qb.andWhere('e.at < date(:to, \'+1 day\')', { to: q.to });
    const [rows, total] = await qb.orderBy('e.id', 'DESC').skip((q.page - 1) * q.pageSize).take(q.pageSize).getManyAndCount();
    const ids = [...new Set(rows.map((r) => r.actorId).filter((x): x is number => x !== null))];
    const names = new Map((ids.length ? await ctx.ds.getRepository(User).find({ where: { id: In(ids) }, select: { id: true, name: true } }) : []).map((u) => [u.id, u.name]));
    // The reader's language writes the days the sentences name, as the screens write every date.
    const locale = req.acceptsLanguages().find((l) => l !== '*');
    const items: AuditEventRow[] = rows.map((r) => {
      const actorName = r.actorId === null ? null : (names.get(r.actorId) ?? r.actorEmail);
      return { id: r.id, at: r.at.toISOString(), actorId: r.actorId, actorEmail: r.actorEmail, actorName, action: r.action, subject: r.subject, detail: r.detail, ip: r.ip, sentence: auditSentence(actorName, r.action, r.subject, r.detail, locale) };
    });
    res.json({ items, total });
  });
  return router;
}
