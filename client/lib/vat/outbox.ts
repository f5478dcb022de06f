// The vat's outbox: readings and journal updates wait here, in the browser, until the server
// has them. Nothing the maker logs is lost when the connection drops or the page reloads,
// and nothing is stored twice when a send is retried:
// - a reading carries a client-made UUID and the server stores an id once (201, then 200 on
//   a replay), so resending after a lost answer is harmless;
// - a journal update replaces the whole document, so only the latest one matters: queuing a
//   new one drops the older ones for the same journal (coalescing).
// Items go out in the order they were queued; consecutive readings of one journal go as one
// batch. The state lives in the store (localStorage in the app), read afresh on every step,
// so two tabs or a reload mid-send see the same queue.

import type { JournalInput } from '@shared/schemas/journal';
import type { VatReadingInput } from './readings';

export type OutboxItem =
  | {
      kind: 'reading';
      key: string;
      journalId: number;
      reading: VatReadingInput;
      queuedAt: number;
    }
  | {
      kind: 'document';
      key: string;
      journalId: number;
      document: JournalInput;
      queuedAt: number;
    };

/** One send: a batch of readings of one journal, or one whole-document update. */
export type OutboxSend =
  | { kind: 'readings'; journalId: number; keys: string[]; readings: VatReadingInput[] }
  | { kind: 'document'; journalId: number; keys: string[]; document: JournalInput };

/** Queues a reading; a reading already queued (same id) is not queued twice. */
export function enqueueReading(
  items: readonly OutboxItem[],
  journalId: number,
  reading: VatReadingInput,
  now: number,
): OutboxItem[] {
  const key = `reading:${reading.id}`;
  if (items.some((item) => item.key === key)) return items.slice();
  return [...items, { kind: 'reading', key, journalId, reading, queuedAt: now }];
}

let documentSeq = 0;

/** Queues a whole-document update, dropping older queued updates of the same journal. */
export function enqueueDocument(
  items: readonly OutboxItem[],
  journalId: number,
  document: JournalInput,
  now: number,
): OutboxItem[] {
  documentSeq += 1;
  const key = `document:${journalId}:${now}:${documentSeq}:${Math.random().toString(36).slice(2)}`;
  const kept = items.filter((item) => !(item.kind === 'document' && item.journalId === journalId));
  return [...kept, { kind: 'document', key, journalId, document, queuedAt: now }];
}

/** Returns the next send: the first item, with the readings of its journal that follow it. */
export function nextSend(items: readonly OutboxItem[], maxBatch = 50): OutboxSend | null {
  const first = items[0];
  if (!first) return null;
  if (first.kind === 'document') {
    return {
      kind: 'document',
      journalId: first.journalId,
      keys: [first.key],
      document: first.document,
    };
  }
  const batch: Extract<OutboxItem, { kind: 'reading' }>[] = [];
  for (const item of items) {
    if (item.kind !== 'reading' || item.journalId !== first.journalId) break;
    if (batch.length >= Math.max(1, maxBatch)) break;
    batch.push(item);
  }
  return {
    kind: 'readings',
    journalId: first.journalId,
    keys: batch.map((b) => b.key),
    readings: batch.map((b) => b.reading),
  };
}

/** Returns the queue without the items sent. */
export function removeKeys(items: readonly OutboxItem[], keys: readonly string[]): OutboxItem[] {
  const gone = new Set(keys);
  return items.filter((item) => !gone.has(item.key));
}

/** Counts what waits, for the banner: readings and journal updates, optionally of one journal. */
export function countWaiting(items: readonly OutboxItem[], journalId?: number) {
  let readings = 0;
  let updates = 0;
  for (const item of items) {
    if (journalId !== undefined && item.journalId !== journalId) continue;
    if (item.kind === 'reading') readings += 1;
    else updates += 1;
  }
  return { readings, updates };
}

