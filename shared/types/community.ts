import type {
  AuditAction,
  AuditTarget,
  NotificationKind,
  ReportReason,
  ReportStatus,
  ReportTarget,
} from '../constants/community';
import type { HiddenMarkDto, JournalSummaryDto, MakerRef } from './journal';
import type { Role } from './member';

/**
 * How a comment stands for the viewer: visible to all; pending (held for a moderator) or
 * hidden (by a moderator), both shown only to their author and staff; removed (deleted, or
 * hidden from this viewer) kept only as a placeholder above its replies.
 */
export type CommentState = 'visible' | 'pending' | 'hidden' | 'removed';

export type CommentDto = {
  id: number;
  journalId: number;
  parentId: number | null;
  state: CommentState;
  /** Null for a removed placeholder. */
  author: MakerRef | null;
  /** Sanitised HTML from the Markdown body (no images); empty for a placeholder. */
  bodyHtml: string;
  /** The Markdown source, only for its author (to edit it). */
  body: string | null;
  createdAt: string;
  editedAt: string | null;
  /** Until when the author may still change it; null when they no longer can. */
  editableUntil: string | null;
  canEdit: boolean;
  canDelete: boolean;
  canReport: boolean;
  /** For its author and staff when state is 'hidden': when, and the moderator's note. */
  hidden?: HiddenMarkDto | null;
  replies: CommentDto[];
};

export type CommentPageDto = {
  items: CommentDto[];
  /** Comments everyone can see on this journal (replies included). */
  total: number;
  /** Top-level threads, for paging. */
  threads: number;
  page: number;
  pageSize: number;
  /** Whether the viewer may write here, and if not why. */
  canComment: boolean;
  cannotCommentReason: string | null;
};

export type ProfileTastingDto = {
  id: number;
  journal: { id: number; title: string; maker: MakerRef };
  tastedOn: string;
  ageDays: number;
  overall: number;
};

export type MemberProfileDto = {
  handle: string;
  displayName: string;
  role: Role;
  bioHtml: string;
  memberSince: string;
  counts: { journals: number; tastings: number; followers: number; following: number };
  /** The styles of their public journals, most made first (at most five). */
  topStyles: { slug: string; name: string; count: number }[];
  scores: {
    /** Mean overall liking of the visible tastings of their public journals. */
    received: { mean: number | null; n: number };
    /** Mean overall liking they gave in their visible tastings of public journals. */
    given: { mean: number | null; n: number };
  };
  journals: JournalSummaryDto[];
  tastings: ProfileTastingDto[];
  viewer: { signedIn: boolean; isSelf: boolean; follows: boolean };
  /** Only for moderators and admins. */
  suspended?: boolean;
};

export type FollowDto = { following: boolean; followers: number };

export type NotificationDto = {
  id: number;
  kind: NotificationKind;
  actor: MakerRef | null;
  journal: { id: number; title: string } | null;
  commentId: number | null;
  targetType: ReportTarget | null;
  targetId: number | null;
  /** A moderator's note (hidden, restored), or a short plain excerpt of a comment. */
  text: string;
  /** Where the notification leads in the client (a path). */
  link: string | null;
  read: boolean;
  createdAt: string;
};

export type NotificationPageDto = {
  items: NotificationDto[];
  total: number;
  unread: number;
  page: number;
  pageSize: number;
};

/** What a report points at, as moderators see it (hidden items included). */
export type ReportedItemDto = {
  type: ReportTarget;
  id: number;
  exists: boolean;
  hidden: boolean;
  /** Pending comments (held for review). */
  pending: boolean;
  author: (MakerRef & { role: Role; suspended: boolean }) | null;
  /** Journal title, photo caption, comment excerpt, tasting summary. */
  title: string;
  /** Sanitised HTML of the body (comment, tasting notes, journal notes), when there is one. */
  bodyHtml: string;
  /** A small rendition for a photo. */
  imageUrl: string | null;
  journal: { id: number; title: string } | null;
  link: string | null;
};

export type AuditEntryDto = {
  id: number;
  action: AuditAction;
  actor: { id: number | null; handle: string };
  targetType: AuditTarget;
  targetId: number | null;
  targetUser: { id: number | null; handle: string } | null;
  reportId: number | null;
  summary: string;
  note: string;
  createdAt: string;
};

export type ReportDto = {
  id: number;
  status: ReportStatus;
  reason: ReportReason;
  details: string;
  createdAt: string;
  resolvedAt: string | null;
  reporter: MakerRef | null;
  resolvedBy: MakerRef | null;
  item: ReportedItemDto;
  /** Every report of the same item, this one included, newest first. */
  reports: {
    id: number;
    reason: ReportReason;
    status: ReportStatus;
    createdAt: string;
    reporter: string | null;
  }[];
  /** The audit entries about this item (and its author's suspension), newest first. */
  history: AuditEntryDto[];
  /** Which actions the viewer may take now. */
  allowed: { dismiss: boolean; hide: boolean; restore: boolean; suspend: boolean };
};

export type HeldCommentDto = {
  id: number;
  author: MakerRef;
  journal: { id: number; title: string };
  bodyHtml: string;
  createdAt: string;
};

export type ModerationSettingsDto = {
  holdFirstComments: boolean;
  updatedAt: string | null;
  updatedBy: string | null;
};
