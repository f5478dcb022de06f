import { readdir, readFile } from 'node:fs/promises';
import path from 'node:path';
import { brotliCompress, constants, gzip } from 'node:zlib';
import { promisify } from 'node:util';
import type { RequestHandler } from 'express';

const brotli = promisify(brotliCompress);
const gzipAsync = promisify(gzip);

const TYPES: Record<string, string> = {
  '.js': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.svg': 'image/svg+xml',
  '.json': 'application/json; charset=utf-8',
};
const NAME = /^\/[A-Za-z0-9._-]+\.(js|css|svg|json)$/;

type Encoded = { br: Buffer; gzip: Buffer };

/**
 * Compressed copies of the client build's text assets (Brotli or gzip, as the browser
 * accepts), made once per file on first request and kept: the names carry a content hash,
 * so a file never changes under its name. Everything else falls through to express.static.
 * The copies are made in the background as the server starts, one file after another, so the
 * first visitor after a deploy does not wait for them (Brotli 9 takes about a second for a
 * build). A reverse proxy that compresses does the same job in production.
 */
export function compressedAssets(dir: string): RequestHandler {
  const cache = new Map<string, Promise<Encoded | null>>();
  const encode = (file: string) =>
    readFile(path.join(dir, file))
      .then(async (raw) => ({
        br: await brotli(raw, { params: { [constants.BROTLI_PARAM_QUALITY]: 9 } }),
        gzip: await gzipAsync(raw, { level: 9 }),
      }))
      .catch(() => null);
  setImmediate(async () => {
    const files = await readdir(dir).catch(() => [] as string[]);
    for (const file of files) {
      if (!NAME.test(`/${file}`) || cache.has(file)) continue;
      const encoded = encode(file);
      cache.set(file, encoded);
      await encoded;
    }
  });
  return async (req, res, next) => {
    if ((req.method !== 'GET' && req.method !== 'HEAD') || !NAME.test(req.path)) return next();
    const accepts = String(req.headers['accept-encoding'] ?? '');
    const encoding = /\bbr\b/.test(accepts) ? 'br' : /\bgzip\b/.test(accepts) ? 'gzip' : null;
    if (!encoding) return next();
    const file = req.path.slice(1);
    if (!cache.has(file)) cache.set(file, encode(file));
    const encoded = await cache.get(file)!;
    if (!encoded) {
      cache.delete(file);
      return next();
    }
    const body = encoded[encoding];
    res.setHeader('Content-Type', TYPES[path.extname(file)]);
    res.setHeader('Content-Encoding', encoding);
    res.setHeader('Content-Length', String(body.length));
    res.setHeader('Vary', 'Accept-Encoding');
    res.setHeader('Cache-Control', 'public, max-age=31536000, immutable');
    if (req.method === 'HEAD') return res.end();
    res.end(body);
  };
}
