import type { SideBySideDto } from '@shared/types/compare';
import { computed, onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { fetchSideBySide } from '../api/compare';
import { ApiError } from '../api/http';

/** Journal ids from a query value like "3,8,12": positive whole numbers, each once, in order. */
export function idsFromQuery(raw: unknown): number[] {
  const text = Array.isArray(raw) ? raw.join(',') : typeof raw === 'string' ? raw : '';
  const ids = text
    .split(',')
    .map((part) => Number(part.trim()))
    .filter((n) => Number.isInteger(n) && n > 0);
  return ids.filter((id, i) => ids.indexOf(id) === i);
}

/**
 * Two to four journals side by side for the compare-journals page: the table, loading state,
 * and notFound when one of them is missing or not visible to the reader.
 */
export function useCompareJournals(ids: MaybeRefOrGetter<number[]>) {
  const data = ref<SideBySideDto | null>(null);
  const loading = ref(false);
  const notFound = ref(false);
  const error = ref<string | null>(null);
  const count = computed(() => toValue(ids).length);
  let controller: AbortController | null = null;

  /** Loads the table for the current ids, cancelling any request still running. */
  async function load() {
    controller?.abort();
    data.value = null;
    notFound.value = false;
    error.value = null;
    if (count.value < 2 || count.value > 4) return;
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    try {
      const dto = await fetchSideBySide(toValue(ids), mine.signal);
      if (!mine.signal.aborted) data.value = dto;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      if (e instanceof ApiError && e.status === 404) notFound.value = true;
      else error.value = e instanceof ApiError ? e.message : 'Could not load the journals.';
    } finally {
      if (controller === mine) {
        loading.value = false;
        controller = null;
      }
    }
  }

  watch(() => toValue(ids).join(','), load, { immediate: true });
  onScopeDispose(() => controller?.abort());

  return { data, loading, notFound, error, count, reload: load };
}
