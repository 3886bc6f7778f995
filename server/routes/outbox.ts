/**
 * /api/dev/outbox: the captured e-mails, so invitation and reset links can be followed on one
 * machine. Mounted only when the mailer keeps an outbox, i.e. when SMTP_URL is unset.
 */
import { Router } from 'express';
import type { Mailer } from '../mail/mailer.js';

export function outboxRoutes(outbox: NonNullable<Mailer['outbox']>): Router {
  const router = Router();
  router.get('/', (_req, res) => {
    res.json({ messages: outbox.list() });
  });
  router.delete('/', (_req, res) => {
    outbox.clear();
    res.status(204).end();
  });
  return router;
}
