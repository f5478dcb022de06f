import { Router } from 'express';
import type { LocalMailbox } from '../mail/local-mailbox';

/** /api/dev (never in production): the messages the local mail fake received, newest first. */
export function devRouter(mailbox: LocalMailbox): Router {
  const router = Router();
  router.get('/mail', (_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ messages: mailbox.list() });
  });
  router.delete('/mail', (_req, res) => {
    mailbox.clear();
    res.status(204).end();
  });
  return router;
}
