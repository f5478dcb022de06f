import { Router } from 'express';
import { z } from 'zod';
import type { AppContext } from '../context';
import { currentMember, requireMember } from '../middleware/authenticate';
import { validate, valid } from '../middleware/validate';
import * as cave from '../services/cave.service';

const journalParams = z.object({ id: z.coerce.number().int().positive('Use a journal id.') });
const statusBody = z.object({
  wheelStatus: z.enum(['drying', 'aging', 'opened', 'finished', 'discarded'], {
    error: 'Choose drying, aging, opened, finished or discarded.',
  }),
});

/** /api/cave: the member's aging wheels, wheel status changes, the calendar address. */
export function caveRouter(ctx: AppContext): Router {
  const router = Router();
  router.use(requireMember);

  router.get('/', async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ wheels: await cave.listCave(ctx, currentMember(req)) });
  });

  router.post(
    '/:id/status',
    validate('params', journalParams),
    validate('body', statusBody),
    async (req, res) => {
      await cave.changeWheelStatus(
        ctx,
        currentMember(req),
        valid(res, 'params', journalParams).id,
        valid(res, 'body', statusBody).wheelStatus,
      );
      res.status(204).end();
    },
  );

  router.get('/calendar', async (req, res) => {
    res.setHeader('Cache-Control', 'no-store');
    res.json({ url: await cave.calendarUrl(ctx, currentMember(req)) });
  });

  router.post('/calendar/reset', async (req, res) => {
    res.json({ url: await cave.calendarUrl(ctx, currentMember(req), true) });
  });

  return router;
}

/** GET /api/calendar/:token.ics: the member's ready dates in iCalendar format. */
export function calendarFeedRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/:file', async (req, res) => {
    const token = req.params.file.replace(/\.ics$/, '');
    const body = await cave.calendarFeed(ctx, token);
    res.setHeader('Content-Type', 'text/calendar; charset=utf-8');
    res.setHeader('Cache-Control', 'private, max-age=900');
    res.send(body);
  });
  return router;
}
