// @vitest-environment happy-dom
import { afterEach, beforeEach, describe, expect, it, vi } from 'vitest';
import { ApiError } from '../../../client/api/http';
import {
  Outbox,
  backoffMs,
  classifyFailure,
  countWaiting,
  enqueueDocument,
  enqueueReading,
  nextSend,
  webStorageStore,
  type OutboxItem,
  type OutboxTransport,
} from '../../../client/lib/vat/outbox';
import { makeReading, type VatReadingInput } from '../../../client/lib/vat/readings';
import type { JournalInput } from '../../../shared/schemas/journal';

const T0 = Date.parse('2026-03-14T09:00:00Z');

function reading(n: number, tempC = 30 + n): VatReadingInput {
  const made = makeReading(
    { tempC, ph: null, stepIndex: 0 },
    T0 + n * 60_000,
    `00000000-0000-4000-8000-${String(n).padStart(12, '0')}`,
  );
  if (!made.ok) throw new Error(made.message);
  return made.reading;
}

const doc = (title: string) => ({ title }) as unknown as JournalInput;

/** A pretend server: stores readings once by id, like the real routes, and can fail on cue. */
function fakeServer() {
  const stored = new Map<string, VatReadingInput>();
  const documents: { journalId: number; title: string }[] = [];
  const calls: string[] = [];
  let online = true;
  // Stores the next send, then loses the answer (the connection dropped on the way back).
  let loseNextAnswer = false;
  let rejectNext: number | null = null;
  const transport: OutboxTransport = {
    async sendReadings(journalId, readings) {
      calls.push(`readings:${journalId}:${readings.map((r) => r.tempC).join(',')}`);
      if (!online) throw new ApiError(0, 'NETWORK', 'offline');
      if (rejectNext !== null) {
        const status = rejectNext;
        rejectNext = null;
        throw new ApiError(status, 'VALIDATION', 'refused');
      }
      for (const r of readings) if (!stored.has(r.id)) stored.set(r.id, r);
      if (loseNextAnswer) {
        loseNextAnswer = false;
        throw new ApiError(0, 'NETWORK', 'lost on the way back');
      }
      return { stored: readings.length };
    },
    async sendDocument(journalId, document) {
      calls.push(`document:${journalId}:${document.title}`);
      if (!online) throw new ApiError(0, 'NETWORK', 'offline');
      documents.push({ journalId, title: document.title });
      return { id: journalId };
    },
  };
  return {
    stored,
    documents,
    calls,
    transport,
    setOnline: (v: boolean) => (online = v),
    loseNextAnswer: () => (loseNextAnswer = true),
    rejectNext: (status: number) => (rejectNext = status),
  };
}

