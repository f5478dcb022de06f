import type { WeighInDto } from '@shared/types/journal';
import type { CaveWheelDto } from '@shared/types/tasting';
import { computed, onScopeDispose, ref } from 'vue';
import {
  addWeighIn,
  fetchCalendarUrl,
  listCave,
  resetCalendarUrl,
  setWheelStatus,
  type CaveStatus,
} from '../api/cave';
import { ApiError } from '../api/http';

/** The member's cave: wheels sorted by ready date, status changes and weigh-ins. */
export function useCave() {
  const wheels = ref<CaveWheelDto[]>([]);
  const loading = ref(true);
  const error = ref<string | null>(null);
  let controller: AbortController | null = null;

  // Soonest ready first; wheels without a target go last, youngest last among them.
  const sorted = computed(() =>
    [...wheels.value].sort((a, b) => {
      if (a.readyDate && b.readyDate) return a.readyDate.localeCompare(b.readyDate);
      if (a.readyDate) return -1;
      if (b.readyDate) return 1;
      return a.makeDate.localeCompare(b.makeDate);
    }),
  );

  /** Loads the wheels drying and aging. */
  async function load() {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    error.value = null;
    try {
      const data = await listCave(mine.signal);
      if (!mine.signal.aborted) wheels.value = data.wheels;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      error.value = e instanceof ApiError ? e.message : 'Could not load your cave.';
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  /** Moves a wheel to a new status; opened, finished and discarded wheels leave the cave. */
  async function changeStatus(journalId: number, status: CaveStatus) {
    await setWheelStatus(journalId, status);
    if (status === 'opened' || status === 'finished' || status === 'discarded')
      wheels.value = wheels.value.filter((w) => w.journalId !== journalId);
    else await load();
  }

  /** Records a weigh-in (kg) and shows it as the wheel's latest. */
  async function recordWeighIn(journalId: number, weighIn: WeighInDto) {
    await addWeighIn(journalId, weighIn);
    wheels.value = wheels.value.map((w) =>
      w.journalId === journalId &&
      (!w.lastWeighIn || w.lastWeighIn.date.localeCompare(weighIn.date) <= 0)
        ? { ...w, lastWeighIn: { date: weighIn.date, massKg: weighIn.massKg } }
        : w,
    );
  }

  void load();
  onScopeDispose(() => controller?.abort());

  return { wheels: sorted, loading, error, reload: load, changeStatus, recordWeighIn };
}

/** The member's secret calendar address of ready dates, and its reset. */
export function useCalendarFeed() {
  const url = ref<string | null>(null);
  const loading = ref(false);
  const error = ref<string | null>(null);

  /** Fetches the address. */
  async function load() {
    loading.value = true;
    error.value = null;
    try {
      url.value = (await fetchCalendarUrl()).url;
    } catch (e) {
      error.value = e instanceof ApiError ? e.message : 'Could not fetch your calendar address.';
    } finally {
      loading.value = false;
    }
  }

  /** Makes a new address; calendars subscribed to the old one stop updating. */
  async function reset() {
    url.value = (await resetCalendarUrl()).url;
  }

  return { url, loading, error, load, reset };
}
