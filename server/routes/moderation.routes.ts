import { Router } from 'express';
import { z } from 'zod';
import {
  auditQuerySchema,
  heldCommentActionSchema,
  moderationSettingsSchema,
  reportActionSchema,
  reportInputSchema,
  reportListQuerySchema,
} from '../../shared/schemas/community';
import type { AppContext } from '../context';
import { currentMember, requireRole, requireVerified } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import { listAudit } from '../services/audit.service';
import * as moderation from '../services/moderation.service';
import { getModerationSettings, updateModerationSettings } from '../services/site-settings.service';

const idParams = z.object({ id: z.coerce.number().int().positive('Use an id.') });
const heldQuery = z.object({
  page: z.coerce.number().int().min(1).max(10_000).default(1),
  pageSize: z.coerce.number().int().min(1).max(50).default(20),
});

/** /api/reports: a verified member reports a journal, photo, tasting or comment. */
export function reportsRouter(ctx: AppContext): Router {
  const router = Router();
  router.post('/', requireVerified, validate('body', reportInputSchema), async (req, res) => {
    const { id, created } = await moderation.fileReport(
      ctx,
      currentMember(req),
      valid(res, 'body', reportInputSchema),
    );
    res.status(created ? 201 : 200).json({
      report: { id, status: 'open' },
      message: created
        ? 'Thank you. A moderator will look at it soon.'
        : 'You have already reported this; a moderator will look at it soon.',
    });
  });
  return router;
}

/**
 * /api/moderation (moderators and admins): the report queue and its actions, comments held
 * for review, and the moderation settings.
 */
export function moderationRouter(ctx: AppContext): Router {
  const router = Router();
  router.use(requireRole('moderator', 'admin'));
  router.use((_req, res, next) => {
    res.setHeader('Cache-Control', 'no-store');
    next();
  });

  router.get('/reports', validate('query', reportListQuerySchema), async (req, res) => {
    res.json(
      await moderation.listReportsFor(
        ctx,
        currentMember(req),
        valid(res, 'query', reportListQuerySchema),
      ),
    );
  });

  router.get('/reports/:id', validate('params', idParams), async (req, res) => {
    res.json({
      report: await moderation.getReport(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
      ),
    });
  });

  router.post(
    '/reports/:id/actions',
    validate('params', idParams),
    validate('body', reportActionSchema),
    async (req, res) => {
      const report = await moderation.actOnReport(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', reportActionSchema),
      );
      res.json({ report });
    },
  );

  router.get('/comments', validate('query', heldQuery), async (_req, res) => {
    res.json(await moderation.listHeld(ctx, valid(res, 'query', heldQuery)));
  });

  router.post(
    '/comments/:id/actions',
    validate('params', idParams),
    validate('body', heldCommentActionSchema),
    async (req, res) => {
      await moderation.actOnHeldComment(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', heldCommentActionSchema),
      );
      res.status(204).end();
    },
  );

  router.get('/settings', async (_req, res) => {
    res.json({ settings: await getModerationSettings(ctx) });
  });

  router.put('/settings', validate('body', moderationSettingsSchema), async (req, res) => {
    res.json({
      settings: await updateModerationSettings(
        ctx,
        currentMember(req),
        valid(res, 'body', moderationSettingsSchema),
      ),
    });
  });

  return router;
}

/** /api/admin/audit (admins): the audit log, newest first. */
export function auditRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/', requireRole('admin'), validate('query', auditQuerySchema), async (_req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json(await listAudit(ctx, valid(res, 'query', auditQuerySchema)));
  });
  return router;
}
