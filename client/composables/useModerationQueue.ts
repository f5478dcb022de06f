import type { HeldCommentAction, ReportAction, ReportStatus } from '@shared/constants/community';
import type { HeldCommentDto, ReportDto } from '@shared/types/community';
import { ref } from 'vue';
import { actOnHeldComment, actOnReport, listHeldComments, listReports } from '../api/community';
import { ApiError } from '../api/http';

const PAGE_SIZE = 10;

/** The report queue for moderators: one status at a time, paged, and the actions on a report. */
export function useReportQueue() {
  const status = ref<ReportStatus | 'all'>('open');
  const page = ref(1);
  const items = ref<ReportDto[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const error = ref<string | null>(null);

  /** Loads the current page of the current status. */
  async function load() {
    loading.value = true;
    error.value = null;
    try {
      const result = await listReports({
        status: status.value,
        page: page.value,
        pageSize: PAGE_SIZE,
      });
      items.value = result.items;
      total.value = result.total;
    } catch (e) {
      error.value = e instanceof ApiError ? e.message : 'Could not load the reports.';
    } finally {
      loading.value = false;
    }
  }

  /** Acts on a report and puts the server's new view of it in the list. */
  async function act(id: number, action: ReportAction, note: string) {
    const report = await actOnReport(id, action, note);
    items.value = items.value.map((r) => (r.id === id ? report : r));
  }

  return { status, page, pageSize: PAGE_SIZE, items, total, loading, error, load, act };
}

/** Comments held for review: the list and approve / reject. */
export function useHeldComments() {
  const items = ref<HeldCommentDto[]>([]);
  const total = ref(0);
  const loading = ref(false);
  const error = ref<string | null>(null);

  /** Loads the oldest waiting comments first. */
  async function load() {
    loading.value = true;
    error.value = null;
    try {
      const result = await listHeldComments({ pageSize: 50 });
      items.value = result.items;
      total.value = result.total;
    } catch (e) {
      error.value = e instanceof ApiError ? e.message : 'Could not load the held comments.';
    } finally {
      loading.value = false;
    }
  }

  /** Approves or rejects a held comment, then drops it from the list. */
  async function act(id: number, action: HeldCommentAction, note: string) {
    await actOnHeldComment(id, action, note);
    items.value = items.value.filter((c) => c.id !== id);
    total.value = Math.max(0, total.value - 1);
  }

  return { items, total, loading, error, load, act };
}
