import type { RequestHandler } from 'express';
import type { AppContext } from '../context';

const SAFE_METHODS = new Set(['GET', 'HEAD', 'OPTIONS']);

/**
 * After any write through this server that succeeded, forget the cached reads, so a maker
 * sees their own change at once, and tell the other app servers, which forget theirs within
 * READ_CACHE_SYNC_MS (read-cache-sync.ts).
 */
export function forgetCachedReads(ctx: AppContext): RequestHandler {
  return (req, res, next) => {
    if (ctx.readCache.enabled && !SAFE_METHODS.has(req.method)) {
      res.once('finish', () => {
        if (res.statusCode < 400) void ctx.readCacheSync?.announceWrite();
      });
    }
    next();
  };
}
