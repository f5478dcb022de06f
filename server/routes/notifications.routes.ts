import { Router } from 'express';
import {
  notificationListQuerySchema,
  notificationReadSchema,
} from '../../shared/schemas/community';
import type { AppContext } from '../context';
import { currentMember, requireMember } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import * as notifications from '../services/notifications.service';

/** /api/notifications: the member's in-app notices, the unread count, marking them read. */
export function notificationsRouter(ctx: AppContext): Router {
  const router = Router();
  router.use(requireMember);
  router.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });

  router.get('/', validate('query', notificationListQuerySchema), async (req, res) => {
    res.json(
      await notifications.listNotificationsFor(
        ctx,
        currentMember(req),
        valid(res, 'query', notificationListQuerySchema),
      ),
    );
  });

  router.get('/count', async (req, res) => {
    res.json({ unread: await notifications.unreadCountFor(ctx, currentMember(req)) });
  });

  router.post('/read', validate('body', notificationReadSchema), async (req, res) => {
    res.json(
      await notifications.markNotificationsRead(
        ctx,
        currentMember(req),
        valid(res, 'body', notificationReadSchema),
      ),
    );
  });

  return router;
}
