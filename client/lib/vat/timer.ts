// The make-day timer as a pure state machine over a sequence of timed items (the journal's
// steps, or the stages of the press schedule). Elapsed time is always worked out from
// timestamps (when a run started, what it had gathered before a pause), never by counting
// ticks, so a reload, a sleeping phone or a throttled background tab cannot make it drift.
// Every action takes `now` (ms since the epoch) and returns a new state; an action that
// does not apply to the current item returns the state unchanged.

export type RunStatus = 'pending' | 'running' | 'paused' | 'done' | 'skipped';

/** One item's run: when it first started, what it had gathered, and whether it runs now. */
export interface ItemRun {
  status: RunStatus;
  /** first start, ms since the epoch; kept across pauses */
  startedAt: number | null;
  /** start of the current running stretch, ms; null unless running */
  runningSince: number | null;
  /** time gathered by earlier stretches, ms */
  accumulatedMs: number;
  /** when the item was finished or skipped, ms */
  endedAt: number | null;
}

export interface TimerState {
  /** index of the item the maker is on; equals runs.length when the sequence is over */
  current: number;
  runs: ItemRun[];
}

export type TimerAction = 'start' | 'pause' | 'resume' | 'finish' | 'skip' | 'back';

const pendingRun = (): ItemRun => ({
  status: 'pending',
  startedAt: null,
  runningSince: null,
  accumulatedMs: 0,
  endedAt: null,
});

/** Returns a fresh timer for `count` items, on the first one, nothing started. */
export function createTimer(count: number): TimerState {
  return { current: 0, runs: Array.from({ length: Math.max(0, count) }, pendingRun) };
}

/** Returns the time an item has run, ms, as of `now` (gathered stretches plus the open one). */
export function elapsedMs(run: ItemRun, now: number): number {
  const open = run.status === 'running' && run.runningSince !== null ? now - run.runningSince : 0;
  return run.accumulatedMs + Math.max(0, open);
}

/** Returns the current item's run, or null when the sequence is over. */
export function currentRun(state: TimerState): ItemRun | null {
  return state.runs[state.current] ?? null;
}

/** True when every item is done or skipped. */
export function isComplete(state: TimerState): boolean {
  return state.current >= state.runs.length;
}

/** True when the current item is running (a timer is live and the screen should stay awake). */
export function isRunning(state: TimerState): boolean {
  return currentRun(state)?.status === 'running';
}

/** Whether an action applies to the state as it is (drives which buttons are shown). */
export function can(state: TimerState, action: TimerAction): boolean {
  const run = currentRun(state);
  switch (action) {
    case 'start':
      return run?.status === 'pending';
    case 'pause':
      return run?.status === 'running';
    case 'resume':
      return run?.status === 'paused';
    case 'finish':
      return run?.status === 'running' || run?.status === 'paused';
    case 'skip':
      return run !== null;
    case 'back':
      // Only from an item not yet started, so going back never loses time already run.
      return state.current > 0 && (run === null || run.status === 'pending');
  }
}

function withRun(state: TimerState, index: number, run: ItemRun, current = state.current) {
  const runs = state.runs.slice();
  runs[index] = run;
  return { current, runs };
}

/** Starts the current item (pending → running). */
export function start(state: TimerState, now: number): TimerState {
  if (!can(state, 'start')) return state;
  const run = currentRun(state)!;
  return withRun(state, state.current, {
    ...run,
    status: 'running',
    startedAt: now,
    runningSince: now,
  });
}

/** Pauses the running item, banking the stretch since it last started. */
export function pause(state: TimerState, now: number): TimerState {
  if (!can(state, 'pause')) return state;
  const run = currentRun(state)!;
  return withRun(state, state.current, {
    ...run,
    status: 'paused',
    accumulatedMs: elapsedMs(run, now),
    runningSince: null,
  });
}

