import { Router } from 'express';
import { compareQuerySchema } from '../../shared/schemas/compare';
import type { AppContext } from '../context';
import { validate, valid } from '../middleware/validate';
import { compare } from '../services/compare.service';

/** /api/compare: relate a make parameter to an outcome across the community. */
export function compareRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', validate('query', compareQuerySchema), async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json(await compare(ctx, req.member, valid(res, 'query', compareQuerySchema)));
  });
  return router;
}
