import { Router } from 'express';
import { z } from 'zod';
import { staffDeleteSchema } from '../../shared/schemas/community';
import { tastingInputSchema, tastingUpdateSchema } from '../../shared/schemas/tasting';
import type { AppContext } from '../context';
import { currentMember, requireMember, requireVerified } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import { presentTasting } from '../presenters/tasting.presenter';
import { findTasting } from '../repositories/tastings.repository';
import * as tastings from '../services/tastings.service';

const journalParams = z.object({ id: z.coerce.number().int().positive('Use a journal id.') });
const tastingParams = z.object({ id: z.coerce.number().int().positive('Use a tasting id.') });

/** /api/journals/:id/tastings and /api/journals/:id/invites (mounted with mergeParams). */
export function journalTastingsRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });

  router.get('/tastings', validate('params', journalParams), async (req, res) => {
    const { rows, bands, invites } = await tastings.listJournalTastings(
      ctx,
      req.member,
      valid(res, 'params', journalParams).id,
    );
    res.json({
      tastings: rows.map((r) => ({
        ...presentTasting(r.tasting, r.taster, req.member),
        hidden: r.hidden,
      })),
      bands,
      ...(invites ? { invites } : {}),
    });
  });

  router.post(
    '/tastings',
    requireVerified,
    validate('params', journalParams),
    validate('body', tastingInputSchema),
    async (req, res) => {
      const member = currentMember(req);
      const id = await tastings.addTasting(
        ctx,
        member,
        valid(res, 'params', journalParams).id,
        valid(res, 'body', tastingInputSchema),
      );
      const row = (await findTasting(ctx.database.db, id))!;
      res.status(201).json({ tasting: presentTasting(row.tasting, row.taster, member) });
    },
  );

  router.post('/invites', requireVerified, validate('params', journalParams), async (req, res) => {
    const invite = await tastings.createInvite(
      ctx,
      currentMember(req),
      valid(res, 'params', journalParams).id,
    );
    res.status(201).json({ invite });
  });

  return router;
}

/** /api/tastings/:id: change or delete one tasting (its taster, moderators, admins). */
export function tastingsRouter(ctx: AppContext): Router {
  const router = Router();

  router.patch(
    '/:id',
    requireMember,
    validate('params', tastingParams),
    validate('body', tastingUpdateSchema),
    async (req, res) => {
      const member = currentMember(req);
      const id = valid(res, 'params', tastingParams).id;
      await tastings.changeTasting(ctx, member, id, valid(res, 'body', tastingUpdateSchema));
      const row = (await findTasting(ctx.database.db, id))!;
      res.json({ tasting: presentTasting(row.tasting, row.taster, member) });
    },
  );

  router.delete(
    '/:id',
    requireMember,
    validate('params', tastingParams),
    validate('body', staffDeleteSchema),
    async (req, res) => {
      await tastings.removeTasting(
        ctx,
        currentMember(req),
        valid(res, 'params', tastingParams).id,
        valid(res, 'body', staffDeleteSchema).reason,
      );
      res.status(204).end();
    },
  );

  return router;
}
