import { Router } from 'express';
import { z } from 'zod';
import { staffDeleteSchema } from '../../shared/schemas/community';
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
import { AppError } from '../lib/errors';
import { sendSharedJson } from '../lib/cached-json';
import { currentMember, requireMember } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import * as journals from '../services/journals.service';

const idParams = z.object({ id: z.coerce.number().int().positive('Use a journal id.') });

/**
 * The document version a PUT was edited from, from If-Match (one entity tag, quoted or not;
 * a weak W/ prefix is read the same, and * overwrites whatever is stored). Missing: 428.
 */
function ifMatchOf(header: string | undefined): string {
  const value = header?.trim() ?? '';
  if (value === '*') return '*';
  const tag = /^(?:W\/)?"?([A-Za-z0-9_.-]{1,64})"?$/.exec(value);
  if (!tag) {
    throw new AppError(
      428,
      'VERSION_REQUIRED',
      'Send the version of the journal you edited in an If-Match header (the "version" of GET /api/journals/:id), so a save never overwrites changes made elsewhere.',
    );
  }
  return tag[1];
}

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
        ifMatchOf(req.get('if-match')),
      );
      res.setHeader('Cache-Control', 'no-store');
      res.json(journal);
    },
  );

  router.delete(
    '/:id',
    requireMember,
    validate('params', idParams),
    validate('body', staffDeleteSchema),
    async (req, res) => {
      await journals.deleteJournalAs(
        ctx,
        currentMember(req),
        valid(res, 'params', idParams).id,
        valid(res, 'body', staffDeleteSchema).reason,
      );
      res.status(204).end();
    },
  );

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
