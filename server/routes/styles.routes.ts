import { Router } from 'express';
import type { AppContext } from '../context';
import { presentStyle } from '../presenters/style.presenter';
import { listStyles } from '../repositories/styles.repository';

/** GET /api/styles: the reference list of cheese styles. */
export function stylesRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', async (_req, res) => {
    const rows = await listStyles(ctx.database.db);
    res.setHeader('Cache-Control', 'public, max-age=300');
    res.json({ styles: rows.map(presentStyle) });
  });
  return router;
}
