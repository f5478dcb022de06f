import { sql } from 'drizzle-orm';
import {
  datetime,
  foreignKey,
  index,
  int,
  mysqlEnum,
  mysqlTable,
  primaryKey,
  text,
  varchar,
} from 'drizzle-orm/mysql-core';
import {
  AUDIT_ACTIONS,
  AUDIT_TARGETS,
  COMMENT_STATUSES,
  NOTIFICATION_KINDS,
  REPORT_REASONS,
  REPORT_STATUSES,
  REPORT_TARGETS,
} from '../../../shared/constants/community';
import { journals } from './journals';
import { users } from './users';

const createdAt = () =>
  datetime('created_at', { mode: 'date' })
    .notNull()
    .default(sql`CURRENT_TIMESTAMP`);

/**
 * Comments on journals, threaded one level: a reply's parent is always a top-level comment.
 * status 'pending' is a first comment held for a moderator; hidden_at is a moderator's hide;
 * deleted_at keeps the row (and its replies' context) after the author or staff removed it.
 */
export const comments = mysqlTable(
  'comments',
  {
    id: int('id').autoincrement().primaryKey(),
    journalId: int('journal_id').notNull(),
    authorId: int('author_id').notNull(),
    parentId: int('parent_id'),
    body: text('body').notNull(),
    status: mysqlEnum('status', COMMENT_STATUSES).notNull().default('visible'),
    editedAt: datetime('edited_at', { mode: 'date' }),
    hiddenAt: datetime('hidden_at', { mode: 'date' }),
    deletedAt: datetime('deleted_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [
    foreignKey({
      name: 'comments_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'comments_parent_fk',
      columns: [t.parentId],
      foreignColumns: [t.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'comments_author_fk',
      columns: [t.authorId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
    index('comments_journal_idx').on(t.journalId, t.createdAt),
    index('comments_author_idx').on(t.authorId, t.status),
    index('comments_status_idx').on(t.status, t.createdAt),
  ],
);

/** Who follows which maker. */
export const follows = mysqlTable(
  'follows',
  {
    followerId: int('follower_id').notNull(),
    followeeId: int('followee_id').notNull(),
    createdAt: createdAt(),
  },
  (t) => [
    primaryKey({ name: 'follows_pk', columns: [t.followerId, t.followeeId] }),
    foreignKey({
      name: 'follows_follower_fk',
      columns: [t.followerId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'follows_followee_fk',
      columns: [t.followeeId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
    index('follows_followee_idx').on(t.followeeId),
  ],
);

/**
 * A member's in-app notifications. Comment notices point at the comment, so a comment that is
 * later hidden or deleted takes its notices out of the list without a second write.
 */
export const notifications = mysqlTable(
  'notifications',
  {
    id: int('id').autoincrement().primaryKey(),
    userId: int('user_id').notNull(),
    kind: mysqlEnum('kind', NOTIFICATION_KINDS).notNull(),
    actorId: int('actor_id'),
    journalId: int('journal_id'),
    commentId: int('comment_id'),
    targetType: mysqlEnum('target_type', REPORT_TARGETS),
    targetId: int('target_id'),
    note: varchar('note', { length: 1000 }).notNull().default(''),
    readAt: datetime('read_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [
    foreignKey({
      name: 'notifications_user_fk',
      columns: [t.userId],
      foreignColumns: [users.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'notifications_actor_fk',
      columns: [t.actorId],
      foreignColumns: [users.id],
    }).onDelete('set null'),
    foreignKey({
      name: 'notifications_journal_fk',
      columns: [t.journalId],
      foreignColumns: [journals.id],
    }).onDelete('cascade'),
    foreignKey({
      name: 'notifications_comment_fk',
      columns: [t.commentId],
      foreignColumns: [comments.id],
    }).onDelete('cascade'),
    index('notifications_user_idx').on(t.userId, t.createdAt),
    index('notifications_unread_idx').on(t.userId, t.readAt),
  ],
);

/**
 * A member's report of a journal, photo, tasting or comment. The target is polymorphic (no
 * foreign key), and target_user_id is its author when reported, so the queue can still name
 * them if the item is deleted. Reports outlive their reporter (set null).
 */
export const reports = mysqlTable(
  'reports',
  {
    id: int('id').autoincrement().primaryKey(),
    targetType: mysqlEnum('target_type', REPORT_TARGETS).notNull(),
    targetId: int('target_id').notNull(),
    targetUserId: int('target_user_id'),
    reporterId: int('reporter_id'),
    reason: mysqlEnum('reason', REPORT_REASONS).notNull(),
    details: varchar('details', { length: 1000 }).notNull().default(''),
    status: mysqlEnum('status', REPORT_STATUSES).notNull().default('open'),
    resolvedBy: int('resolved_by'),
    resolvedAt: datetime('resolved_at', { mode: 'date' }),
    createdAt: datetime('created_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [
    foreignKey({
      name: 'reports_target_user_fk',
      columns: [t.targetUserId],
      foreignColumns: [users.id],
    }).onDelete('set null'),
    foreignKey({
      name: 'reports_reporter_fk',
      columns: [t.reporterId],
      foreignColumns: [users.id],
    }).onDelete('set null'),
    foreignKey({
      name: 'reports_resolved_by_fk',
      columns: [t.resolvedBy],
      foreignColumns: [users.id],
    }).onDelete('set null'),
    index('reports_status_idx').on(t.status, t.createdAt),
    index('reports_target_idx').on(t.targetType, t.targetId),
    index('reports_reporter_idx').on(t.reporterId),
  ],
);

/**
 * The audit log: one row per moderation or admin action, never updated or deleted. Handles and
 * a one-line summary are copied in, so an entry stays readable after accounts or items go.
 */
export const auditEntries = mysqlTable(
  'audit_entries',
  {
    id: int('id').autoincrement().primaryKey(),
    actorId: int('actor_id'),
    actorHandle: varchar('actor_handle', { length: 32 }).notNull(),
    action: mysqlEnum('action', AUDIT_ACTIONS).notNull(),
    targetType: mysqlEnum('target_type', AUDIT_TARGETS).notNull(),
    targetId: int('target_id'),
    targetUserId: int('target_user_id'),
    targetUserHandle: varchar('target_user_handle', { length: 32 }),
    reportId: int('report_id'),
    summary: varchar('summary', { length: 300 }).notNull().default(''),
    note: varchar('note', { length: 1000 }).notNull().default(''),
    createdAt: datetime('created_at', { mode: 'date', fsp: 3 })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP(3)`),
  },
  (t) => [
    foreignKey({
      name: 'audit_entries_actor_fk',
      columns: [t.actorId],
      foreignColumns: [users.id],
    }).onDelete('set null'),
    foreignKey({
      name: 'audit_entries_target_user_fk',
      columns: [t.targetUserId],
      foreignColumns: [users.id],
    }).onDelete('set null'),
    foreignKey({
      name: 'audit_entries_report_fk',
      columns: [t.reportId],
      foreignColumns: [reports.id],
    }).onDelete('set null'),
    index('audit_entries_created_idx').on(t.createdAt),
    index('audit_entries_target_idx').on(t.targetType, t.targetId),
    index('audit_entries_actor_idx').on(t.actorId),
  ],
);

/** Site-wide switches moderators change at run time (one row per key). */
export const siteSettings = mysqlTable(
  'site_settings',
  {
    key: varchar('key', { length: 64 }).primaryKey(),
    value: varchar('value', { length: 255 }).notNull(),
    updatedBy: int('updated_by'),
    updatedAt: datetime('updated_at', { mode: 'date' })
      .notNull()
      .default(sql`CURRENT_TIMESTAMP`)
      .$onUpdate(() => new Date()),
  },
  (t) => [
    foreignKey({
      name: 'site_settings_updated_by_fk',
      columns: [t.updatedBy],
      foreignColumns: [users.id],
    }).onDelete('set null'),
  ],
);
