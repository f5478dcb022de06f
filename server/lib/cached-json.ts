import type { Response } from 'express';
import type { AppContext } from '../context';

/**
 * Answers with JSON that is the same for everyone who may ask (a public Discover page, a
 * journal as a signed-out reader sees it, Compare over what is listed): the serialised body
 * is kept in the read cache for READ_CACHE_SECONDS, so a popular page costs one query and
 * one JSON.stringify per few seconds, not per request.
 */
export async function sendSharedJson(
  ctx: AppContext,
  res: Response,
  key: string,
  load: () => Promise<unknown>,
): Promise<void> {
  const body = (await ctx.readCache.getOrLoad(key, async () =>
    JSON.stringify(await load()),
  )) as string;
  res.type('application/json').send(body);
}
