import { pipeline } from 'node:stream/promises';
import { Router, type Request, type RequestHandler, type Response } from 'express';
import type { AppContext } from '../context';
import { mediaAccess, PHOTO_FILE_PATTERN } from '../services/photos.service';

const notFound = (res: Response) =>
  res.status(404).type('text/plain').setHeader('Cache-Control', 'no-store').send('Not found');

/** Runs one middleware (the session, then authenticate) inside a handler; resolves after next(). */
function run(handler: RequestHandler, req: Request, res: Response): Promise<void> {
  return new Promise((resolve, reject) => {
    const result: unknown = handler(req, res, (error?: unknown) =>
      error ? reject(error) : resolve(),
    );
    if (result instanceof Promise) result.catch(reject);
  });
}

/**
 * GET /media/photos/:file: a stored WebP rendition, from local disk or the S3 bucket alike.
 * A photo anyone may read is sent without a session lookup and cached for a year (names
 * carry 128 random bits and never change content). A hidden photo, or one of a draft,
 * private or hidden journal, goes only to its maker and staff who may read the journal,
 * marked private and never stored; anyone else gets the same 404 as for a missing file.
 * `identify` is the session and authenticate middleware, run only for those.
 */
export function mediaRouter(ctx: AppContext, identify: RequestHandler[] = []): Router {
  const router = Router();
  router.get('/photos/:file', async (req, res) => {
    const file = req.params.file;
    if (!PHOTO_FILE_PATTERN.test(file)) return notFound(res);
    const access = await mediaAccess(ctx, file);
    if (!access) return notFound(res);
    if (access !== 'public') {
      for (const handler of identify) await run(handler, req, res);
      if (!access.allows(req.member)) return notFound(res);
    }
    const stored = await ctx.storage.get(file);
    if (!stored) return notFound(res);
    res.setHeader('Content-Type', 'image/webp');
    res.setHeader('Content-Length', String(stored.size));
    res.setHeader(
      'Cache-Control',
      access === 'public' ? 'public, max-age=31536000, immutable' : 'private, no-store',
    );
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