describe('the queue as pure functions', () => {
  it('queues a reading once by its id', () => {
    let items: OutboxItem[] = [];
    items = enqueueReading(items, 1, reading(1), T0);
    items = enqueueReading(items, 1, reading(1), T0 + 5);
    items = enqueueReading(items, 1, reading(2), T0 + 9);
    expect(items.map((i) => i.key)).toEqual([
      `reading:${reading(1).id}`,
      `reading:${reading(2).id}`,
    ]);
  });

  it('coalesces queued whole-document updates of a journal to the latest', () => {
    let items: OutboxItem[] = [];
    items = enqueueDocument(items, 1, doc('first'), T0);
    items = enqueueReading(items, 1, reading(1), T0);
    items = enqueueDocument(items, 2, doc('other journal'), T0);
    items = enqueueDocument(items, 1, doc('second'), T0 + 1);
    items = enqueueDocument(items, 1, doc('third'), T0 + 2);
    const docs = items.filter((i) => i.kind === 'document');
    expect(docs.map((d) => (d.kind === 'document' ? d.document.title : ''))).toEqual([
      'other journal',
      'third',
    ]);
    expect(countWaiting(items)).toEqual({ readings: 1, updates: 2 });
    expect(countWaiting(items, 1)).toEqual({ readings: 1, updates: 1 });
  });

  it('sends consecutive readings of one journal as one batch, in order', () => {
    let items: OutboxItem[] = [];
    items = enqueueReading(items, 1, reading(1), T0);
    items = enqueueReading(items, 1, reading(2), T0);
    items = enqueueReading(items, 2, reading(3), T0);
    const first = nextSend(items)!;
    expect(first.kind).toBe('readings');
    expect(first.kind === 'readings' && first.readings.map((r) => r.tempC)).toEqual([31, 32]);
    expect(nextSend(items, 1)!.keys).toHaveLength(1);
    expect(nextSend([])).toBeNull();
  });

  it('backs off doubling from a second up to a minute', () => {
    expect([1, 2, 3, 4, 5, 6, 7, 8, 50].map((n) => backoffMs(n))).toEqual([
      1000, 2000, 4000, 8000, 16000, 32000, 60000, 60000, 60000,
    ]);
  });

  it('retries a lost connection and server trouble, waits for sign-in, gives up on a refusal', () => {
    expect(classifyFailure(new ApiError(0, 'NETWORK', ''))).toBe('retry');
    expect(classifyFailure(new ApiError(503, 'DOWN', ''))).toBe('retry');
    expect(classifyFailure(new ApiError(429, 'SLOW', ''))).toBe('retry');
    expect(classifyFailure(new TypeError('Failed to fetch'))).toBe('retry');
    expect(classifyFailure(new ApiError(401, 'AUTH', ''))).toBe('signed-out');
    expect(classifyFailure(new ApiError(400, 'VALIDATION', ''))).toBe('rejected');
    expect(classifyFailure(new ApiError(404, 'JOURNAL_NOT_FOUND', ''))).toBe('rejected');
  });
});

