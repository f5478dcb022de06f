import { Router } from 'express';
import { feedQuerySchema, memberParamsSchema } from '../../shared/schemas/community';
import type { AppContext } from '../context';
import { currentMember, requireMember } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import * as members from '../services/members.service';

/** /api/members/:handle: a maker's profile, and following them. */
export function membersRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/:handle', validate('params', memberParamsSchema), async (req, res) => {
    const profile = await members.getProfile(
      ctx,
      req.member,
      valid(res, 'params', memberParamsSchema).handle,
    );
    res.setHeader('Cache-Control', 'private, no-cache');
    res.json({ profile });
  });

  router.post(
    '/:handle/follow',
    requireMember,
    validate('params', memberParamsSchema),
    async (req, res) => {
      const { handle } = valid(res, 'params', memberParamsSchema);
      res.json(await members.followMaker(ctx, currentMember(req), handle));
    },
  );

  router.delete(
    '/:handle/follow',
    requireMember,
    validate('params', memberParamsSchema),
    async (req, res) => {
      const { handle } = valid(res, 'params', memberParamsSchema);
      res.json(await members.unfollowMaker(ctx, currentMember(req), handle));
    },
  );

  return router;
}

/** /api/feed: journals from the makers the member follows. */
export function feedRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', requireMember, validate('query', feedQuerySchema), async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json(
      await members.followingFeed(ctx, currentMember(req), valid(res, 'query', feedQuerySchema)),
    );
  });
  return router;
}
