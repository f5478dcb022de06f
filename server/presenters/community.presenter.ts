import { COMMENT_EDIT_WINDOW_MINUTES } from '../../shared/constants/community';
import { photoUrl } from '../../shared/constants/media';
import type {
  AuditEntryDto,
  CommentDto,
  CommentState,
  HeldCommentDto,
  NotificationDto,
  ReportedItemDto,
} from '../../shared/types/community';
import type { MakerRef } from '../../shared/types/journal';
import type { Role } from '../../shared/types/member';
import { renderComment, renderNotes } from '../lib/markdown';
import type { CommentRow } from '../repositories/comments.repository';
import type { AuditRow, TargetInfo } from '../repositories/moderation.repository';
import type { listNotifications } from '../repositories/notifications.repository';

const WINDOW_MS = COMMENT_EDIT_WINDOW_MINUTES * 60_000;

/** Who reads a comment: their id and whether they are a moderator or admin. */
export type CommentReader = { id: number; staff: boolean } | undefined;

/** Until when the author may change a comment. */
export const editableUntil = (row: Pick<CommentRow, 'createdAt'>) =>
  new Date(row.createdAt.getTime() + WINDOW_MS);

function stateFor(row: CommentRow, reader: CommentReader): CommentState {
  if (row.deletedAt) return 'removed';
  const privileged = reader !== undefined && (reader.staff || reader.id === row.authorId);
  if (row.hiddenAt) return privileged ? 'hidden' : 'removed';
  if (row.status === 'pending') return privileged ? 'pending' : 'removed';
  return 'visible';
}

/** A comment (and its replies) as one reader may see it; removed ones lose body and author. */
export function presentComment(
  row: CommentRow,
  author: MakerRef,
  reader: CommentReader,
  replies: CommentDto[] = [],
  now: Date = new Date(),
): CommentDto {
  const state = stateFor(row, reader);
  const base = {
    id: row.id,
    journalId: row.journalId,
    parentId: row.parentId,
    state,
    createdAt: row.createdAt.toISOString(),
    replies,
  };
  if (state === 'removed') {
    return {
      ...base,
      author: null,
      bodyHtml: '',
      body: null,
      editedAt: null,
      editableUntil: null,
      canEdit: false,
      canDelete: false,
      canReport: false,
    };
  }
  const isAuthor = reader?.id === row.authorId;
  const until = editableUntil(row);
  const canEdit = isAuthor && state !== 'hidden' && now < until;
  return {
    ...base,
    author: { id: author.id, handle: author.handle, displayName: author.displayName },
    bodyHtml: renderComment(row.body),
    body: isAuthor ? row.body : null,
    editedAt: row.editedAt?.toISOString() ?? null,
    editableUntil: canEdit ? until.toISOString() : null,
    canEdit,
    canDelete: isAuthor || (reader?.staff ?? false),
    canReport: reader !== undefined && !isAuthor && state === 'visible',
  };
}

