// The vat's outbox: readings and journal updates wait here, in the browser, until the server
// has them. Nothing the maker logs is lost when the connection drops or the page reloads,
// and nothing is stored twice when a send is retried:
// - a reading carries a client-made UUID and the server stores an id once (201, then 200 on
//   a replay), so resending after a lost answer is harmless;
// - a journal update replaces the whole document, so only the latest one matters: queuing a
//   new one drops the older ones for the same journal (coalescing);
// - a journal update carries the version of the journal it was made on (If-Match): when the
//   journal changed elsewhere meanwhile, the server answers 409 with the journal as it is
//   now, and the update stays in the queue, held, with that answer, until the page merges
//   it or the maker decides (nothing typed at the vat is dropped); readings still go out.
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
      /** The journal this update was made on (its version and document); absent in old queues. */
      base?: DocumentBase;
      /** Set when the server refused it (409): the journal as it was then; not sent while set. */
      conflict?: { current: unknown; at: number };
    };

/** A journal document as the server held it, with its version. */
export type DocumentBase = { version: string; document: JournalInput };

/** One send: a batch of readings of one journal, or one whole-document update. */
export type OutboxSend =
  | { kind: 'readings'; journalId: number; keys: string[]; readings: VatReadingInput[] }
  | {
      kind: 'document';
      journalId: number;
      keys: string[];
      document: JournalInput;
      baseVersion: string | null;
    };

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

type DocumentItem = Extract<OutboxItem, { kind: 'document' }>;

const documentOf = (items: readonly OutboxItem[], journalId: number) =>
  items.find((i): i is DocumentItem => i.kind === 'document' && i.journalId === journalId);

/**
 * Queues a whole-document update made on `base`, dropping older queued updates of the same
 * journal. An older one not yet accepted keeps its base (the server has not seen it) and its
 * held conflict, so the newer document is checked against the same version.
 */
export function enqueueDocument(
  items: readonly OutboxItem[],
  journalId: number,
  document: JournalInput,
  now: number,
  base?: DocumentBase,
): OutboxItem[] {
  documentSeq += 1;
  const key = `document:${journalId}:${now}:${documentSeq}:${Math.random().toString(36).slice(2)}`;
  const older = documentOf(items, journalId);
  const kept = items.filter((item) => !(item.kind === 'document' && item.journalId === journalId));
  const item: DocumentItem = { kind: 'document', key, journalId, document, queuedAt: now };
  const keptBase = older ? older.base : base;
  if (keptBase) item.base = keptBase;
  if (older?.conflict) item.conflict = older.conflict;
  return [...kept, item];
}

/** The queue with a journal's held update replaced (merged or decided), sendable again. */
export function resolveDocument(
  items: readonly OutboxItem[],
  key: string,
  document: JournalInput,
  base: DocumentBase,
): OutboxItem[] {
  return items.map((item) =>
    item.key === key && item.kind === 'document'
      ? {
          kind: 'document',
          key,
          journalId: item.journalId,
          document,
          queuedAt: item.queuedAt,
          base,
        }
      : item,
  );
}

/** After an update of a journal was accepted: the updates queued behind it build on the new version. */
export function rebaseDocuments(
  items: readonly OutboxItem[],
  journalId: number,
  from: string | null,
  to: DocumentBase,
): OutboxItem[] {
  return items.map((item) =>
    item.kind === 'document' &&
    item.journalId === journalId &&
    !item.conflict &&
    (item.base?.version ?? null) === from
      ? { ...item, base: to }
      : item,
  );
}

/** The queue with a refused update held, with what the server holds now. */
export function holdDocument(
  items: readonly OutboxItem[],
  key: string,
  current: unknown,
  now: number,
): OutboxItem[] {
  return items.map((item) =>
    item.key === key && item.kind === 'document'
      ? { ...item, conflict: { current, at: now } }
      : item,
  );
}

/**
 * Returns the next send: the first item, with the readings of its journal that follow it.
 * Held updates wait for the maker and are passed over.
 */
