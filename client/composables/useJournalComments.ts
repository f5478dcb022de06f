import type { CommentDto, CommentPageDto } from '@shared/types/community';
import { onScopeDispose, ref, toValue, watch, type MaybeRefOrGetter } from 'vue';
import {
  deleteComment,
  editComment,
  listComments,
  postComment,
  type PostedComment,
} from '../api/community';
import { ApiError } from '../api/http';

const PAGE_SIZE = 50;

/** The conversation on one journal: threads page by page, post, reply, edit and delete. */
export function useJournalComments(journalId: MaybeRefOrGetter<number>) {
  const threads = ref<CommentDto[]>([]);
  const meta = ref<Omit<CommentPageDto, 'items'> | null>(null);
  const loading = ref(true);
  const error = ref<string | null>(null);
  let controller: AbortController | null = null;

  async function fetchPage(page: number, append: boolean) {
    controller?.abort();
    const mine = new AbortController();
    controller = mine;
    loading.value = true;
    error.value = null;
    try {
      const data = await listComments(
        toValue(journalId),
        { page, pageSize: PAGE_SIZE },
        mine.signal,
      );
      if (mine.signal.aborted) return;
      const { items, ...rest } = data;
      threads.value = append ? [...threads.value, ...items] : items;
      meta.value = rest;
    } catch (e) {
      if (mine.signal.aborted || (e as Error).name === 'AbortError') return;
      error.value = e instanceof ApiError ? e.message : 'Could not load the comments.';
    } finally {
      if (controller === mine) loading.value = false;
    }
  }

  /** Loads the first page again (after a change). */
  const reload = () => fetchPage(1, false);
  /** Loads the next page of threads below the ones shown. */
  const loadMore = () => fetchPage((meta.value?.page ?? 0) + 1, true);

  /** Posts a comment or a reply; resolves with the server's answer (held or shown). */
  async function post(body: string, parentId?: number): Promise<PostedComment> {
    const posted = await postComment(toValue(journalId), body, parentId ?? null);
    await reload();
    return posted;
  }

  /** Changes the body of one's own comment. */
  async function edit(id: number, body: string) {
    const { comment } = await editComment(id, body);
    const replace = (list: CommentDto[]): CommentDto[] =>
      list.map((c) =>
        c.id === id ? { ...comment, replies: c.replies } : { ...c, replies: replace(c.replies) },
      );
    threads.value = replace(threads.value);
  }

  /** Deletes a comment, then reloads (replies may keep a placeholder). */
  async function remove(id: number) {
    await deleteComment(id);
    await reload();
  }

  watch(() => toValue(journalId), reload, { immediate: true });
  onScopeDispose(() => controller?.abort());

  return { threads, meta, loading, error, reload, loadMore, post, edit, remove };
}
