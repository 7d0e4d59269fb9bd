import { Router } from 'express';
import type { OutboxMessage } from '../../shared/api/auth.js';
import { allow } from '../core/access.js';
import { AppError } from '../core/app-error.js';
import type { AppContext } from '../core/context.js';
import { idParam } from '../core/validate.js';
import { MailMessage } from './mail-message.entity.js';

/** Most messages listed at once. */
const OUTBOX_LIMIT = 200;

/** /api/outbox (admin): the mails caught by the built-in fake SMTP server, newest first. */
export function outboxRoutes(ctx: AppContext): Router {
  const router = Router();
  const repo = ctx.ds.getRepository(MailMessage);

  router.get('/', allow('admin'), async (_req, res) => {
    const rows = await repo.find({ order: { id: 'DESC' }, take: OUTBOX_LIMIT });
    res.json(rows.map(toOutboxMessage));
  });

  router.get('/:id', allow('admin'), async (req, res) => {
    const row = await repo.findOneBy({ id: idParam(req.params.id) });
    if (!row) throw AppError.notFound('No such message.');
    res.json(toOutboxMessage(row));
  });

  return router;
}

function toOutboxMessage(m: MailMessage): OutboxMessage {
  return { id: m.id, from: m.sender, to: m.recipients, subject: m.subject, text: m.text, html: m.html, receivedAt: m.receivedAt.toISOString() };
}
