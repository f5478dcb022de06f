import type { JournalDto } from '@shared/types/journal';
import type { VolumeUnit } from '@shared/trade/units';
import { onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { copyJournal, deleteJournal, fetchJournal } from '../api/journals';
import { takeEarly } from '../api/early';
import { ApiError } from '../api/http';

/** One journal for its page: the DTO, loading and not-found state, delete and copy. */
export function useJournal(id: MaybeRefOrGetter<string | number>) {
  const journal = ref<JournalDto | null>(null);
  const loading = ref(true);
  const notFound = ref(false);
  const error = ref<string | null>(null);
  let controller: AbortController | null = null;

  /** Loads the journal; a 404 (missing, private or a draft of someone else) sets notFound. */
  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    notFound.value = false;
    error.value = null;
    try {
      const key = toValue(id);
      // The read main.ts sent at start-up for this page, when there is one.
      const dto = await (takeEarly<JournalDto>(`journal:${key}`) ?? fetchJournal(key, mine.signal));
      if (!mine.signal.aborted) journal.value = dto;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      journal.value = null;
      if (e instanceof ApiError && (e.status === 404 || e.status === 403)) notFound.value = true;
      else error.value = e instanceof ApiError ? e.message : 'Could not load this journal.';
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  /** Deletes the journal (its maker, or staff with a reason for the audit log). */
  async function remove(reason = '') {
    if (journal.value) await deleteJournal(journal.value.id, reason);
  }

  /** Copies the journal into a new private draft scaled to the given milk volume. */
  async function copy(milkVolume: number, unit: VolumeUnit): Promise<JournalDto> {
    if (!journal.value) throw new Error('No journal to copy.');
    return copyJournal(journal.value.id, { milkVolume, unit });
  }

  watch(() => toValue(id), load, { immediate: true });
  onScopeDispose(() => controller?.abort());

  return { journal, loading, notFound, error, reload: load, remove, copy };
}
