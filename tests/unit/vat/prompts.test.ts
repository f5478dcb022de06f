import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  acknowledge,
  changeInterval,
  createPrompt,
  isDue,
  nextDueAt,
  promptWordingFor,
  undoAcknowledge,
} from '../../../client/lib/vat/prompts';

const MIN = 60_000;

describe('repeating prompts', () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(Date.parse('2026-03-14T10:00:00Z'));
  });
  afterEach(() => vi.useRealTimers());

  it('falls due one interval after it is set', () => {
    const p = createPrompt(5, Date.now());
    expect(nextDueAt(p)).toBe(Date.now() + 5 * MIN);
    vi.advanceTimersByTime(5 * MIN - 1);
    expect(isDue(p, Date.now())).toBe(false);
    vi.advanceTimersByTime(1);
    expect(isDue(p, Date.now())).toBe(true);
  });

  it('counts each Done and starts the next interval from it', () => {
    let p = createPrompt(5, Date.now());
    for (let i = 0; i < 7; i++) {
      // The maker stirs a minute late every time; the next stir is 5 min after the last.
      vi.advanceTimersByTime(6 * MIN);
      expect(isDue(p, Date.now())).toBe(true);
      p = acknowledge(p, Date.now());
      expect(isDue(p, Date.now())).toBe(false);
    }
    expect(p.count).toBe(7);
    expect(promptWordingFor('stirring').counted(p.count)).toBe('Stirred 7 times');
    expect(nextDueAt(p)).toBe(Date.now() + 5 * MIN);
  });

  it('takes back a double tap, never below zero', () => {
    let p = acknowledge(acknowledge(createPrompt(5, Date.now()), Date.now()), Date.now());
    expect(p.count).toBe(2);
    p = undoAcknowledge(undoAcknowledge(undoAcknowledge(p)));
    expect(p.count).toBe(0);
  });

  it('changes the interval keeping the count, and keeps it to whole minutes in range', () => {
    let p = acknowledge(createPrompt(5, Date.now()), Date.now());
    vi.advanceTimersByTime(2 * MIN);
    p = changeInterval(p, 10, Date.now());
    expect(p.count).toBe(1);
    expect(nextDueAt(p)).toBe(Date.now() + 10 * MIN);
    expect(createPrompt(0, 0).intervalMinutes).toBe(1);
    expect(createPrompt(2.6, 0).intervalMinutes).toBe(3);
    expect(createPrompt(10_000, 0).intervalMinutes).toBe(240);
    expect(createPrompt(Number.NaN, 0).intervalMinutes).toBe(1);
  });

  it('speaks the trade for each step', () => {
    expect(promptWordingFor('cooking').action).toBe('Stir the curd');
    expect(promptWordingFor('cheddaring').counted(1)).toBe('Turned once');
    expect(promptWordingFor('press').counted(2)).toBe('Checked twice');
    expect(promptWordingFor('press').defaultMinutes).toBe(30);
  });
});

describe('the double-tap guard', () => {
  it('lets one tap through and ignores a second within the moment', async () => {
    const { createTapGuard } = await import('../../../client/lib/vat/taps');
    const allow = createTapGuard(700);
    expect(allow(1000)).toBe(true);
    expect(allow(1300)).toBe(false);
    expect(allow(1699)).toBe(false);
    expect(allow(1700)).toBe(true);
  });
});
