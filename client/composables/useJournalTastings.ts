import type { AgeBandDto, TastingDto } from '@shared/types/tasting';
import { onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { ApiError } from '../api/http';
import { createInvite, deleteTasting, listTastings, type TastingInvite } from '../api/tastings';

/** The tastings of one journal with the means per age band, delete and the maker's invite. */
export function useJournalTastings(journalId: MaybeRefOrGetter<number>) {
  const tastings = ref<TastingDto[]>([]);
  const bands = ref<AgeBandDto[]>([]);
  const loading = ref(true);
  const error = ref<string | null>(null);
  const invite = ref<TastingInvite | null>(null);
  const inviting = ref(false);
  /** For the maker: why tasters could not open the journal yet (draft, private), or null. */
  const inviteBlocked = ref<string | null>(null);
  let controller: AbortController | null = null;

  /** Loads the tastings, oldest wheel age first as the server orders them. */
  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    error.value = null;
    try {
      const data = await listTastings(toValue(journalId), mine.signal);
      if (mine.signal.aborted) return;
      tastings.value = [...data.tastings].sort(
        (a, b) => a.ageDays - b.ageDays || a.createdAt.localeCompare(b.createdAt),
      );
      bands.value = data.bands;
      inviteBlocked.value = data.invites?.blockedReason ?? null;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      error.value = e instanceof ApiError ? e.message : 'Could not load the tastings.';
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  /** Deletes a tasting, then reloads the list and the band means. */
  async function remove(id: number) {
    await deleteTasting(id);
    await load();
  }

  /** Makes a new invite link for the wheel (the maker only). */
  async function makeInvite() {
    inviting.value = true;
    try {
      invite.value = (await createInvite(toValue(journalId))).invite;
    } catch (e) {
      // The journal went private or back to draft in another tab: explain, not just fail.
      if (e instanceof ApiError && e.status === 409) inviteBlocked.value = e.message;
      throw e;
    } finally {
      inviting.value = false;
    }
  }

  watch(() => toValue(journalId), load, { immediate: true });
  onScopeDispose(() => controller?.abort());

  return {
    tastings,
    bands,
    loading,
    error,
    reload: load,
    remove,
    invite,
    inviting,
    inviteBlocked,
    makeInvite,
  };
}
