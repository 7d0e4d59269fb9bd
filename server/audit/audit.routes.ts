import { Router } from 'express';
import { z } from 'zod';
import type { AuditEventRow } from '../../shared/api/auth.js';
import { allow } from '../core/access.js';
import type { AppContext } from '../core/context.js';
import { parse } from '../core/validate.js';
import { AuditEvent } from './audit-event.entity.js';

const query = z.object({
  page: z.coerce.number().int().min(1).max(100000).default(1),
  pageSize: z.coerce.number().int().min(1).max(200).default(50),
  action: z.string().max(60).optional(),
});

/** /api/audit (admin): the audit trail, newest first, paginated. */
export function auditRoutes(ctx: AppContext): Router {
  const router = Router();
  router.get('/', allow('admin'), async (req, res) => {
    const q = parse(query, req.query, 'query');
    const [rows, total] = await ctx.ds.getRepository(AuditEvent).findAndCount({
      where: q.action ? { action: q.action } : {},
      order: { id: 'DESC' },
      skip: (q.page - 1) * q.pageSize,
      take: q.pageSize,
    });
    const items: AuditEventRow[] = rows.map((r) => ({ id: r.id, at: r.at.toISOString(), actorId: r.actorId, actorEmail: r.actorEmail, action: r.action, subject: r.subject, detail: r.detail, ip: r.ip }));
    res.json({ items, total });
  });
  return router;
}
