import { Router } from 'express';
import { z } from 'zod';
import {
  commentInputSchema,
  commentListQuerySchema,
  commentUpdateSchema,
  staffDeleteSchema,
} from '../../shared/schemas/community';
import type { AppContext } from '../context';
import { currentMember, requireMember, requireVerified } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import * as comments from '../services/comments.service';

const journalParams = z.object({ id: z.coerce.number().int().positive('Use a journal id.') });
const commentParams = z.object({ id: z.coerce.number().int().positive('Use a comment id.') });

/** /api/journals/:id/comments (mounted with mergeParams): the conversation on a journal. */
export function journalCommentsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });

  router.get(
    '/',
    validate('params', journalParams),
    validate('query', commentListQuerySchema),
    async (req, res) => {
      const page = await comments.listComments(
        ctx,
        req.member,
        valid(res, 'params', journalParams).id,
        valid(res, 'query', commentListQuerySchema),
      );
      res.setHeader('Cache-Control', 'private, no-cache');
      res.json(page);
    },
  );

  router.post(
    '/',
    requireVerified,
    validate('params', journalParams),
    validate('body', commentInputSchema),
    async (req, res) => {
      const result = await comments.postComment(
        ctx,
        currentMember(req),
        valid(res, 'params', journalParams).id,
        valid(res, 'body', commentInputSchema),
      );
      res.status(result.held ? 202 : 201).json({
        comment: result.comment,
        held: result.held,
        message: result.held
          ? 'Thanks: a moderator reads the first comments of new members before they appear.'
          : null,
      });
    },
  );

  return router;
}

/** /api/comments/:id: change (its author, for a while) or delete (its author, staff). */
export function commentsRouter(ctx: AppContext): Router {
  const router = Router();

  router.patch(
    '/:id',
    requireMember,
    validate('params', commentParams),
    validate('body', commentUpdateSchema),
    async (req, res) => {
      const comment = await comments.editComment(
        ctx,
        currentMember(req),
        valid(res, 'params', commentParams).id,
        valid(res, 'body', commentUpdateSchema).body,
      );
      res.json({ comment });
    },
  );

  router.delete(
    '/:id',
    requireMember,
    validate('params', commentParams),
    validate('body', staffDeleteSchema),
    async (req, res) => {
      await comments.deleteComment(
        ctx,
        currentMember(req),
        valid(res, 'params', commentParams).id,
        valid(res, 'body', staffDeleteSchema).reason,
      );
      res.status(204).end();
    },
  );

  return router;
}
