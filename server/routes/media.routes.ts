import { pipeline } from 'node:stream/promises';
import { Router, type Response } from 'express';
import type { AppContext } from '../context';
import { PHOTO_FILE_PATTERN } from '../services/photos.service';

const notFound = (res: Response) =>
  res.status(404).type('text/plain').setHeader('Cache-Control', 'no-store').send('Not found');

/**
 * GET /media/photos/:file: a stored WebP rendition. Names carry 128 random bits and never
 * change content, so they are cached for a year; anything not shaped like a key is a 404.
 */
export function mediaRouter(ctx: AppContext): Router {
  const router = Router();
  router.get('/photos/:file', async (req, res) => {
    const file = req.params.file;
    if (!PHOTO_FILE_PATTERN.test(file)) return notFound(res);
    const stored = await ctx.storage.get(file);
    if (!stored) return notFound(res);
    res.setHeader('Content-Type', 'image/webp');
    res.setHeader('Content-Length', String(stored.size));
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    res.setHeader('X-Content-Type-Options', 'nosniff');
    if (req.method === 'HEAD') {
      stored.body.destroy();
      return res.end();
    }
    try {
      await pipeline(stored.body, res);
    } catch (error) {
      // A reader who leaves mid-download is normal; anything else is worth a line in the log.
      if ((error as NodeJS.ErrnoException).code !== 'ERR_STREAM_PREMATURE_CLOSE') {
        req.log.warn({ err: error, file }, 'photo stream failed');
      }
      if (!res.headersSent) notFound(res);
      else res.destroy();
    }
  });
  router.use('/', (_req, res) => notFound(res));
  return router;
}
