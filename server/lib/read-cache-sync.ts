import type { Logger } from 'pino';
import type { Pool } from 'mysql2/promise';
import type { TtlCache } from './ttl-cache';

/** The site_settings row whose value every app server bumps after a write it served. */
export const READ_CACHE_EPOCH_KEY = 'read_cache_epoch';

export type ReadCacheSync = {
  /** After a write this server served: forget its own cached reads and tell the others. */
  announceWrite: () => Promise<void>;
  /** Reads the shared epoch once and forgets the cached reads if another server moved it. */
  check: () => Promise<void>;
  stop: () => void;
};

/**
 * Keeps the read caches of several app servers honest with one another. Each write bumps a
 * counter in MariaDB (one row of site_settings); each server reads that counter every
 * `intervalMs` (one primary-key lookup, not one per request) and drops everything it has
 * cached when the counter moved. A journal hidden or made private through one server thus
 * leaves the cached answers of every other server within about `intervalMs`, instead of
 * living on for READ_CACHE_SECONDS and the stale-while-refresh window after it.
 */
export function startReadCacheSync(
  pool: Pool,
  cache: TtlCache<unknown>,
  logger: Logger,
  intervalMs: number,
): ReadCacheSync {
  let seen: string | null = null;
  let checking: Promise<void> | null = null;

  const read = async (): Promise<string> => {
    const [rows] = await pool.query('SELECT `value` FROM site_settings WHERE `key` = ? LIMIT 1', [
      READ_CACHE_EPOCH_KEY,
    ]);
    return (rows as { value: string }[])[0]?.value ?? '0';
  };

  const check = (): Promise<void> => {
    checking ??= read()
      .then((epoch) => {
        if (seen !== null && epoch !== seen) cache.clear();
        seen = epoch;
      })
      .catch((error: unknown) => {
        // The database is away, so nobody can say what changed: forget what is cached
        // (reads answer 503 until it is back, as uncached ones would).
        seen = null;
        cache.clear();
        logger.debug({ err: error }, 'read cache epoch not readable');
      })
      .finally(() => {
        checking = null;
      });
    return checking;
  };

  const announceWrite = async (): Promise<void> => {
    cache.clear();
    try {
      await pool.query(
        'INSERT INTO site_settings (`key`, `value`) VALUES (?, ?) ' +
          'ON DUPLICATE KEY UPDATE `value` = CAST(CAST(`value` AS UNSIGNED) + 1 AS CHAR)',
        [READ_CACHE_EPOCH_KEY, '1'],
      );
    } catch (error) {
      logger.warn({ err: error }, 'could not tell the other app servers about a write');
    }
  };

  const timer = setInterval(() => void check(), intervalMs);
  timer.unref();
  void check();
  return { announceWrite, check, stop: () => clearInterval(timer) };
}
