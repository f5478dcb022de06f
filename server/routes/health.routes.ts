import { Router } from 'express';
import type { AppContext } from '../context';
import { pingDatabase } from '../db/client';

/** GET /api/health: a real query against the database; 503 with db "down" when it fails. */
export function healthRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const up = await pingDatabase(ctx.database.pool);
    res.setHeader('Cache-Control', 'no-store');
    res.status(up ? 200 : 503).json({ ok: up, db: up ? 'up' : 'down' });
  });
  return router;
}