/** Wait before retry `attempt` (1, 2, …), ms: doubling from 1 s, capped at a minute. */
export function backoffMs(attempt: number, baseMs = 1000, maxMs = 60_000): number {
  const n = Math.max(1, Math.floor(attempt));
  return Math.min(maxMs, baseMs * 2 ** Math.min(n - 1, 30));
}

/** How a failed send is handled: try again later, wait for sign-in, or give the item up. */
export type FailureKind = 'retry' | 'signed-out' | 'rejected';

/** Sorts a send failure by its HTTP status (0 is a lost connection, as client/api/http.ts). */
export function classifyFailure(error: unknown): FailureKind {
  const status =
    typeof error === 'object' && error !== null && 'status' in error
      ? Number((error as { status: unknown }).status)
      : NaN;
  // Anything that is not a clear answer from the server is kept and retried: losing a
  // reading is worse than trying once more.
  if (!Number.isFinite(status) || status === 0) return 'retry';
  if (status === 401) return 'signed-out';
  if (status === 408 || status === 429 || status >= 500) return 'retry';
  if (status >= 400) return 'rejected';
  return 'retry';
}

export interface OutboxStore {
  load(): OutboxItem[];
  save(items: OutboxItem[]): void;
}

export interface OutboxTransport {
  sendReadings(journalId: number, readings: VatReadingInput[]): Promise<unknown>;
  sendDocument(journalId: number, document: JournalInput): Promise<unknown>;
}

export type OutboxStatus = 'idle' | 'sending' | 'waiting' | 'offline' | 'signed-out';

export interface OutboxSnapshot {
  items: OutboxItem[];
  status: OutboxStatus;
  /** failed attempts in a row */
  attempt: number;
  /** when the next retry is planned, ms, while waiting */
  nextRetryAt: number | null;
  lastError: string | null;
}

export interface OutboxOptions {
  store: OutboxStore;
  transport: OutboxTransport;
  /** navigator.onLine in the app; a false answer skips sending until online() is called */
  isOnline?: () => boolean;
  backoff?: (attempt: number) => number;
  maxBatch?: number;
  now?: () => number;
  onChange?: (snapshot: OutboxSnapshot) => void;
  onSent?: (send: OutboxSend, result: unknown) => void;
  onRejected?: (send: OutboxSend, error: unknown) => void;
}

/** Runs the queue: sends in order, one at a time, retrying with backoff after a failure. */
export class Outbox {
  private status: OutboxStatus = 'idle';
  private attempt = 0;
  private nextRetryAt: number | null = null;
  private lastError: string | null = null;
  private retryTimer: ReturnType<typeof setTimeout> | null = null;
  private running: Promise<void> | null = null;
  private singles = 0;
  private disposed = false;

  constructor(private readonly options: OutboxOptions) {}

  private now() {
    return this.options.now?.() ?? Date.now();
  }

  /** What is queued and how sending goes. */
  snapshot(): OutboxSnapshot {
    return {
      items: this.options.store.load(),
      status: this.status,
      attempt: this.attempt,
      nextRetryAt: this.nextRetryAt,
      lastError: this.lastError,
    };
  }

  private changed(status?: OutboxStatus) {
    if (status) this.status = status;
    this.options.onChange?.(this.snapshot());
  }

  private update(fn: (items: OutboxItem[]) => OutboxItem[]) {
    this.options.store.save(fn(this.options.store.load()));
  }

  /** Queues a reading and starts sending. */
  enqueueReading(journalId: number, reading: VatReadingInput): Promise<void> {
    this.update((items) => enqueueReading(items, journalId, reading, this.now()));
    this.changed();
    return this.flush();
  }

  /** Queues the latest whole document of a journal and starts sending. */
  enqueueDocument(journalId: number, document: JournalInput): Promise<void> {
    this.update((items) => enqueueDocument(items, journalId, document, this.now()));
    this.changed();
    return this.flush();
  }

