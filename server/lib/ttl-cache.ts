/**
 * A small in-process cache of computed answers that are fresh for `ttlMs`, with at most
 * `maxEntries` kept (the least recently used go first) and one computation per key at a
 * time: concurrent misses wait for the same promise, so a burst runs the query once, not
 * once per request. For a while after it goes stale (up to 4 × ttlMs) an answer is still
 * served at once while one refresh runs behind it, so a slow query never stalls readers
 * every ttlMs. Each app server has its own; `clear()` drops everything this server holds
 * after one of its own writes.
 */
export class TtlCache<V> {
  private readonly entries = new Map<string, { value: V; expires: number }>();
  private readonly pending = new Map<string, Promise<V>>();
  private generation = 0;

  constructor(
    private readonly ttlMs: number,
    private readonly maxEntries = 500,
  ) {}

  get enabled(): boolean {
    return this.ttlMs > 0;
  }

  /** The cached value for key, or the loader's (stored unless the cache was cleared meanwhile). */
  async getOrLoad(key: string, load: () => Promise<V>): Promise<V> {
    if (!this.enabled) return load();
    const now = Date.now();
    const hit = this.entries.get(key);
    if (hit && hit.expires > now) {
      this.entries.delete(key);
      this.entries.set(key, hit); // most recently used last
      return hit.value;
    }
    const waiting = this.pending.get(key);
    if (hit && hit.expires + 3 * this.ttlMs > now) {
      // Stale but recent: answer now, refresh once in the background.
      if (!waiting) this.refresh(key, load).catch(() => {});
      return hit.value;
    }
    if (waiting) return waiting;
    return this.refresh(key, load);
  }

  private refresh(key: string, load: () => Promise<V>): Promise<V> {
    const generation = this.generation;
    const promise = load()
      .then((value) => {
        if (generation === this.generation) {
          this.entries.delete(key);
          this.entries.set(key, { value, expires: Date.now() + this.ttlMs });
          while (this.entries.size > this.maxEntries) {
            this.entries.delete(this.entries.keys().next().value as string);
          }
        }
        return value;
      })
      .finally(() => {
        if (this.pending.get(key) === promise) this.pending.delete(key);
      });
    this.pending.set(key, promise);
    return promise;
  }

  /** Forgets every entry (and any answer still being computed). */
  clear(): void {
    this.generation += 1;
    this.entries.clear();
    this.pending.clear();
  }
}
