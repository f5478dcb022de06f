import { computed, watch, type Ref } from 'vue';
import {
  apply,
  can,
  currentRun,
  elapsedMs,
  isComplete,
  isRunning,
  remainingMs,
  type TimerAction,
  type TimerState,
} from '../lib/vat/timer';

type Options = {
  /** the ticking clock, ms (useVatClock) */
  now: Ref<number>;
  /** each item's target time, minutes, or null when it has none */
  targets: () => readonly (number | null)[];
  /** after an action changed the timer: write it back, start what follows */
  onAction?: (action: TimerAction, next: TimerState, previous: TimerState, at: number) => void;
  /** the running item reached its target time */
  onTimeUp?: () => void;
};

/**
 * A make timer (steps or press stages) over a state ref the caller persists: what runs now,
 * its elapsed and remaining time, which actions apply, and `act()` to take one. Elapsed
 * time comes from timestamps (client/lib/vat/timer.ts), so it survives reloads and sleep.
 */
export function useMakeTimer(timer: Ref<TimerState>, options: Options) {
  const index = computed(() => timer.value.current);
  const run = computed(() => currentRun(timer.value));
  const target = computed(() => options.targets()[index.value] ?? null);
  const elapsed = computed(() => (run.value ? elapsedMs(run.value, options.now.value) : 0));
  const remaining = computed(() =>
    run.value ? remainingMs(run.value, target.value, options.now.value) : null,
  );
  const running = computed(() => isRunning(timer.value));
  const complete = computed(() => isComplete(timer.value));
  const timeUp = computed(() => running.value && remaining.value !== null && remaining.value <= 0);
  const allowed = computed(
    () =>
      Object.fromEntries(
        (['start', 'pause', 'resume', 'finish', 'skip', 'back'] as const).map((a) => [
          a,
          can(timer.value, a),
        ]),
      ) as Record<TimerAction, boolean>,
  );

  watch(timeUp, (up, before) => {
    if (up && !before) options.onTimeUp?.();
  });

  /** Takes an action now; returns false when it does not apply. */
  function act(action: TimerAction): boolean {
    const at = Date.now();
    const previous = timer.value;
    const next = apply(previous, action, at);
    if (next === previous) return false;
    timer.value = next;
    options.onAction?.(action, next, previous, at);
    return true;
  }

  return {
    state: timer,
    index,
    run,
    target,
    elapsed,
    remaining,
    running,
    complete,
    timeUp,
    allowed,
    act,
  };
}

export type MakeTimer = ReturnType<typeof useMakeTimer>;