describe('the queue runner', () => {
  beforeEach(() => {
    vi.useFakeTimers();
    vi.setSystemTime(T0);
    localStorage.clear();
  });
  afterEach(() => vi.useRealTimers());

  function setUp(server = fakeServer(), online = () => true) {
    const store = webStorageStore(localStorage, 'test:outbox');
    const sent: string[] = [];
    const outbox = new Outbox({
      store,
      transport: server.transport,
      isOnline: online,
      onSent: (s) => sent.push(s.kind),
    });
    return { server, store, outbox, sent };
  }

  it('keeps readings logged while offline and sends them in order when back online', async () => {
    let browserOnline = false;
    const server = fakeServer();
    const { outbox, store } = setUp(server, () => browserOnline);
    await outbox.enqueueReading(1, reading(1));
    await outbox.enqueueReading(1, reading(2));
    await outbox.enqueueReading(1, reading(3));
    expect(server.calls).toEqual([]);
    expect(outbox.snapshot().status).toBe('offline');
    expect(store.load()).toHaveLength(3);
    // The queue is in localStorage: a reload would find it.
    expect(JSON.parse(localStorage.getItem('test:outbox')!)).toHaveLength(3);

    browserOnline = true;
    await outbox.online();
    expect(server.calls).toEqual(['readings:1:31,32,33']);
    expect([...server.stored.values()].map((r) => r.tempC)).toEqual([31, 32, 33]);
    expect(store.load()).toEqual([]);
    expect(outbox.snapshot().status).toBe('idle');
  });

  it('retries with backoff after a failed send, and the replay does not duplicate', async () => {
    const server = fakeServer();
    const { outbox, store } = setUp(server);
    server.loseNextAnswer();
    await outbox.enqueueReading(1, reading(1));
    // The server stored it but the answer was lost: it stays queued and a retry is planned.
    expect(server.stored.size).toBe(1);
    expect(store.load()).toHaveLength(1);
    expect(outbox.snapshot()).toMatchObject({ status: 'waiting', attempt: 1 });
    expect(outbox.snapshot().nextRetryAt).toBe(T0 + 1000);

    await vi.advanceTimersByTimeAsync(1000);
    expect(server.calls).toHaveLength(2);
    expect(server.stored.size).toBe(1);
    expect(store.load()).toEqual([]);
    expect(outbox.snapshot().status).toBe('idle');
  });

  it('waits longer after each failure until the connection is back', async () => {
    const server = fakeServer();
    server.setOnline(false); // navigator.onLine says yes, but nothing gets through
    const { outbox } = setUp(server);
    await outbox.enqueueReading(1, reading(1));
    expect(server.calls).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(1000);
    expect(server.calls).toHaveLength(2);
    await vi.advanceTimersByTimeAsync(1999);
    expect(server.calls).toHaveLength(2);
    await vi.advanceTimersByTimeAsync(1);
    expect(server.calls).toHaveLength(3);
    expect(outbox.snapshot().attempt).toBe(3);
    // The 'online' event sends at once instead of waiting out the 4 s.
    server.setOnline(true);
    await outbox.online();
    expect(server.calls).toHaveLength(4);
    expect(server.stored.size).toBe(1);
    expect(outbox.snapshot()).toMatchObject({ status: 'idle', attempt: 0 });
  });

  it('sends only the latest of the journal updates queued while offline', async () => {
    let browserOnline = false;
    const server = fakeServer();
    const { outbox } = setUp(server, () => browserOnline);
    await outbox.enqueueDocument(5, doc('step 1 started'));
    await outbox.enqueueReading(5, reading(1));
    await outbox.enqueueDocument(5, doc('step 1 finished'));
    await outbox.enqueueDocument(5, doc('step 2 started'));
    await outbox.enqueueReading(5, reading(2));
    browserOnline = true;
    await outbox.online();
    // In the order queued, the older updates gone: the latest update took the last one's place.
    expect(server.calls).toEqual(['readings:5:31', 'document:5:step 2 started', 'readings:5:32']);
    expect(server.documents).toHaveLength(1);
  });

  it('picks up what is queued while a send is on its way', async () => {
    const server = fakeServer();
    const { outbox, store } = setUp(server);
    const first = outbox.enqueueReading(1, reading(1));
    const second = outbox.enqueueReading(1, reading(2));
    await Promise.all([first, second]);
    expect(server.stored.size).toBe(2);
    expect(store.load()).toEqual([]);
  });

  it('drops a reading the server refuses without holding back the others', async () => {
    let browserOnline = false;
    const server = fakeServer();
    const rejected: string[] = [];
    const outbox = new Outbox({
      store: webStorageStore(localStorage, 'test:outbox'),
      transport: server.transport,
      isOnline: () => browserOnline,
      onRejected: (s) => rejected.push(...s.keys),
    });
    await outbox.enqueueReading(1, reading(1));
    await outbox.enqueueReading(1, reading(2));
    browserOnline = true;
    server.rejectNext(400); // the batch is refused, so each reading is tried on its own
    await outbox.online();
    expect(server.calls).toEqual(['readings:1:31,32', 'readings:1:31', 'readings:1:32']);
    expect(server.stored.size).toBe(2);
    expect(rejected).toEqual([]);

    server.rejectNext(422);
    await outbox.enqueueReading(1, reading(3));
    expect(rejected).toEqual([`reading:${reading(3).id}`]);
    expect(outbox.snapshot().items).toEqual([]);
  });

  it('keeps the queue when the session has ended, until the maker signs in again', async () => {
    const server = fakeServer();
    const { outbox, store } = setUp(server);
    server.transport.sendReadings = async () => {
      throw new ApiError(401, 'AUTH_REQUIRED', 'Sign in');
    };
    await outbox.enqueueReading(1, reading(1));
    expect(outbox.snapshot().status).toBe('signed-out');
    expect(store.load()).toHaveLength(1);
    await vi.advanceTimersByTimeAsync(120_000);
    expect(store.load()).toHaveLength(1);
  });

  it('keeps the queue in memory when the browser refuses to store it', () => {
    const full = {
      getItem: () => null,
      setItem: () => {
        throw new DOMException('full', 'QuotaExceededError');
      },
    } as unknown as Storage;
    const store = webStorageStore(full, 'k');
    store.save(enqueueReading([], 1, reading(1), T0));
    expect(store.load()).toHaveLength(1);
  });

  it('stops its retry timer when the page goes away', async () => {
    const server = fakeServer();
    server.setOnline(false);
    const { outbox } = setUp(server);
    await outbox.enqueueReading(1, reading(1));
    outbox.dispose();
    await vi.advanceTimersByTimeAsync(60_000);
    expect(server.calls).toHaveLength(1);
  });
});

