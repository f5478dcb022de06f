import { afterEach, describe, expect, it, vi } from 'vitest';
import { startEarly, takeEarly } from '../../client/api/early';

describe('reads started at start-up (client/api/early.ts)', () => {
  afterEach(() => vi.useRealTimers());

  it('hands the read to the first view that asks, once', async () => {
    let calls = 0;
    startEarly('journal:7', async () => ({ id: 7, call: ++calls }));
    await expect(takeEarly('journal:7')).resolves.toEqual({ id: 7, call: 1 });
    expect(takeEarly('journal:7')).toBeUndefined();
    expect(takeEarly('journal:8')).toBeUndefined();
    expect(calls).toBe(1);
  });

  it('passes a failure to the view that takes it, and reports none nobody took', async () => {
    const unhandled = vi.fn();
    process.on('unhandledRejection', unhandled);
    startEarly('journal:9', () => Promise.reject(new Error('gone')));
    await expect(takeEarly('journal:9')).rejects.toThrow('gone');
    startEarly('journal:10', () => Promise.reject(new Error('never taken')));
    await new Promise((resolve) => setTimeout(resolve, 20));
    process.off('unhandledRejection', unhandled);
    expect(unhandled).not.toHaveBeenCalled();
  });

  it('drops a read nobody took within ten seconds', () => {
    vi.useFakeTimers();
    startEarly('journal:11', async () => 'stale');
    vi.advanceTimersByTime(10_001);
    expect(takeEarly('journal:11')).toBeUndefined();
  });
});
