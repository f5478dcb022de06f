import type { MemberProfileDto } from '@shared/types/community';
import { onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import { fetchProfile, follow, unfollow } from '../api/community';
import { ApiError } from '../api/http';

/** A maker's profile for its page: loading and not-found state, follow and unfollow. */
export function useProfile(handle: MaybeRefOrGetter<string>) {
  const profile = ref<MemberProfileDto | null>(null);
  const loading = ref(true);
  const notFound = ref(false);
  const error = ref<string | null>(null);
  let controller: AbortController | null = null;

  /** Loads the profile; an unknown handle sets notFound. */
  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    notFound.value = false;
    error.value = null;
    try {
      const dto = await fetchProfile(toValue(handle), mine.signal);
      if (!mine.signal.aborted) profile.value = dto;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      profile.value = null;
      if (e instanceof ApiError && (e.status === 404 || e.status === 400)) notFound.value = true;
      else error.value = e instanceof ApiError ? e.message : 'Could not load this profile.';
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  /** Follows or stops following the maker, keeping the follower count in step. */
  async function toggleFollow() {
    const p = profile.value;
    if (!p) return;
    const result = p.viewer.follows ? await unfollow(p.handle) : await follow(p.handle);
    p.viewer.follows = result.following;
    p.counts.followers = result.followers;
  }

  watch(() => toValue(handle), load, { immediate: true });
  onScopeDispose(() => controller?.abort());

  return { profile, loading, notFound, error, reload: load, toggleFollow };
}
