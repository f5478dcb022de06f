// Words and times for the community screens: notifications, comments, the moderation queue.
import { AUDIT_ACTION_LABELS, REPORT_REASON_LABELS } from '@shared/constants/community';
import type {
  AuditAction,
  ReportReason,
  ReportStatus,
  ReportTarget,
} from '@shared/constants/community';
import type { NotificationDto } from '@shared/types/community';

/** "just now", "5 minutes ago", "3 hours ago", "2 days ago", then the date. */
export function timeAgo(iso: string, now: Date = new Date()): string {
  const seconds = Math.round((now.getTime() - new Date(iso).getTime()) / 1000);
  if (seconds < 45) return 'just now';
  const minutes = Math.round(seconds / 60);
  if (minutes < 60) return `${minutes} ${minutes === 1 ? 'minute' : 'minutes'} ago`;
  const hours = Math.round(minutes / 60);
  if (hours < 24) return `${hours} ${hours === 1 ? 'hour' : 'hours'} ago`;
  const days = Math.round(hours / 24);
  if (days < 14) return `${days} ${days === 1 ? 'day' : 'days'} ago`;
  return new Date(iso).toLocaleDateString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
  });
}

/** A date and time for the audit log, in the reader's own zone. */
export function stamp(iso: string): string {
  return new Date(iso).toLocaleString('en-GB', {
    day: 'numeric',
    month: 'short',
    year: 'numeric',
    hour: '2-digit',
    minute: '2-digit',
  });
}

const ITEM_WORDS: Record<string, string> = {
  journal: 'journal',
  photo: 'photo',
  tasting: 'tasting',
  comment: 'comment',
};

/** The one-line headline of a notification. */
export function notificationHeadline(n: NotificationDto): string {
  const who = n.actor?.displayName ?? 'A former member';
  const where = n.journal ? `“${n.journal.title}”` : 'a journal';
  const item = ITEM_WORDS[n.targetType ?? ''] ?? 'contribution';
  switch (n.kind) {
    case 'comment':
      return `${who} commented on ${where}`;
    case 'reply':
      return `${who} replied to your comment on ${where}`;
    case 'follow':
      return `${who} now follows your journals`;
    case 'hidden':
      return n.targetType === 'journal'
        ? `A moderator hid your journal ${where}`
        : `A moderator hid your ${item} on ${where}`;
    case 'restored':
      return n.targetType === 'journal'
        ? `A moderator restored your journal ${where}`
        : `A moderator restored your ${item} on ${where}`;
    case 'comment-approved':
      return `Your comment on ${where} was read by a moderator and is now visible`;
  }
}

export const REPORT_STATUS_LABELS: Record<ReportStatus, string> = {
  open: 'Open',
  actioned: 'Acted on',
  dismissed: 'Dismissed',
};

export const TARGET_LABELS: Record<ReportTarget, string> = {
  journal: 'Journal',
  photo: 'Photo',
  tasting: 'Tasting',
  comment: 'Comment',
};

export const reasonLabel = (reason: ReportReason) => REPORT_REASON_LABELS[reason] ?? reason;
export const auditLabel = (action: AuditAction) => AUDIT_ACTION_LABELS[action] ?? action;
