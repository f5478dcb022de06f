import { describe, expect, it } from 'vitest';
import { TtlCache } from '../../server/lib/ttl-cache';

describe('TtlCache', () => {
  it('reuses an answer until it expires, and computes concurrent misses once', async () => {
    const cache = new TtlCache<number>(50);
    let calls = 0;
    const load = async () => {
      calls += 1;
      await new Promise((resolve) => setTimeout(resolve, 10));
      return calls;
    };
    const [a, b] = await Promise.all([cache.getOrLoad('k', load), cache.getOrLoad('k', load)]);
    expect([a, b, calls]).toEqual([1, 1, 1]);
    expect(await cache.getOrLoad('k', load)).toBe(1);
    // Stale but recent: the old answer at once, a refresh behind it…
    await new Promise((resolve) => setTimeout(resolve, 60));
    expect(await cache.getOrLoad('k', load)).toBe(1);
    await new Promise((resolve) => setTimeout(resolve, 20));
    expect(await cache.getOrLoad('k', load)).toBe(2);
    // …and long past its time, a reader waits for a fresh one.
    await new Promise((resolve) => setTimeout(resolve, 260));
    expect(await cache.getOrLoad('k', load)).toBe(3);
  });

  it('forgets everything on clear, even an answer still being computed', async () => {
    const cache = new TtlCache<string>(10_000);
    let value = 'old';
    const slow = cache.getOrLoad('k', async () => {
      const seen = value;
      await new Promise((resolve) => setTimeout(resolve, 20));
      return seen;
    });
    cache.clear();
    value = 'new';
    expect(await slow).toBe('old');
    expect(await cache.getOrLoad('k', async () => value)).toBe('new');
  });

  it('keeps at most maxEntries, dropping the least recently used', async () => {
    const cache = new TtlCache<string>(10_000, 2);
    await cache.getOrLoad('a', async () => 'a1');
    await cache.getOrLoad('b', async () => 'b1');
    await cache.getOrLoad('a', async () => 'a2'); // a is now the most recent
    await cache.getOrLoad('c', async () => 'c1');
    expect(await cache.getOrLoad('a', async () => 'a3')).toBe('a1');
    expect(await cache.getOrLoad('b', async () => 'b2')).toBe('b2');
  });

  it('does nothing when its lifetime is 0', async () => {
    const cache = new TtlCache<number>(0);
    let n = 0;
    await cache.getOrLoad('k', async () => ++n);
    expect(await cache.getOrLoad('k', async () => ++n)).toBe(2);
  });
});
