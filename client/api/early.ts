// Reads the first page needs, sent at start-up beside the route's chunk instead of after it
// has loaded and mounted (a round trip later). The view takes its read once; one nobody took
// within a few seconds is dropped, so a later visit to the same page reads afresh.

const KEEP_MS = 10_000;
const early = new Map<string, Promise<unknown>>();

/** Starts `load` now under `key`, for the view that will ask for it. */
export function startEarly(key: string, load: () => Promise<unknown>): void {
  const promise = load();
  // The view handles a failure when it takes the read; an untaken one must not be reported.
  promise.catch(() => undefined);
  early.set(key, promise);
  setTimeout(() => {
    if (early.get(key) === promise) early.delete(key);
  }, KEEP_MS);
}

/** The read started under `key`, once; undefined if none was (or it was taken already). */
export function takeEarly<T>(key: string): Promise<T> | undefined {
  const promise = early.get(key) as Promise<T> | undefined;
  early.delete(key);
  return promise;
}
