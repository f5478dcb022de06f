import { onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';

/**
 * Keeps the screen on while `active` is true, with the Screen Wake Lock API where the browser
 * has it. The browser drops the lock whenever the page is hidden, so it is asked for again
 * when the page is shown; it is released when `active` turns false and when the caller's
 * scope ends. Returns whether the API exists and whether the lock is held now.
 */
export function useWakeLock(active: MaybeRefOrGetter<boolean>) {
  const supported = typeof navigator !== 'undefined' && 'wakeLock' in navigator;
  const held = ref(false);
  let sentinel: WakeLockSentinel | null = null;
  let requesting: Promise<void> | null = null;
  let disposed = false;

  const wanted = () => !disposed && toValue(active) && document.visibilityState === 'visible';

  async function acquire(): Promise<void> {
    if (!supported || sentinel || requesting || !wanted()) return;
    requesting = (async () => {
      try {
        const lock = await navigator.wakeLock.request('screen');
        // Turned off (or the page left) while the browser was answering.
        if (!wanted()) {
          await lock.release();
          return;
        }
        sentinel = lock;
        held.value = true;
        lock.addEventListener('release', () => {
          if (sentinel === lock) sentinel = null;
          held.value = sentinel !== null;
        });
      } catch {
        // Refused (battery saver, no user gesture yet, a policy): the page works without it.
        held.value = false;
      } finally {
        requesting = null;
      }
    })();
    return requesting;
  }

  async function release(): Promise<void> {
    const lock = sentinel;
    sentinel = null;
    held.value = false;
    if (lock && !lock.released) {
      try {
        await lock.release();
      } catch {
        // Already gone.
      }
    }
  }

  const onVisibility = () => {
    if (document.visibilityState === 'visible') void acquire();
  };
  document.addEventListener('visibilitychange', onVisibility);
  watch(
    () => toValue(active),
    (on) => void (on ? acquire() : release()),
    { immediate: true },
  );
  onScopeDispose(() => {
    disposed = true;
    document.removeEventListener('visibilitychange', onVisibility);
    void release();
  });

  return { supported, held, acquire, release };
}
