import type { JournalInput } from '@shared/schemas/journal';
import type { JournalDto, ReadingDto } from '@shared/types/journal';
import { computed, ref, shallowRef } from 'vue';
import { ApiError } from '../api/http';
import { fetchVatJournal } from '../api/vat';
import { checkDocument, documentFromDto } from '../lib/vat/document';
import { countWaiting, type OutboxSend } from '../lib/vat/outbox';
import {
  makeReading,
  mergeReadings,
  type MakeReadingResult,
  type NewReading,
  type VatReadingInput,
} from '../lib/vat/readings';
import { useReadingQueue } from './useReadingQueue';

export type VatLoadState = 'loading' | 'ready' | 'not-found' | 'not-yours' | 'offline' | 'error';

function storedReadings(result: unknown): ReadingDto[] {
  if (result && typeof result === 'object') {
    const list = (result as { readings?: unknown }).readings;
    if (Array.isArray(list)) return list as ReadingDto[];
    if (typeof (result as { id?: unknown }).id === 'string') return [result as ReadingDto];
  }
  return [];
}

function withReadings(list: readonly ReadingDto[], more: readonly ReadingDto[]): ReadingDto[] {
  const byId = new Map(list.map((r) => [r.id, r]));
  for (const r of more) byId.set(r.id, r);
  return [...byId.values()];
}

/**
 * One journal at the vat: loads it, keeps the document the vat edits (the latest queued
 * update when one waits, so a reload does not roll the step times back), the readings from
 * the server and from this phone, and sends both through the outbox. Only the journal's
 * owner may use it: anyone else gets the 'not-yours' state.
 */
export function useVatJournal(journalId: number) {
  const state = ref<VatLoadState>('loading');
  const errorMessage = ref('');
  const dto = shallowRef<JournalDto | null>(null);
  const doc = shallowRef<JournalInput | null>(null);
  const serverReadings = shallowRef<ReadingDto[]>([]);
  const logged = shallowRef<VatReadingInput[]>([]);
  const problems = ref<string[]>([]);

  function onSent(send: OutboxSend, result: unknown) {
    if (send.journalId !== journalId) return;
    if (send.kind === 'readings') {
      serverReadings.value = withReadings(serverReadings.value, storedReadings(result));
      return;
    }
    // The vat's own document stays: a newer update may already be queued behind this one.
    const fresh = result as JournalDto | null;
    if (fresh && Array.isArray(fresh.readings)) {
      dto.value = fresh;
      serverReadings.value = withReadings(serverReadings.value, fresh.readings);
    }
  }

  function onRejected(send: OutboxSend, error: unknown) {
    if (send.journalId !== journalId) return;
    const why = error instanceof Error ? error.message : 'The server refused it.';
    problems.value = [
      ...problems.value,
      send.kind === 'readings'
        ? `A reading was not saved: ${why}`
        : `The step times were not saved: ${why}`,
    ];
  }

  const queue = useReadingQueue({ onSent, onRejected });

  const queuedReadings = computed(() =>
    queue.items.value.flatMap((item) =>
      item.kind === 'reading' && item.journalId === journalId ? [item.reading] : [],
    ),
  );
  const readings = computed(() =>
    mergeReadings(
      serverReadings.value,
      [...logged.value, ...queuedReadings.value],
      new Set(queuedReadings.value.map((r) => r.id)),
    ),
  );
  const waiting = computed(() => countWaiting(queue.items.value));

  /** The latest whole document of this journal still in the queue, if any. */
  function queuedDocument(): JournalInput | null {
    const item = [...queue.items.value]
      .reverse()
      .find((i) => i.kind === 'document' && i.journalId === journalId);
    return item?.kind === 'document' ? item.document : null;
  }

  async function load() {
    state.value = 'loading';
    errorMessage.value = '';
    // Taken before the request: the queue may send (and drop) it while the journal loads,
    // and the answer may still be the older version.
    const queuedBefore = queuedDocument();
    try {
      const journal = await fetchVatJournal(journalId);
      dto.value = journal;
      serverReadings.value = journal.readings;
      if (!journal.canEdit) {
        state.value = 'not-yours';
        return;
      }
      doc.value = queuedDocument() ?? queuedBefore ?? documentFromDto(journal);
      state.value = 'ready';
    } catch (error) {
      if (error instanceof ApiError && error.status === 404) state.value = 'not-found';
      else if (error instanceof ApiError && error.status === 403) state.value = 'not-yours';
      else if (error instanceof ApiError && error.status === 0) state.value = 'offline';
      else {
        state.value = 'error';
        errorMessage.value = error instanceof Error ? error.message : String(error);
      }
    }
  }

  /** Logs a reading taken now: checked, listed at once, queued for the server. */
  function logReading(input: NewReading): MakeReadingResult {
    const made = makeReading(input, Date.now());
    if (!made.ok) return made;
    logged.value = [...logged.value, made.reading];
    void queue.enqueueReading(journalId, made.reading);
    return made;
  }

  /** Replaces the vat's document and queues it for the server; returns a problem or null. */
  function saveDocument(next: JournalInput): string | null {
    const problem = checkDocument(next);
    if (problem) return problem;
    doc.value = next;
    void queue.enqueueDocument(journalId, next);
    return null;
  }

  function dismissProblems() {
    problems.value = [];
  }

  void load();

  return {
    journalId,
    state,
    errorMessage,
    dto,
    doc,
    readings,
    queue,
    waiting,
    problems,
    load,
    logReading,
    saveDocument,
    dismissProblems,
  };
}

export type VatJournal = ReturnType<typeof useVatJournal>;
