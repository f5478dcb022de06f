import { Router } from 'express';
import { compareJournalsQuerySchema, compareQuerySchema } from '../../shared/schemas/compare';
import type { AppContext } from '../context';
import { sendSharedJson } from '../lib/cached-json';
import { validate, valid } from '../middleware/validate';
import { compare, compareJournals } from '../services/compare.service';

/** /api/compare: relate a make parameter to an outcome across the community. */
export function compareRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', validate('query', compareQuerySchema), async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    const query = valid(res, 'query', compareQuerySchema);
    if (req.member) {
      res.json(await compare(ctx, req.member, query));
      return;
    }
    // A signed-out visitor's comparison covers only what is listed: the same for all of them.
    await sendSharedJson(ctx, res, `compare:${JSON.stringify(query)}`, () =>
      compare(ctx, undefined, query),
    );
  });
  router.get('/journals', validate('query', compareJournalsQuerySchema), async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json(
      await compareJournals(ctx, req.member, valid(res, 'query', compareJournalsQuerySchema).ids),
    );
  });
  return router;
}
