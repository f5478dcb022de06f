import { existsSync } from 'node:fs';
import path from 'node:path';
import compression from 'compression';
import express, { type Express } from 'express';
import helmet from 'helmet';
import { pinoHttp } from 'pino-http';
import type { AppContext } from './context';
import { apiNotFound, errorHandler } from './middleware/error-handler';
import { authenticate } from './middleware/authenticate';
import { requireCsrf } from './middleware/csrf';
import { compressedAssets } from './middleware/compressed-assets';
import { forgetCachedReads } from './middleware/read-cache';
import { sessionMiddleware } from './middleware/session';
import { adminRouter } from './routes/admin.routes';
import { authRouter } from './routes/auth.routes';
import { calendarFeedRouter, caveRouter } from './routes/cave.routes';
import { compareRouter } from './routes/compare.routes';
import { journalTastingsRouter, tastingsRouter } from './routes/tastings.routes';
import { devRouter } from './routes/dev.routes';
import { healthRouter } from './routes/health.routes';
import { journalsRouter } from './routes/journals.routes';
import { mediaRouter } from './routes/media.routes';
import { photosRouter } from './routes/photos.routes';
import { stylesRouter } from './routes/styles.routes';
import { commentsRouter, journalCommentsRouter } from './routes/comments.routes';
import { feedRouter, membersRouter } from './routes/members.routes';
import { auditRouter, moderationRouter, reportsRouter } from './routes/moderation.routes';
import { notificationsRouter } from './routes/notifications.routes';

/**
 * Builds the Express app from a context (config, logger, database); it does not listen, so
 * tests drive it with supertest. Middleware order: security headers, request log, body
 * parsers, API routers, API 404, the built client, the error handler last.
 */
export function createApp(ctx: AppContext): Express {
  const { config } = ctx;
  const app = express();
  app.disable('x-powered-by');
  app.set('trust proxy', config.trustProxy);
  app.set('query parser', 'extended');

  app.use(
    helmet({
      contentSecurityPolicy: {
        useDefaults: false,
        directives: {
          defaultSrc: ["'self'"],
          scriptSrc: ["'self'"],
          // naive-ui writes its component styles into <style> tags at run time.
          styleSrc: ["'self'", "'unsafe-inline'"],
          imgSrc: ["'self'", 'data:', 'blob:'],
          fontSrc: ["'self'", 'data:'],
          connectSrc: ["'self'"],
          objectSrc: ["'none'"],
          baseUri: ["'none'"],
          frameAncestors: ["'none'"],
          formAction: ["'self'"],
          ...(config.secureCookies ? { upgradeInsecureRequests: [] } : {}),
        },
      },
      hsts: config.secureCookies,
    }),
  );

  app.use(
    pinoHttp({
      logger: ctx.logger,
      autoLogging: { ignore: (req) => req.url === '/api/health' },
      customLogLevel: (_req, res, err) =>
        err || res.statusCode >= 500 ? 'error' : res.statusCode >= 400 ? 'warn' : 'info',
    }),
  );

  // The API's answers (JSON, the calendar feed, exports) compressed when the client accepts
  // it: Brotli at quality 4, or gzip, above 1 KB. A Compare answer of 250 KB goes out as
  // about a tenth of that. Photos (/media) are WebP already.
  app.use('/api', compression({ threshold: 1024 }));
  app.use('/api', express.json({ limit: '256kb' }));
  app.use('/api', express.urlencoded({ extended: false, limit: '64kb' }));

  app.use('/api/health', healthRouter(ctx));

  const sessions = sessionMiddleware(ctx);
  ctx.onClose(sessions.close);
  app.use('/api', sessions.handler, requireCsrf, authenticate(ctx));
  app.use('/api', forgetCachedReads(ctx));

  app.use('/api/auth', authRouter(ctx));
  // Before the admin router, which answers everything under /api/admin.
  app.use('/api/admin/audit', auditRouter(ctx));
  app.use('/api/admin', adminRouter(ctx));
  app.use('/api/styles', stylesRouter(ctx));
  // Before the journals router, so /api/journals/:id/photos reaches the photos router.
  app.use('/api/journals/:id/photos', photosRouter(ctx));
  app.use('/api/journals/:id/comments', journalCommentsRouter(ctx));
  app.use('/api/journals/:id', journalTastingsRouter(ctx));
  app.use('/api/journals', journalsRouter(ctx));
  app.use('/api/tastings', tastingsRouter(ctx));
  app.use('/api/cave', caveRouter(ctx));
  app.use('/api/calendar', calendarFeedRouter(ctx));
  app.use('/api/compare', compareRouter(ctx));
  app.use('/api/comments', commentsRouter(ctx));
  app.use('/api/members', membersRouter(ctx));
  app.use('/api/feed', feedRouter(ctx));
  app.use('/api/notifications', notificationsRouter(ctx));
  app.use('/api/reports', reportsRouter(ctx));
  app.use('/api/moderation', moderationRouter(ctx));
  if (!config.isProduction && ctx.mailbox) app.use('/api/dev', devRouter(ctx.mailbox));
  app.use('/api', apiNotFound);

  // Photo renditions: no CSRF, and the session only for a photo not everyone may see;
  // before the client so a missing photo is a 404.
  app.use('/media', mediaRouter(ctx, [sessions.handler, authenticate(ctx)]));
  if (config.serveClient) mountClient(app, config.clientDist);

  app.use(errorHandler(config.env === 'development'));
  return app;
}

/** Serves the Vite build: hashed assets cached for a year, index.html for every app route. */
function mountClient(app: Express, dist: string): void {
  const indexHtml = path.join(dist, 'index.html');
  app.use('/assets', compressedAssets(path.join(dist, 'assets')));
  app.use(
    '/assets',
    express.static(path.join(dist, 'assets'), {
      immutable: true,
      maxAge: '365d',
      index: false,
      fallthrough: false,
    }),
  );
  app.use(express.static(dist, { index: false, maxAge: '1h' }));
  app.get('/{*splat}', (req, res, next) => {
    if (!existsSync(indexHtml)) {
      res
        .status(503)
        .type('text/plain')
        .send('The client has not been built yet. Run `npm start` (or `npm run build`).');
      return;
    }
    if (!req.accepts('html')) return next();
    res.setHeader('Cache-Control', 'no-cache');
    res.sendFile(indexHtml);
  });
}
