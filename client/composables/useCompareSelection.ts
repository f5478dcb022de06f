import { computed, ref } from 'vue';
import { fetchJournal } from '../api/journals';

/** A journal picked in Discover for the side-by-side view. */
export type PickedJournal = { id: number; title: string };

/** The side-by-side view takes two to four journals. */
export const MIN_PICKED = 2;
export const MAX_PICKED = 4;

// One selection per tab, so it survives paging, filtering and a look at a journal.
const active = ref(false);
const picked = ref<PickedJournal[]>([]);

/**
 * Discover's selection mode for Compare: whether it is on, the journals picked (at most four),
 * and the address of the side-by-side view for them.
 */
export function useCompareSelection() {
  const count = computed(() => picked.value.length);
  const full = computed(() => count.value >= MAX_PICKED);
  const ready = computed(() => count.value >= MIN_PICKED);
  const target = computed(() => ({
    name: 'compare-journals',
    query: { ids: picked.value.map((j) => j.id).join(',') },
  }));

  const isPicked = (id: number) => picked.value.some((j) => j.id === id);

  /** Turns selection mode on. */
  function start() {
    active.value = true;
  }

  /** Turns selection mode off and forgets the picks. */
  function stop() {
    active.value = false;
    picked.value = [];
  }

  /** Picks a journal, or unpicks it when it is already picked; a fifth is refused. */
  function toggle(journal: PickedJournal) {
    if (isPicked(journal.id)) picked.value = picked.value.filter((j) => j.id !== journal.id);
    else if (!full.value)
      picked.value = [...picked.value, { id: journal.id, title: journal.title }];
  }

  /** Starts selection mode with just these journals picked (titles fetched; unreadable dropped). */
  async function adopt(ids: number[]) {
    active.value = true;
    const known = new Map(picked.value.map((j) => [j.id, j.title]));
    const fresh = ids.slice(0, MAX_PICKED).filter((id) => !known.has(id));
    picked.value = ids
      .slice(0, MAX_PICKED)
      .map((id) => ({ id, title: known.get(id) ?? `Journal ${id}` }));
    await Promise.all(
      fresh.map(async (id) => {
        try {
          const journal = await fetchJournal(id);
          picked.value = picked.value.map((j) => (j.id === id ? { id, title: journal.title } : j));
        } catch {
          picked.value = picked.value.filter((j) => j.id !== id);
        }
      }),
    );
  }

  return { active, picked, count, full, ready, target, isPicked, start, stop, toggle, adopt };
}
