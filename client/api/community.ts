import type { HeldCommentAction, ReportAction } from '@shared/constants/community';
import type { ModerationSettingsInput, ReportInput } from '@shared/schemas/community';
import type { Page } from '@shared/types/admin';
import type {
  AuditEntryDto,
  CommentDto,
  CommentPageDto,
  FollowDto,
  HeldCommentDto,
  MemberProfileDto,
  ModerationSettingsDto,
  NotificationPageDto,
  ReportDto,
} from '@shared/types/community';
import type { JournalSummaryDto } from '@shared/types/journal';
import { http } from './http';

// --- profiles, follows, the feed ----------------------------------------------------------

/** A maker's public profile; 404 when nobody has the handle. */
export const fetchProfile = (handle: string, signal?: AbortSignal) =>
  http
    .get<{ profile: MemberProfileDto }>(
      `/api/members/${encodeURIComponent(handle)}`,
      undefined,
      signal,
    )
    .then((r) => r.profile);

export const follow = (handle: string) =>
  http.post<FollowDto>(`/api/members/${encodeURIComponent(handle)}/follow`);

export const unfollow = (handle: string) =>
  http.delete<FollowDto>(`/api/members/${encodeURIComponent(handle)}/follow`);

/** Journals from the makers the member follows, newest make first. */
export const fetchFeed = (query: { page?: number; pageSize?: number }, signal?: AbortSignal) =>
  http.get<Page<JournalSummaryDto>>('/api/feed', query, signal);

// --- comments -----------------------------------------------------------------------------

export const listComments = (
  journalId: number,
  query: { page?: number; pageSize?: number },
  signal?: AbortSignal,
) => http.get<CommentPageDto>(`/api/journals/${journalId}/comments`, query, signal);

export type PostedComment = { comment: CommentDto; held: boolean; message: string | null };

export const postComment = (journalId: number, body: string, parentId?: number | null) =>
  http.post<PostedComment>(`/api/journals/${journalId}/comments`, { body, parentId });

export const editComment = (id: number, body: string) =>
  http.patch<{ comment: CommentDto }>(`/api/comments/${id}`, { body });

export const deleteComment = (id: number) => http.delete<void>(`/api/comments/${id}`);

// --- notifications ------------------------------------------------------------------------

export const listNotifications = (query: { page?: number; pageSize?: number; unread?: boolean }) =>
  http.get<NotificationPageDto>('/api/notifications', query);

export const fetchUnreadCount = () =>
  http.get<{ unread: number }>('/api/notifications/count').then((r) => r.unread);

export const markNotificationsRead = (ids: number[] | 'all') =>
  http.post<{ marked: number; unread: number }>(
    '/api/notifications/read',
    ids === 'all' ? { all: true } : { ids },
  );

// --- reports and moderation ---------------------------------------------------------------

export const fileReport = (input: ReportInput) =>
  http.post<{ report: { id: number; status: 'open' }; message: string }>('/api/reports', input);

export const listReports = (query: { status?: string; page?: number; pageSize?: number }) =>
  http.get<Page<ReportDto>>('/api/moderation/reports', query);

export const actOnReport = (id: number, action: ReportAction, note: string) =>
  http
    .post<{ report: ReportDto }>(`/api/moderation/reports/${id}/actions`, { action, note })
    .then((r) => r.report);

export const listHeldComments = (query: { page?: number; pageSize?: number }) =>
  http.get<Page<HeldCommentDto>>('/api/moderation/comments', query);

export const actOnHeldComment = (id: number, action: HeldCommentAction, note: string) =>
  http.post<void>(`/api/moderation/comments/${id}/actions`, { action, note });

export const fetchModerationSettings = () =>
  http.get<{ settings: ModerationSettingsDto }>('/api/moderation/settings').then((r) => r.settings);

export const saveModerationSettings = (input: ModerationSettingsInput) =>
  http
    .put<{ settings: ModerationSettingsDto }>('/api/moderation/settings', input)
    .then((r) => r.settings);

/** The audit log (admins). */
export const listAudit = (query: { page?: number; pageSize?: number; actor?: string }) =>
  http.get<Page<AuditEntryDto>>('/api/admin/audit', query);
