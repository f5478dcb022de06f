import { defineStore } from 'pinia';
import { ref } from 'vue';
import { fetchUnreadCount, markNotificationsRead } from '../api/community';

const POLL_MS = 60_000;

/** The signed-in member's unread notification count, for the header's mark. */
export const useNotificationsStore = defineStore('notifications', () => {
  const unread = ref(0);
  let timer: ReturnType<typeof setInterval> | null = null;

  /** Asks the server for the unread count; a failure keeps the last one. */
  async function refresh() {
    try {
      unread.value = await fetchUnreadCount();
    } catch {
      // signed out meanwhile, or offline: the next poll tries again
    }
  }

  /** Starts polling while a member is signed in (once a minute, and when the tab comes back). */
  function start() {
    if (timer) return;
    void refresh();
    timer = setInterval(() => {
      if (document.visibilityState === 'visible') void refresh();
    }, POLL_MS);
    document.addEventListener('visibilitychange', onVisible);
  }

  /** Stops polling and forgets the count (at sign-out). */
  function stop() {
    if (timer) clearInterval(timer);
    timer = null;
    unread.value = 0;
    document.removeEventListener('visibilitychange', onVisible);
  }

  function onVisible() {
    if (document.visibilityState === 'visible') void refresh();
  }

  /** Marks notifications read and takes the server's new unread count. */
  async function markRead(ids: number[] | 'all') {
    unread.value = (await markNotificationsRead(ids)).unread;
  }

  return { unread, refresh, start, stop, markRead };
});
