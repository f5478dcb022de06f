import type { MeDto } from '@shared/types/member';
import { defineStore } from 'pinia';
import { computed, ref } from 'vue';
import * as authApi from '../api/auth';

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
      })
      .catch(() => {
        member.value = null;
      })
      .finally(() => {
        loaded.value = true;
        pending = null;
      });
    return pending;
  }

  /** Replaces the member after sign-in or a settings change. */
  function setMember(me: MeDto | null) {
    member.value = me;
    loaded.value = true;
  }

  /** Signs out on the server and forgets the member. */
  async function signOut() {
    try {
      await authApi.signOut();
    } finally {
      member.value = null;
    }
  }

  return { member, loaded, isSignedIn, isStaff, isAdmin, units, load, setMember, signOut };
});
