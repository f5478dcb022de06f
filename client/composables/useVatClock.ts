import { onScopeDispose, ref } from 'vue';

/**
 * The current time as a ref, ticking every second (ms since the epoch). Timers read elapsed
 * time from timestamps, so the tick only repaints; it also jumps right on when a sleeping
 * phone shows the page again.
 */
export function useVatClock(tickMs = 1000) {
  const now = ref(Date.now());
  const tick = () => (now.value = Date.now());
  const timer = setInterval(tick, tickMs);
  const onVisible = () => {
    if (document.visibilityState === 'visible') tick();
  };
  document.addEventListener('visibilitychange', onVisible);
  onScopeDispose(() => {
    clearInterval(timer);
    document.removeEventListener('visibilitychange', onVisible);
  });
  return { now, tick };
}
