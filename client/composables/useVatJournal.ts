import type { JournalInput } from '@shared/schemas/journal';
import type { JournalDto, ReadingDto } from '@shared/types/journal';
import { computed, ref, shallowRef, watch } from 'vue';
import { ApiError } from '../api/http';
import { fetchVatJournal } from '../api/vat';
import { describePath, merge3, resolveConflicts, type MergeResult } from '../lib/merge3';
import { checkDocument, documentFromDto } from '../lib/vat/document';
import {
  countWaiting,
  type DocumentBase,
  type OutboxItem,
  type OutboxSend,
} from '../lib/vat/outbox';
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
  /** Good news about a merge with changes made elsewhere (shown until dismissed). */
  const notices = ref<string[]>([]);
  /** The journal as the server last answered it, with its version: what new updates build on. */
  const base = shallowRef<DocumentBase | null>(null);

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
      base.value = { version: fresh.version, document: documentFromDto(fresh) };
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

  // --- an update the server refused because the journal changed elsewhere ---------------

  type Held = Extract<OutboxItem, { kind: 'document' }> & { conflict: { current: unknown } };
  const held = computed(
    () =>
      queue.items.value.find(
        (i): i is Held => i.kind === 'document' && i.journalId === journalId && !!i.conflict,
      ) ?? null,
  );

  /** What the held update and the saved journal say, merged; null when nothing is held. */
  const conflict = computed(() => {
    const item = held.value;
    const current = item?.conflict.current as JournalDto | null | undefined;
    if (!item || !current || typeof current.version !== 'string') return null;
    const theirs = documentFromDto(current);
    // An update without a base (queued before versions) counts every difference as the vat's.
    const from = item.base?.document ?? theirs;
    const result: MergeResult<JournalInput> = merge3(from, item.document, theirs, {
      unionLists: ['weighIns'],
    });
    return { key: item.key, current, theirs, result };
  });

  function settle(document: JournalInput, current: JournalDto, theirs: JournalInput, key: string) {
    const onServer = { version: current.version, document: theirs };
    dto.value = current;
    base.value = onServer;
    doc.value = document;
    if (JSON.stringify(document) === JSON.stringify(theirs)) queue.dropDocument(key);
    else void queue.resolveDocument(key, document, onServer);
  }

  // Changes to different things (the vat's step times, the laptop's notes) merge by themselves.
  watch(
    conflict,
    (c) => {
      if (!c || c.result.conflicts.length) return;
      settle(c.result.merged, c.current, c.theirs, c.key);
      const what = [...new Set(c.result.theirChanges.map(describePath))];
      notices.value = [
        ...notices.value,
        what.length
          ? `This journal was changed elsewhere (${what.join(', ')}). Your vat times were added on top of it and saved.`
          : 'This journal was changed elsewhere; your vat times were saved on top of it.',
      ];
    },
    { immediate: true },
  );

  /** Settles a held update: keep the vat's values where both changed, or the saved ones. */
  function decideConflict(side: 'mine' | 'theirs') {
    const c = conflict.value;
    if (!c) return;
    settle(resolveConflicts(c.result, side), c.current, c.theirs, c.key);
  }

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
      base.value = { version: journal.version, document: documentFromDto(journal) };
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
    void queue.enqueueDocument(journalId, next, base.value ?? undefined);
    return null;
  }

  function dismissProblems() {
    problems.value = [];
    notices.value = [];
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
    notices,
    conflict,
    decideConflict,
    load,
    logReading,
    saveDocument,
    dismissProblems,
  };
}

export type VatJournal = ReturnType<typeof useVatJournal>;
