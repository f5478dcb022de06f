import { Router } from 'express';
import type { AppContext } from '../context';
import { pingDatabase } from '../db/client';

/**
 * GET /api/health: a real query against the database; 503 with db "down" when it fails (the
 * readiness check for a load balancer). GET /api/health/live: the process answers at all (the
 * liveness check; no database, so a database outage does not get every app server restarted).
 */
export function healthRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/live', (_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ ok: true });
  });
  router.get('/', async (_req, res) => {
    const up = await pingDatabase(ctx.database.pool);
    res.setHeader('Cache-Control', 'no-store');
    res.status(up ? 200 : 503).json({ ok: up, db: up ? 'up' : 'down' });
  });
  return router;
}
