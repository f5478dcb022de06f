import type { Pool } from 'mysql2/promise';
import { RateLimiterMySQL, RateLimiterRes } from 'rate-limiter-flexible';
import { TooManyRequestsError } from './errors';

type LimitSpec = { points: number; duration: number; blockDuration?: number };

// Points per window (seconds). Per-IP limits are looser than per-account ones, since many
// members can share an address (a club meeting on one network).
export const LIMITS = {
  signInIp: { points: 60, duration: 15 * 60 },
  signInAccount: { points: 8, duration: 15 * 60, blockDuration: 15 * 60 },
  signUpIp: { points: 20, duration: 60 * 60 },
  resendAccount: { points: 3, duration: 60 * 60 },
  resendIp: { points: 20, duration: 60 * 60 },
  resetAccount: { points: 3, duration: 60 * 60 },
  resetIp: { points: 20, duration: 60 * 60 },
  // Community: enough for a lively thread, too few for a spam run; reports are rarer still.
  commentMember: { points: 10, duration: 10 * 60 },
  reportMember: { points: 10, duration: 60 * 60 },
} satisfies Record<string, LimitSpec>;

export type LimiterName = keyof typeof LIMITS;
export type Limiters = Record<LimiterName, RateLimiterMySQL>;

/**
 * Rate limiters kept in MariaDB (rate-limiter-flexible's MySQL store on our pool), so that
 * every app server counts against the same rows.
 */
export function createLimiters(pool: Pool, dbName: string): Limiters {
  const callbackPool = (pool as unknown as { pool: unknown }).pool;
  const entries = Object.entries(LIMITS).map(([name, spec]) => [
    name,
    new RateLimiterMySQL({
      storeClient: callbackPool,
      storeType: 'pool',
      dbName,
      tableName: 'rate_limits',
      tableCreated: true,
      clearExpiredByTimeout: false,
      keyPrefix: name,
      ...spec,
    }),
  ]);
  return Object.fromEntries(entries) as Limiters;
}

/** Takes one point for key; throws TooManyRequestsError (429) when the limit is reached. */
export async function takePoint(limiter: RateLimiterMySQL, key: string): Promise<void> {
  try {
    await limiter.consume(key);
  } catch (error) {
    if (error instanceof RateLimiterRes)
      throw new TooManyRequestsError(Math.max(1, Math.ceil(error.msBeforeNext / 1000)));
    throw error;
  }
}

/** Throws 429 when key has already used up its points, without taking one. */
export async function ensureNotLimited(limiter: RateLimiterMySQL, key: string): Promise<void> {
  const state = await limiter.get(key);
  if (state && state.remainingPoints <= 0 && state.msBeforeNext > 0) {
    throw new TooManyRequestsError(Math.max(1, Math.ceil(state.msBeforeNext / 1000)));
  }
}

/** Forgets the points used by key (after a successful sign-in, for example). */
export async function clearPoints(limiter: RateLimiterMySQL, key: string): Promise<void> {
  await limiter.delete(key);
}