describe('a journal update refused because the journal changed elsewhere (409)', () => {
  const changed = (current: unknown) =>
    new ApiError(409, 'JOURNAL_CHANGED', 'changed elsewhere', {}, { current });

  it('is held with the server’s journal, kept across a reload, and readings still go out', async () => {
    const storage = new Map<string, string>();
    const store = webStorageStore(
      {
        getItem: (k: string) => storage.get(k) ?? null,
        setItem: (k: string, v: string) => void storage.set(k, v),
      } as unknown as Storage,
      'q',
    );
    const sentVersions: (string | null)[] = [];
    const readingsSent: string[] = [];
    let refuse = true;
    const conflicts: string[] = [];
    const outbox = new Outbox({
      store,
      transport: {
        async sendReadings(_id, readings) {
          readingsSent.push(...readings.map((r) => r.id));
          return {};
        },
        async sendDocument(_id, document, baseVersion) {
          sentVersions.push(baseVersion);
          if (refuse) throw changed({ version: 'v2', title: 'From the laptop' });
          return { version: 'v3', title: document.title };
        },
      },
      currentOf: (e) => (e as ApiError).details.current,
      acknowledged: (r) => ({ version: (r as { version: string }).version, document: doc('ack') }),
      onConflict: (send) => conflicts.push(send.kind),
    });
    await outbox.enqueueDocument(7, doc('vat times'), { version: 'v1', document: doc('base') });
    await outbox.enqueueReading(7, reading(1));
    expect(sentVersions).toEqual(['v1']);
    expect(conflicts).toEqual(['document']);
    expect(readingsSent).toEqual([reading(1).id]);
    // Still there, held, with what the server said; a reload reads the same.
    const [held] = webStorageStore(
      { getItem: (k: string) => storage.get(k) ?? null } as unknown as Storage,
      'q',
    ).load();
    expect(held).toMatchObject({
      kind: 'document',
      document: { title: 'vat times' },
      base: { version: 'v1' },
      conflict: { current: { version: 'v2', title: 'From the laptop' } },
    });
    // A newer vat change while held stays held, on the same base.
    await outbox.enqueueDocument(7, doc('vat times 2'), { version: 'v9', document: doc('x') });
    expect(sentVersions).toEqual(['v1']);
    const [again] = store.load();
    expect(again).toMatchObject({
      base: { version: 'v1' },
      conflict: { current: { version: 'v2' } },
    });

    // Merged on the page: sent on the new version, and gone from the queue once accepted.
    refuse = false;
    await outbox.resolveDocument(again.key, doc('merged'), { version: 'v2', document: doc('l') });
    expect(sentVersions).toEqual(['v1', 'v2']);
    expect(store.load()).toEqual([]);
  });

  it('rebases an update queued while the one before it was being sent', async () => {
    let items: OutboxItem[] = [];
    const store = { load: () => items.slice(), save: (next: OutboxItem[]) => (items = next) };
    const versions: (string | null)[] = [];
    let release: () => void = () => undefined;
    const outbox = new Outbox({
      store,
      transport: {
        sendReadings: async () => ({}),
        async sendDocument(_id, document, baseVersion) {
          versions.push(baseVersion);
          if (document.title === 'first') await new Promise<void>((r) => (release = r));
          return { version: `after-${document.title}` };
        },
      },
      acknowledged: (r) => ({ version: (r as { version: string }).version, document: doc('ack') }),
    });
    const first = outbox.enqueueDocument(3, doc('first'), { version: 'v1', document: doc('b') });
    await Promise.resolve();
    void outbox.enqueueDocument(3, doc('second'), { version: 'v1', document: doc('b') });
    release();
    await first;
    await outbox.flush();
    expect(versions).toEqual(['v1', 'after-first']);
  });

  it('is sorted as a conflict only for JOURNAL_CHANGED', () => {
    expect(classifyFailure(changed(null))).toBe('conflict');
    expect(classifyFailure(new ApiError(409, 'READING_ID_TAKEN', 'x'))).toBe('rejected');
  });
});