/** Resumes a paused item. */
export function resume(state: TimerState, now: number): TimerState {
  if (!can(state, 'resume')) return state;
  const run = currentRun(state)!;
  return withRun(state, state.current, { ...run, status: 'running', runningSince: now });
}

/** Finishes the running or paused item and moves to the next one. */
export function finish(state: TimerState, now: number): TimerState {
  if (!can(state, 'finish')) return state;
  const run = currentRun(state)!;
  return withRun(
    state,
    state.current,
    {
      ...run,
      status: 'done',
      accumulatedMs: elapsedMs(run, now),
      runningSince: null,
      endedAt: now,
    },
    state.current + 1,
  );
}

/** Skips the current item (started or not, keeping any time it ran) and moves on. */
export function skip(state: TimerState, now: number): TimerState {
  if (!can(state, 'skip')) return state;
  const run = currentRun(state)!;
  return withRun(
    state,
    state.current,
    {
      ...run,
      status: 'skipped',
      accumulatedMs: elapsedMs(run, now),
      runningSince: null,
      endedAt: now,
    },
    state.current + 1,
  );
}

/**
 * Goes back to the previous item (a mistaken Skip or Finish with wet hands). It reopens
 * paused if it had run, so its time is kept and the maker resumes it; pending otherwise.
 */
export function back(state: TimerState): TimerState {
  if (!can(state, 'back')) return state;
  const index = state.current - 1;
  const run = state.runs[index];
  return withRun(
    state,
    index,
    {
      ...run,
      status: run.startedAt === null ? 'pending' : 'paused',
      runningSince: null,
      endedAt: null,
    },
    index,
  );
}

/** Applies an action by name. */
export function apply(state: TimerState, action: TimerAction, now: number): TimerState {
  switch (action) {
    case 'start':
      return start(state, now);
    case 'pause':
      return pause(state, now);
    case 'resume':
      return resume(state, now);
    case 'finish':
      return finish(state, now);
    case 'skip':
      return skip(state, now);
    case 'back':
      return back(state);
  }
}

/** Remaining time of an item with a target, ms; negative when it runs over. */
export function remainingMs(run: ItemRun, targetMinutes: number | null, now: number) {
  if (targetMinutes === null) return null;
  return targetMinutes * 60_000 - elapsedMs(run, now);
}

/**
 * Fits a stored timer to a sequence that may have changed length since (the journal was
 * edited): extra runs are dropped, new items start pending, the position is kept in range.
 */
export function fitTimer(state: TimerState, count: number): TimerState {
  if (state.runs.length === count) return state;
  const runs = state.runs.slice(0, count);
  while (runs.length < count) runs.push(pendingRun());
  return { current: Math.min(state.current, count), runs };
}

/** What a journal's steps already record about a make (another phone, an earlier session). */
export interface RecordedStep {
  startedAt: string | null;
  actualMinutes: number | null;
}

/**
 * Rebuilds a timer from what the journal recorded: steps with actual minutes are done, the
 * first one started without minutes is running since it started, and the maker is on the
 * first step that is not done.
 */
export function timerFromRecord(steps: readonly RecordedStep[], now: number): TimerState {
  const state = createTimer(steps.length);
  let current = steps.length;
  steps.forEach((step, i) => {
    const startedAt = step.startedAt ? Date.parse(step.startedAt) : null;
    const started = startedAt !== null && Number.isFinite(startedAt) ? startedAt : null;
    if (step.actualMinutes !== null) {
      const ms = step.actualMinutes * 60_000;
      state.runs[i] = {
        status: 'done',
        startedAt: started,
        runningSince: null,
        accumulatedMs: ms,
        endedAt: started !== null ? started + ms : null,
      };
    } else if (current === steps.length) {
      current = i;
      if (started !== null) {
        state.runs[i] = {
          status: 'running',
          startedAt: started,
          runningSince: Math.min(started, now),
          accumulatedMs: 0,
          endedAt: null,
        };
      }
    }
  });
  return { current, runs: state.runs };
}
