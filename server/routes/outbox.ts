import { Router } from 'express';
import { listOutboxMessages } from '../db/repositories/outbox';
import type { AppDeps } from '../deps';
import { AppError } from '../errors';
import { requireRole } from '../middleware/require-auth';

/** The mails the local SMTP fake caught; absent when a real SMTP_URL is configured. */
export function outboxRoutes(deps: AppDeps) {
  const r = Router();
  r.use(requireRole('admin'));
  r.get('/', async (_req, res) => {
    if (!deps.mailer.usesLocalFake) throw new AppError('not_found', 'The outbox exists only with the local mail fake (SMTP_URL unset)');
    const rows = await listOutboxMessages(deps.db);
    res.json({
      messages: rows.map((m) => ({ to: m.to_addr, subject: m.subject, text: m.text, html: m.html, createdAt: m.created_at })),
    });
  });
  return r;
}
