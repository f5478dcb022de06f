import type { UnitSystem } from '@shared/trade/units';
import { storeToRefs } from 'pinia';
import { computed, ref } from 'vue';
import { useSessionStore } from '../stores/session';

const STORAGE_KEY = 'rindwise.units';

function readStored(): UnitSystem {
  try {
    return localStorage.getItem(STORAGE_KEY) === 'us' ? 'us' : 'metric';
  } catch {
    return 'metric';
  }
}

// Shared by every page of one tab, so a toggle on the journal page holds in Discover too.
const guestUnits = ref<UnitSystem>(readStored());

/**
 * The unit system a reader sees figures in: the member's own setting, or for signed-out
 * readers metric with a metric/US toggle remembered in this browser.
 */
export function useReaderUnits() {
  const { member } = storeToRefs(useSessionStore());
  const units = computed<UnitSystem>(() => member.value?.units ?? guestUnits.value);
  const canToggle = computed(() => !member.value);

  /** Switches a signed-out reader between metric and US customary and remembers it. */
  function setGuestUnits(next: UnitSystem) {
    guestUnits.value = next;
    try {
      localStorage.setItem(STORAGE_KEY, next);
    } catch {
      // Private browsing may refuse storage; the choice then lasts for this page.
    }
  }

  return { units, canToggle, setGuestUnits };
}
