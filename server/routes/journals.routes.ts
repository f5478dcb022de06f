import { Router } from 'express';
import { z } from 'zod';
import {
  copyJournalSchema,
  journalExportQuerySchema,
  journalInputSchema,
  journalListQuerySchema,
  readingBatchSchema,
  readingInputSchema,
  weighInSchema,
} from '../../shared/schemas/journal';
import type { AppContext } from '../context';
import { sendSharedJson } from '../lib/cached-json';
import { currentMember, requireMember } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import * as journals from '../services/journals.service';

const idParams = z.object({ id: z.coerce.number().int().positive('Use a journal id.') });

/**
 * /api/journals: Discover and My journals, one journal with its derived figures, the whole
 * document written at once (create, replace, delete), start-from-a-journal, vat readings,
 * weigh-ins and the export.
 */
export function journalsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/', validate('query', journalListQuerySchema), async (req, res) => {
    const query = valid(res, 'query', journalListQuerySchema);
    if (query.mine) {
      res.setHeader('Cache-Control', 'no-store');
      res.json(await journals.listJournalsFor(ctx, req.member, query));
      return;
    }
    // Discover lists only what is listed, the same page for every viewer.
    await sendSharedJson(ctx, res, `discover:${JSON.stringify(query)}`, () =>
      journals.listJournalsFor(ctx, req.member, query),
    );
  });

  // Before /:id, so "export" is never read as an id.
  router.get(
    '/export',
    requireMember,
    validate('query', journalExportQuerySchema),
    async (req, res) => {
      const { format, table } = valid(res, 'query', journalExportQuerySchema);
      const file = await journals.exportJournals(ctx, currentMember(req), format, table);
      res.setHeader('Cache-Control', 'no-store');
      res.setHeader('Content-Type', file.contentType);
      res.attachment(file.filename);
      res.send(file.body);
    },
  );

  router.post('/', requireMember, validate('body', journalInputSchema), async (req, res) => {
    const journal = await journals.createJournal(
      ctx,
      currentMember(req),
      valid(res, 'body', journalInputSchema),
    );
    res.status(201).location(`/api/journals/${journal.id}`).json(journal);
  });

  router.get('/:id', validate('params', idParams), async (req, res) => {
    const id = valid(res, 'params', idParams).id;
    res.setHeader('Cache-Control', 'private, no-cache');
    if (req.member) {
      res.json(await journals.getJournal(ctx, req.member, id));
      return;
    }
    // What a signed-out reader may see of a journal is the same for all of them.
    await sendSharedJson(ctx, res, `journal:${id}`, () => journals.getJournal(ctx, undefined, id));
  });

  router.put(
    '/:id',
    requireMember,
    validate('params', idParams),
    validate('body', journalInputSchema),
    async (req, res) => {
      const journal = await journals.updateJournalDocument(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', journalInputSchema),
      );
      res.json(journal);
    },
  );

  router.delete('/:id', requireMember, validate('params', idParams), async (req, res) => {
    await journals.deleteJournalAs(ctx, currentMember(req), valid(res, 'params', idParams).id);
    res.status(204).end();
  });

  router.post(
    '/:id/copy',
    requireMember,
    validate('params', idParams),
    validate('body', copyJournalSchema),
    async (req, res) => {
      const journal = await journals.copyJournal(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', copyJournalSchema),
      );
      res.status(201).location(`/api/journals/${journal.id}`).json(journal);
    },
  );

  router.post(
    '/:id/readings/batch',
    requireMember,
    validate('params', idParams),
    validate('body', readingBatchSchema),
    async (req, res) => {
      const result = await journals.addReadings(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', readingBatchSchema).readings,
      );
      res.status(result.created ? 201 : 200).json(result);
    },
  );

  router.post(
    '/:id/readings',
    requireMember,
    validate('params', idParams),
    validate('body', readingInputSchema),
    async (req, res) => {
      const { readings, created } = await journals.addReadings(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        [valid(res, 'body', readingInputSchema)],
      );
      // 201 on the first write; a replay of the same id answers 200 with what was stored.
      res.status(created ? 201 : 200).json(readings[0]);
    },
  );

  router.post(
    '/:id/weigh-ins',
    requireMember,
    validate('params', idParams),
    validate('body', weighInSchema),
    async (req, res) => {
      const journal = await journals.addWeighIn(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', weighInSchema),
      );
      res.status(201).json(journal);
    },
  );

  return router;
}