export function nextSend(all: readonly OutboxItem[], maxBatch = 50): OutboxSend | null {
  const items = all.filter((item) => !(item.kind === 'document' && item.conflict));
  const first = items[0];
  if (!first) return null;
  if (first.kind === 'document') {
    return {
      kind: 'document',
      journalId: first.journalId,
      keys: [first.key],
      document: first.document,
      baseVersion: first.base?.version ?? null,
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

/**
 * How a failed send is handled: try again later, wait for sign-in, hold it for the maker
 * (the journal changed elsewhere), or give the item up.
 */
export type FailureKind = 'retry' | 'signed-out' | 'conflict' | 'rejected';

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
  if (status === 409 && (error as { code?: unknown }).code === 'JOURNAL_CHANGED') return 'conflict';
  if (status >= 400) return 'rejected';
  return 'retry';
}

export interface OutboxStore {
  load(): OutboxItem[];
  save(items: OutboxItem[]): void;
}

export interface OutboxTransport {
  sendReadings(journalId: number, readings: VatReadingInput[]): Promise<unknown>;
  /** `baseVersion` null: an update queued before versions existed (sent as If-Match: *). */
  sendDocument(
    journalId: number,
    document: JournalInput,
    baseVersion: string | null,
  ): Promise<unknown>;
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
  /** What an accepted update's answer says the journal now is, to rebase the updates behind it. */
  acknowledged?: (result: unknown) => DocumentBase | null;
  /** The journal in a 409 answer (the error's current), stored with the held update. */
  currentOf?: (error: unknown) => unknown;
  /** An update was held: the journal changed elsewhere. */
  onConflict?: (send: OutboxSend, error: unknown) => void;
}

/** Runs the queue: sends in order, one at a time, retrying with backoff after a failure. */
export class Outbox {
  private status: OutboxStatus = 'idle';
  private attempt = 0;
  private nextRetryAt: number | null = null;
  private lastError: string | null = null;
  private retryTimer: ReturnType<typeof setTimeout> | null = null;
  private running: Promise<void> | null = null;
  private again = false;
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

  /** Queues the latest whole document of a journal, made on `base`, and starts sending. */
  enqueueDocument(journalId: number, document: JournalInput, base?: DocumentBase): Promise<void> {
    this.update((items) => enqueueDocument(items, journalId, document, this.now(), base));
    this.changed();
    return this.flush();
  }

  /** Replaces a held update with the merged or decided document on `base`, and sends it. */
  resolveDocument(key: string, document: JournalInput, base: DocumentBase): Promise<void> {
    this.update((items) => resolveDocument(items, key, document, base));
    this.changed();
    return this.flush();
  }

  /** Drops a held update (the maker took the journal as it is on the server). */
  dropDocument(key: string): void {
    this.update((items) => removeKeys(items, [key]));
    this.changed();
  }

  /** Sends what is queued, in order, until the queue is empty or a send fails. */
  flush(): Promise<void> {
    if (this.disposed) return Promise.resolve();
    // The running loop reads the store before every send, so it picks up new items itself;
    // one that arrives as the loop is finishing (after its last look) gets one more pass.
    if (this.running) {
      this.again = true;
      return this.running;
    }
    this.running = (async () => {
      do {
        this.again = false;
        await this.run();
      } while (this.again && !this.disposed);
    })().finally(() => {
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
            : await this.options.transport.sendDocument(
                send.journalId,
                send.document,
                send.baseVersion,
              );
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
        if (kind === 'conflict' && send.kind === 'document') {
          // Kept, and passed over until the page merges it or the maker decides.
          const current = this.options.currentOf?.(error) ?? null;
          this.update((items) => holdDocument(items, send.keys[0], current, this.now()));
          this.options.onConflict?.(send, error);
          this.changed();
          continue;
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
      if (send.kind === 'document') {
        const ack = this.options.acknowledged?.(result);
        if (ack)
          this.update((items) => rebaseDocuments(items, send.journalId, send.baseVersion, ack));
      }
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
