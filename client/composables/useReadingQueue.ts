import type { JournalInput } from '@shared/schemas/journal';
import { computed, onScopeDispose, shallowRef } from 'vue';
import type { JournalDto } from '@shared/types/journal';
import { changedJournalOf } from '../api/journals';
import { postReading, postReadings, putVatJournal } from '../api/vat';
import { documentFromDto } from '../lib/vat/document';
import {
  Outbox,
  webStorageStore,
  type DocumentBase,
  type OutboxItem,
  type OutboxSend,
  type OutboxSnapshot,
} from '../lib/vat/outbox';
import type { VatReadingInput } from '../lib/vat/readings';

/** Where the queue lives in the browser: one queue for all journals, so nothing is stranded. */
export const OUTBOX_KEY = 'rindwise:vat:outbox';

type Options = {
  onSent?: (send: OutboxSend, result: unknown) => void;
  onRejected?: (send: OutboxSend, error: unknown) => void;
  onConflict?: (send: OutboxSend, error: unknown) => void;
};

/** The journal an accepted update answered with, as the base of the updates behind it. */
function acknowledged(result: unknown): DocumentBase | null {
  const dto = result as JournalDto | null;
  if (!dto || typeof dto.version !== 'string' || !Array.isArray(dto.steps)) return null;
  return { version: dto.version, document: documentFromDto(dto) };
}

const browserStorage = (): Storage | undefined => {
  try {
    return window.localStorage;
  } catch {
    return undefined;
  }
};

/**
 * The vat's outbox in this page: readings and journal updates are queued in localStorage
 * and sent in order, at once when online, again on the 'online' event, and with backoff
 * after a failure. Returns the queue's state as refs and the ways to add to it.
 */
export function useReadingQueue(options: Options = {}) {
  const store = webStorageStore(browserStorage(), OUTBOX_KEY);
  const online = shallowRef(navigator.onLine);
  const snapshot = shallowRef<OutboxSnapshot>({
    items: store.load(),
    status: 'idle',
    attempt: 0,
    nextRetryAt: null,
    lastError: null,
  });
  const outbox = new Outbox({
    store,
    isOnline: () => navigator.onLine,
    transport: {
      sendReadings: (journalId, readings) =>
        readings.length === 1
          ? postReading(journalId, readings[0])
          : postReadings(journalId, readings),
      // An update queued before versions existed goes as it always did (If-Match: *).
      sendDocument: (journalId, document, baseVersion) =>
        putVatJournal(journalId, document, baseVersion ?? '*'),
    },
    onChange: (s) => (snapshot.value = s),
    onSent: options.onSent,
    onRejected: options.onRejected,
    onConflict: options.onConflict,
    acknowledged,
    currentOf: changedJournalOf,
  });

  const onOnline = () => {
    online.value = true;
    void outbox.online();
  };
  const onOffline = () => {
    online.value = false;
    outbox.offline();
  };
  // A phone waking up, or another tab changing the queue: look again.
  const onVisible = () => {
    if (document.visibilityState === 'visible') void outbox.flush();
  };
  const onStorage = (event: StorageEvent) => {
    if (event.key === OUTBOX_KEY) snapshot.value = outbox.snapshot();
  };
  window.addEventListener('online', onOnline);
  window.addEventListener('offline', onOffline);
  window.addEventListener('storage', onStorage);
  document.addEventListener('visibilitychange', onVisible);
  onScopeDispose(() => {
    window.removeEventListener('online', onOnline);
    window.removeEventListener('offline', onOffline);
    window.removeEventListener('storage', onStorage);
    document.removeEventListener('visibilitychange', onVisible);
    outbox.dispose();
  });
  // Whatever an earlier visit left behind goes out now.
  void outbox.flush();

  const items = computed<OutboxItem[]>(() => snapshot.value.items);

  return {
    online,
    snapshot,
    items,
    /** Queues a reading (sent at once when the connection allows). */
    enqueueReading: (journalId: number, reading: VatReadingInput) =>
      outbox.enqueueReading(journalId, reading),
    /** Queues the latest whole document of a journal made on `base`, replacing older queued ones. */
    enqueueDocument: (journalId: number, document: JournalInput, base?: DocumentBase) =>
      outbox.enqueueDocument(journalId, document, base),
    /** Replaces a held update with the merged or decided document, and sends it. */
    resolveDocument: (key: string, document: JournalInput, base: DocumentBase) =>
      outbox.resolveDocument(key, document, base),
    /** Drops a held update: the maker keeps the journal as it is on the server. */
    dropDocument: (key: string) => outbox.dropDocument(key),
    /** Tries to send now, without waiting for the next retry. */
    sendNow: () => outbox.online(),
  };
}

export type ReadingQueue = ReturnType<typeof useReadingQueue>;
