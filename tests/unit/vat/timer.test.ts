// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import {
  apply,
  back,
  can,
  createTimer,
  currentRun,
  elapsedMs,
  finish,
  fitTimer,
  isComplete,
  isRunning,
  pause,
  remainingMs,
  resume,
  skip,
  start,
  timerFromRecord,
} from '../../../client/lib/vat/timer';
import {
  emptyLocalState,
  loadLocalState,
  localStateKey,
  saveLocalState,
} from '../../../client/lib/vat/state';

const MIN = 60_000;
const T0 = Date.parse('2026-03-14T09:00:00Z');

describe('the make timer', () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(T0);
  });
  afterEach(() => vi.useRealTimers());

  it('starts on the first step with nothing running', () => {
    const t = createTimer(3);
    expect(t.current).toBe(0);
    expect(t.runs.map((r) => r.status)).toEqual(['pending', 'pending', 'pending']);
    expect(can(t, 'start')).toBe(true);
    expect(can(t, 'pause')).toBe(false);
    expect(can(t, 'finish')).toBe(false);
    expect(can(t, 'back')).toBe(false);
    expect(isRunning(t)).toBe(false);
  });

  it('counts elapsed time from timestamps, not ticks', () => {
    const t = start(createTimer(2), Date.now());
    vi.advanceTimersByTime(12 * MIN);
    expect(elapsedMs(currentRun(t)!, Date.now())).toBe(12 * MIN);
    expect(remainingMs(currentRun(t)!, 30, Date.now())).toBe(18 * MIN);
    // A phone asleep for an hour comes back to the true elapsed time (and overtime).
    vi.setSystemTime(Date.now() + 60 * MIN);
    expect(elapsedMs(currentRun(t)!, Date.now())).toBe(72 * MIN);
    expect(remainingMs(currentRun(t)!, 30, Date.now())).toBe(-42 * MIN);
    expect(remainingMs(currentRun(t)!, null, Date.now())).toBeNull();
  });

  it('keeps the time gathered before a pause and stops the clock while paused', () => {
    let t = start(createTimer(1), Date.now());
    vi.advanceTimersByTime(5 * MIN);
    t = pause(t, Date.now());
    expect(currentRun(t)!.status).toBe('paused');
    vi.advanceTimersByTime(20 * MIN);
    expect(elapsedMs(currentRun(t)!, Date.now())).toBe(5 * MIN);
    t = resume(t, Date.now());
    vi.advanceTimersByTime(3 * MIN);
    expect(elapsedMs(currentRun(t)!, Date.now())).toBe(8 * MIN);
    // The first start is kept across the pause: it is what the journal records.
    expect(currentRun(t)!.startedAt).toBe(T0);
  });

  it('finishes a step with its total and moves to the next', () => {
    let t = start(createTimer(2), Date.now());
    vi.advanceTimersByTime(4 * MIN);
    t = pause(t, Date.now());
    vi.advanceTimersByTime(MIN);
    t = resume(t, Date.now());
    vi.advanceTimersByTime(6 * MIN);
    t = finish(t, Date.now());
    expect(t.current).toBe(1);
    expect(t.runs[0]).toMatchObject({
      status: 'done',
      accumulatedMs: 10 * MIN,
      runningSince: null,
    });
    expect(t.runs[0].endedAt).toBe(T0 + 11 * MIN);
    // The finished step's time no longer grows.
    vi.advanceTimersByTime(30 * MIN);
    expect(elapsedMs(t.runs[0], Date.now())).toBe(10 * MIN);
    expect(can(t, 'start')).toBe(true);
  });

  it('skips a step not started, or one part-run, and ends after the last', () => {
    let t = skip(createTimer(2), Date.now());
    expect(t.runs[0]).toMatchObject({ status: 'skipped', startedAt: null, accumulatedMs: 0 });
    t = start(t, Date.now());
    vi.advanceTimersByTime(2 * MIN);
    t = skip(t, Date.now());
    expect(t.runs[1]).toMatchObject({ status: 'skipped', accumulatedMs: 2 * MIN });
    expect(isComplete(t)).toBe(true);
    expect(currentRun(t)).toBeNull();
    expect(can(t, 'skip')).toBe(false);
    expect(skip(t, Date.now())).toBe(t);
  });

  it('ignores actions that do not apply', () => {
    const t = createTimer(1);
    expect(pause(t, Date.now())).toBe(t);
    expect(resume(t, Date.now())).toBe(t);
    expect(finish(t, Date.now())).toBe(t);
    const running = start(t, Date.now());
    expect(start(running, Date.now() + MIN)).toBe(running);
    expect(resume(running, Date.now())).toBe(running);
  });

  it('goes back after a mistaken skip or finish, keeping the time already run', () => {
    let t = start(createTimer(2), Date.now());
    vi.advanceTimersByTime(7 * MIN);
    t = finish(t, Date.now());
    expect(can(t, 'back')).toBe(true);
    t = back(t);
    expect(t.current).toBe(0);
    expect(t.runs[0]).toMatchObject({ status: 'paused', accumulatedMs: 7 * MIN, endedAt: null });
    t = resume(t, Date.now());
    vi.advanceTimersByTime(MIN);
    expect(elapsedMs(currentRun(t)!, Date.now())).toBe(8 * MIN);
    // Not from a step that has started: that would throw its time away.
    t = finish(t, Date.now());
    t = start(t, Date.now());
    expect(can(t, 'back')).toBe(false);
    // A skipped step that never ran comes back pending.
    const s = back(skip(createTimer(2), Date.now()));
    expect(s.runs[0].status).toBe('pending');
  });

  it('applies actions by name', () => {
    let t = createTimer(1);
    t = apply(t, 'start', T0);
    t = apply(t, 'pause', T0 + MIN);
    t = apply(t, 'resume', T0 + 2 * MIN);
    t = apply(t, 'finish', T0 + 3 * MIN);
    expect(t.runs[0]).toMatchObject({ status: 'done', accumulatedMs: 2 * MIN });
  });

  it('restores a running step after a reload without losing or gaining time', () => {
    let t = start(createTimer(3), Date.now());
    vi.advanceTimersByTime(2 * MIN);
    t = finish(t, Date.now());
    t = start(t, Date.now());
    vi.advanceTimersByTime(9 * MIN);
    const state = { ...emptyLocalState(3, 0), steps: t };
    expect(saveLocalState(localStorage, 42, state)).toBe(true);

    // The page is reloaded four minutes later.
    vi.advanceTimersByTime(4 * MIN);
    const restored = loadLocalState(localStorage, 42, 3, 0)!;
    expect(restored.steps.current).toBe(1);
    expect(isRunning(restored.steps)).toBe(true);
    expect(elapsedMs(currentRun(restored.steps)!, Date.now())).toBe(13 * MIN);
    expect(elapsedMs(restored.steps.runs[0], Date.now())).toBe(2 * MIN);
  });

  it('ignores a damaged saved state and fits a saved one to an edited journal', () => {
    localStorage.setItem(localStateKey(7), '{"v":1,"steps":');
    expect(loadLocalState(localStorage, 7, 3, 0)).toBeNull();
    localStorage.setItem(localStateKey(8), JSON.stringify({ v: 99 }));
    expect(loadLocalState(localStorage, 8, 3, 0)).toBeNull();

    let t = createTimer(3);
    t = finish(start(t, T0), T0 + MIN);
    t = finish(start(t, T0 + MIN), T0 + 2 * MIN);
    saveLocalState(localStorage, 9, { ...emptyLocalState(3, 0), steps: t });
    const fewer = loadLocalState(localStorage, 9, 1, 0)!;
    expect(fewer.steps.runs).toHaveLength(1);
    expect(fewer.steps.current).toBe(1);
    expect(fitTimer(fewer.steps, 4).runs.map((r) => r.status)).toEqual([
      'done',
      'pending',
      'pending',
      'pending',
    ]);
  });

  it('rebuilds the timer from what the journal recorded (another phone)', () => {
    const t = timerFromRecord(
      [
        { startedAt: '2026-03-14T09:00:00+01:00', actualMinutes: 30 },
        { startedAt: '2026-03-14T09:30:00+01:00', actualMinutes: null },
        { startedAt: null, actualMinutes: null },
      ],
      Date.parse('2026-03-14T09:40:00+01:00'),
    );
    expect(t.current).toBe(1);
    expect(t.runs[0]).toMatchObject({ status: 'done', accumulatedMs: 30 * MIN });
    expect(t.runs[1].status).toBe('running');
    expect(elapsedMs(t.runs[1], Date.parse('2026-03-14T09:40:00+01:00'))).toBe(10 * MIN);
    expect(t.runs[2].status).toBe('pending');
    expect(timerFromRecord([{ startedAt: null, actualMinutes: 5 }], T0).current).toBe(1);
  });
});
