// The community's vocabulary: what can be reported and why, what moderators can do, what
// members are told. Shared by the server (schema enums, rules) and the client (labels).

/** How long the author of a comment may still change it, in minutes from posting. */
export const COMMENT_EDIT_WINDOW_MINUTES = 30;
/** Longest comment, in characters of Markdown. */
export const COMMENT_MAX_LENGTH = 5000;
/**
 * With "hold first comments" on, a member's comments wait for a moderator until this many of
 * theirs are visible; moderators and admins are never held.
 */
export const HELD_FIRST_COMMENTS = 3;

export const COMMENT_STATUSES = ['pending', 'visible'] as const;
export type CommentStatus = (typeof COMMENT_STATUSES)[number];

export const REPORT_TARGETS = ['journal', 'photo', 'tasting', 'comment'] as const;
export type ReportTarget = (typeof REPORT_TARGETS)[number];

export const REPORT_TARGET_LABELS: Record<ReportTarget, string> = {
  journal: 'journal',
  photo: 'photo',
  tasting: 'tasting',
  comment: 'comment',
};

export const REPORT_REASONS = [
  'spam',
  'abusive',
  'unsafe-advice',
  'off-topic',
  'not-theirs',
  'other',
] as const;
export type ReportReason = (typeof REPORT_REASONS)[number];

export const REPORT_REASON_LABELS: Record<ReportReason, string> = {
  spam: 'Spam or advertising',
  abusive: 'Rude, hateful or abusive',
  'unsafe-advice': 'Unsafe food-safety advice',
  'off-topic': 'Not about cheesemaking',
  'not-theirs': "Someone else's work or photos",
  other: 'Something else',
};

export const REPORT_STATUSES = ['open', 'dismissed', 'actioned'] as const;
export type ReportStatus = (typeof REPORT_STATUSES)[number];

/** What a moderator can do with a report; suspend is for admins only. */
export const REPORT_ACTIONS = ['dismiss', 'hide', 'restore', 'suspend'] as const;
export type ReportAction = (typeof REPORT_ACTIONS)[number];

/** What a moderator can do with a comment held for review. */
export const HELD_COMMENT_ACTIONS = ['approve', 'reject'] as const;
export type HeldCommentAction = (typeof HELD_COMMENT_ACTIONS)[number];

/** Every entry the audit log can hold. */
export const AUDIT_ACTIONS = [
  'report-dismissed',
  'item-hidden',
  'item-restored',
  'member-suspended',
  'comment-approved',
  'comment-rejected',
  'comment-deleted',
  'journal-deleted',
  'tasting-deleted',
  'setting-changed',
  'role-changed',
  'member-disabled',
  'member-enabled',
] as const;
export type AuditAction = (typeof AUDIT_ACTIONS)[number];

export const AUDIT_ACTION_LABELS: Record<AuditAction, string> = {
  'report-dismissed': 'Report dismissed',
  'item-hidden': 'Hidden',
  'item-restored': 'Restored',
  'member-suspended': 'Member suspended',
  'comment-approved': 'Held comment approved',
  'comment-rejected': 'Held comment rejected',
  'comment-deleted': 'Comment deleted by staff',
  'journal-deleted': 'Journal deleted by staff',
  'tasting-deleted': 'Tasting deleted by staff',
  'setting-changed': 'Setting changed',
  'role-changed': 'Role changed',
  'member-disabled': 'Account disabled',
  'member-enabled': 'Account enabled',
};

export const AUDIT_TARGETS = [...REPORT_TARGETS, 'member', 'setting'] as const;
export type AuditTarget = (typeof AUDIT_TARGETS)[number];

export const NOTIFICATION_KINDS = [
  'comment',
  'reply',
  'follow',
  'hidden',
  'restored',
  'comment-approved',
] as const;
export type NotificationKind = (typeof NOTIFICATION_KINDS)[number];

/** Keys of the site settings moderators can change. */
export const SITE_SETTING_KEYS = ['hold_first_comments'] as const;
export type SiteSettingKey = (typeof SITE_SETTING_KEYS)[number];
