import type { JournalExportTable, JournalInput, JournalListQuery } from '@shared/schemas/journal';
import type { JournalDto, JournalSummaryDto } from '@shared/types/journal';
import type { VolumeUnit } from '@shared/trade/units';
import { ApiError, http } from './http';

/** One page of journal cards with the total count behind the filters. */
export type JournalPage = {
  items: JournalSummaryDto[];
  total: number;
  page: number;
  pageSize: number;
};

/** Discover's filters as the client holds them (arrays, numbers), before the query string. */
export type JournalListParams = Partial<Omit<JournalListQuery, 'mine'>> & { mine?: boolean };

/** The filters as query-string values: lists become "a,b", defaults are left out. */
export function toQuery(params: JournalListParams): Record<string, string> {
  const query: Record<string, string> = {};
  for (const [key, value] of Object.entries(params)) {
    if (value === undefined || value === null || value === '') continue;
    if (Array.isArray(value)) {
      if (value.length) query[key] = value.join(',');
    } else query[key] = String(value);
  }
  return query;
}

/** Lists journals visible to the caller; `mine` lists the caller's own, drafts included. */
export const listJournals = (params: JournalListParams, signal?: AbortSignal) =>
  http.get<JournalPage>('/api/journals', toQuery(params), signal);

/** One journal with its derived figures; 404 when it is missing or not visible. */
export const fetchJournal = (id: number | string, signal?: AbortSignal) =>
  http.get<JournalDto>(`/api/journals/${id}`, undefined, signal);

/** Creates a journal from a whole document (SI values). */
export const createJournal = (doc: JournalInput) => http.post<JournalDto>('/api/journals', doc);

/**
 * Replaces a journal's whole document (owner only), if it is still at `version` (the
 * JournalDto's version the edits started from); otherwise a 409 JOURNAL_CHANGED ApiError
 * whose details.current is the journal as it is now.
 */
export const updateJournal = (id: number, doc: JournalInput, version: string) =>
  http.put<JournalDto>(`/api/journals/${id}`, doc, { 'if-match': `"${version}"` });

/** Deletes a journal, its photos and its rows; staff deleting a member's journal give a reason. */
export const deleteJournal = (id: number, reason = '') =>
  http.delete<void>(`/api/journals/${id}`, reason ? { reason } : undefined);

/** The journal inside a 409 JOURNAL_CHANGED answer, or null for any other error. */
export function changedJournalOf(error: unknown): JournalDto | null {
  if (!(error instanceof ApiError) || error.code !== 'JOURNAL_CHANGED') return null;
  const current = error.details.current as JournalDto | undefined;
  return current && typeof current.version === 'string' ? current : null;
}

/** Copies a journal into a new private draft for the caller, scaled to their milk volume. */
export const copyJournal = (id: number, body: { milkVolume: number; unit: VolumeUnit }) =>
  http.post<JournalDto>(`/api/journals/${id}/copy`, body);

/** The address of the caller's export (a download, opened as a plain link); CSV one table each. */
export const exportUrl = (format: 'csv' | 'json', table: JournalExportTable = 'journals') =>
  format === 'csv' && table !== 'journals'
    ? `/api/journals/export?format=csv&table=${table}`
    : `/api/journals/export?format=${format}`;