/** A short plain-text excerpt of Markdown (for notifications, e-mails and the queue). */
export function plainExcerpt(markdown: string, max = 160): string {
  const text = markdown
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, '$1')
    .replace(/[`*_>#~]/g, '')
    .replace(/\s+/g, ' ')
    .trim();
  return text.length > max ? `${text.slice(0, max - 1).trimEnd()}…` : text;
}

type NotificationRow = Awaited<ReturnType<typeof listNotifications>>['rows'][number];

function notificationLink(row: NotificationRow): string | null {
  const n = row.notification;
  if (n.kind === 'follow') return row.actor ? `/@${row.actor.handle}` : null;
  if (!row.journal) return null;
  const anchor = n.commentId
    ? `#comment-${n.commentId}`
    : n.targetType === 'comment' && n.targetId
      ? `#comment-${n.targetId}`
      : '';
  return `/journals/${row.journal.id}${anchor}`;
}

/** One notification for its recipient. */
export function presentNotification(row: NotificationRow): NotificationDto {
  const n = row.notification;
  return {
    id: n.id,
    kind: n.kind,
    actor: row.actor ? { ...row.actor } : null,
    journal: row.journal ? { ...row.journal } : null,
    commentId: n.commentId,
    targetType: n.targetType,
    targetId: n.targetId,
    text: n.note || (row.commentBody ? plainExcerpt(row.commentBody) : ''),
    link: notificationLink(row),
    read: n.readAt !== null,
    createdAt: n.createdAt.toISOString(),
  };
}

/** One audit entry. */
export function presentAuditEntry(row: AuditRow): AuditEntryDto {
  return {
    id: row.id,
    action: row.action,
    actor: { id: row.actorId, handle: row.actorHandle },
    targetType: row.targetType,
    targetId: row.targetId,
    targetUser: row.targetUserHandle
      ? { id: row.targetUserId, handle: row.targetUserHandle }
      : null,
    reportId: row.reportId,
    summary: row.summary,
    note: row.note,
    createdAt: row.createdAt.toISOString(),
  };
}

/** A one-line label for an item, for the queue and the audit log. */
export function targetSummary(target: TargetInfo): string {
  switch (target.type) {
    case 'journal':
      return `Journal “${target.journal.title}”`;
    case 'photo':
      return `Photo${target.photo?.caption ? ` “${plainExcerpt(target.photo.caption, 80)}”` : ''} in “${target.journal.title}”`;
    case 'tasting':
      return `Tasting (${target.tasting?.overall ?? '?'}/9) of “${target.journal.title}”`;
    case 'comment':
      return `Comment “${plainExcerpt(target.text, 80)}” on “${target.journal.title}”`;
  }
}

/** The reported item as moderators see it, hidden or not. */
export function presentReportedItem(
  type: ReportedItemDto['type'],
  id: number,
  target: TargetInfo | undefined,
  author: (MakerRef & { role: Role; disabledAt: Date | null }) | undefined,
): ReportedItemDto {
  if (!target) {
    return {
      type,
      id,
      exists: false,
      hidden: false,
      pending: false,
      author: null,
      title: `This ${type} was deleted.`,
      bodyHtml: '',
      imageUrl: null,
      journal: null,
      link: null,
    };
  }
  const widths = (target.photo?.widths ?? '')
    .split(',')
    .map(Number)
    .filter((w) => w > 0)
    .sort((a, b) => a - b);
  const body =
    target.type === 'comment'
      ? renderComment(target.text)
      : target.type === 'photo'
        ? ''
        : renderNotes(target.text.slice(0, 1500));
  const anchor =
    target.type === 'comment'
      ? `#comment-${id}`
      : target.type === 'tasting'
        ? '#tastings'
        : target.type === 'photo'
          ? '#photos'
          : '';
  return {
    type,
    id,
    exists: !target.deleted,
    hidden: target.hiddenAt !== null,
    pending: target.pending,
    author: author
      ? {
          id: author.id,
          handle: author.handle,
          displayName: author.displayName,
          role: author.role,
          suspended: author.disabledAt !== null,
        }
      : null,
    title: targetSummary(target),
    bodyHtml: target.deleted ? '' : body,
    imageUrl: target.photo && widths.length ? photoUrl(target.photo.fileKey, widths[0]) : null,
    journal: { id: target.journal.id, title: target.journal.title },
    link: `/journals/${target.journal.id}${anchor}`,
  };
}

/** A comment waiting for review. */
export function presentHeldComment(row: {
  comment: CommentRow;
  author: MakerRef;
  journal: { id: number; title: string };
}): HeldCommentDto {
  return {
    id: row.comment.id,
    author: { ...row.author },
    journal: { ...row.journal },
    bodyHtml: renderComment(row.comment.body),
    createdAt: row.comment.createdAt.toISOString(),
  };
}