  /** Sends what is queued, in order, until the queue is empty or a send fails. */
  flush(): Promise<void> {
    if (this.disposed) return Promise.resolve();
    // The running loop reads the store before every send, so it picks up new items itself.
    if (this.running) return this.running;
    this.running = this.run().finally(() => {
      this.running = null;
    });
    return this.running;
  }

  /** The connection is back (or the maker asked to send now): retry at once. */
  online(): Promise<void> {
    this.clearRetry();
    this.attempt = 0;
    return this.flush();
  }

  /** The browser says it is offline: stop retrying until online() is called. */
  offline(): void {
    this.clearRetry();
    this.changed('offline');
  }

  /** Stops timers; the queue stays in the store for the next page. */
  dispose(): void {
    this.disposed = true;
    this.clearRetry();
  }

  private clearRetry() {
    if (this.retryTimer !== null) clearTimeout(this.retryTimer);
    this.retryTimer = null;
    this.nextRetryAt = null;
  }

  private scheduleRetry() {
    this.clearRetry();
    const wait = (this.options.backoff ?? backoffMs)(this.attempt);
    this.nextRetryAt = this.now() + wait;
    this.retryTimer = setTimeout(() => {
      this.retryTimer = null;
      this.nextRetryAt = null;
      void this.flush();
    }, wait);
  }

  private async run(): Promise<void> {
    this.clearRetry();
    for (;;) {
      if (this.disposed) return;
      if (this.options.isOnline && !this.options.isOnline()) {
        this.changed('offline');
        return;
      }
      const batch = this.singles > 0 ? 1 : (this.options.maxBatch ?? 50);
      const send = nextSend(this.options.store.load(), batch);
      if (!send) {
        this.attempt = 0;
        this.lastError = null;
        this.changed('idle');
        return;
      }
      this.changed('sending');
      let result: unknown;
      try {
        result =
          send.kind === 'readings'
            ? await this.options.transport.sendReadings(send.journalId, send.readings)
            : await this.options.transport.sendDocument(send.journalId, send.document);
      } catch (error) {
        this.lastError = error instanceof Error ? error.message : String(error);
        const kind = classifyFailure(error);
        if (kind === 'retry') {
          this.attempt += 1;
          this.scheduleRetry();
          this.changed('waiting');
          return;
        }
        if (kind === 'signed-out') {
          this.changed('signed-out');
          return;
        }
        if (send.keys.length > 1) {
          // One bad reading must not take the others with it: send these one by one.
          this.singles = send.keys.length;
          continue;
        }
        this.update((items) => removeKeys(items, send.keys));
        if (this.singles > 0) this.singles -= 1;
        this.options.onRejected?.(send, error);
        this.changed();
        continue;
      }
      this.update((items) => removeKeys(items, send.keys));
      if (this.singles > 0) this.singles -= 1;
      this.attempt = 0;
      this.lastError = null;
      this.options.onSent?.(send, result);
      this.changed();
    }
  }
}

/** A store over Web Storage (localStorage); keeps working in memory if the browser refuses. */
export function webStorageStore(storage: Storage | undefined, key: string): OutboxStore {
  let memory: OutboxItem[] | null = null;
  return {
    load() {
      if (memory) return memory.slice();
      try {
        const raw = storage?.getItem(key);
        const parsed: unknown = raw ? JSON.parse(raw) : [];
        return Array.isArray(parsed) ? (parsed as OutboxItem[]).filter(isItem) : [];
      } catch {
        return [];
      }
    },
    save(items) {
      try {
        if (!storage) throw new Error('no storage');
        storage.setItem(key, JSON.stringify(items));
        memory = null;
      } catch {
        // Private mode or a full quota: keep the queue for this page rather than lose it.
        memory = items.slice();
      }
    },
  };
}

function isItem(value: unknown): value is OutboxItem {
  if (typeof value !== 'object' || value === null) return false;
  const v = value as Record<string, unknown>;
  return (
    (v.kind === 'reading' || v.kind === 'document') &&
    typeof v.key === 'string' &&
    typeof v.journalId === 'number'
  );
}
