import type { MeDto } from '@shared/types/member';
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as authApi from '../api/auth';
import { ApiError } from '../api/http';

// The last member seen, so a page reloaded without a connection (at the vat) still knows who
// is signed in; the server stays the judge of every request once the connection is back.
const CACHE_KEY = 'rindwise.member';
// What this browser keeps for a member and must forget at sign-out on a shared device.
const PRIVATE_KEY_PREFIXES = ['rindwise.member', 'rindwise.journal-backup', 'rindwise:vat:'];

function readCache(): MeDto | null {
  try {
    const text = localStorage.getItem(CACHE_KEY);
    return text ? (JSON.parse(text) as MeDto) : null;
  } catch {
    return null;
  }
}

function writeCache(me: MeDto | null) {
  try {
    if (me) localStorage.setItem(CACHE_KEY, JSON.stringify(me));
    else localStorage.removeItem(CACHE_KEY);
  } catch {
    // storage refused (private mode): the cache is a convenience only
  }
}

function forgetPrivateData() {
  try {
    for (const key of Object.keys(localStorage)) {
      if (PRIVATE_KEY_PREFIXES.some((prefix) => key.startsWith(prefix)))
        localStorage.removeItem(key);
    }
  } catch {
    // nothing stored, or storage refused
  }
}

/** The signed-in member and what their role allows. */
export const useSessionStore = defineStore('session', () => {
  const member = ref<MeDto | null>(null);
  const loaded = ref(false);
  let pending: Promise<void> | null = null;

  const isSignedIn = computed(() => member.value !== null);
  const isStaff = computed(
    () => member.value?.role === 'moderator' || member.value?.role === 'admin',
  );
  const isAdmin = computed(() => member.value?.role === 'admin');
  const units = computed(() => member.value?.units ?? 'metric');

  /** Loads the member once (and again when forced); failures leave the visitor signed out. */
  function load(force = false): Promise<void> {
    if (loaded.value && !force) return Promise.resolve();
    pending ??= authApi
      .fetchMe()
      .then((me) => {
        member.value = me;
        writeCache(me);
      })
      .catch((error: unknown) => {
        // Offline: trust the last member seen; any other failure signs the visitor out.
        member.value = error instanceof ApiError && error.code === 'NETWORK' ? readCache() : null;
      })
      .finally(() => {
        loaded.value = true;
        pending = null;
      });
    return pending;
  }

  /** Replaces the member after sign-in or a settings change. */
  function setMember(me: MeDto | null) {
    if (!me) forgetPrivateData();
    member.value = me;
    writeCache(me);
    loaded.value = true;
  }

  /** Signs out on the server and forgets the member. */
  async function signOut() {
    try {
      await authApi.signOut();
    } finally {
      member.value = null;
      forgetPrivateData();
    }
  }

  return { member, loaded, isSignedIn, isStaff, isAdmin, units, load, setMember, signOut };
});
