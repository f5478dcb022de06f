import { and, count, desc, eq, inArray, isNull, or, sql } from 'drizzle-orm';
import { comments, journals, notifications, users } from '../db/schema';
import { publicComment } from './comments.repository';
import type { Db } from './journals.repository';

export type NewNotificationRow = typeof notifications.$inferInsert;

/** Stores notifications. */
export async function insertNotifications(db: Db, rows: NewNotificationRow[]): Promise<void> {
  if (rows.length) await db.insert(notifications).values(rows);
}

/** Removes earlier notices of one kind from one actor (a follow, unfollow, follow loop). */
export async function deleteNoticesFrom(
  db: Db,
  userId: number,
  kind: NewNotificationRow['kind'],
  actorId: number,
): Promise<void> {
  await db
    .delete(notifications)
    .where(
      and(
        eq(notifications.userId, userId),
        eq(notifications.kind, kind),
        eq(notifications.actorId, actorId),
      ),
    );
}

// A notice about a comment shows only while everyone can see the comment: one hidden, held
// or deleted later takes its notices with it.
const stillShown = or(isNull(notifications.commentId), publicComment(comments))!;

/** One page of a member's notifications, newest first, with the total and unread counts. */
export async function listNotifications(
  db: Db,
  userId: number,
  opts: { page: number; pageSize: number; unread?: boolean },
) {
  const mine = and(eq(notifications.userId, userId), stillShown);
  const where = opts.unread ? and(mine, isNull(notifications.readAt)) : mine;
  const base = () =>
    db
      .select({ n: count() })
      .from(notifications)
      .leftJoin(comments, eq(comments.id, notifications.commentId));
  const [rows, [{ n: total }], [{ n: unread }]] = await Promise.all([
    db
      .select({
        notification: notifications,
        actor: { id: users.id, handle: users.handle, displayName: users.displayName },
        journal: { id: journals.id, title: journals.title },
        commentBody: comments.body,
      })
      .from(notifications)
      .leftJoin(comments, eq(comments.id, notifications.commentId))
      .leftJoin(users, eq(users.id, notifications.actorId))
      .leftJoin(journals, eq(journals.id, notifications.journalId))
      .where(where)
      .orderBy(desc(notifications.createdAt), desc(notifications.id))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    base().where(where),
    base().where(and(mine, isNull(notifications.readAt))),
  ]);
  return { rows, total: Number(total), unread: Number(unread) };
}

/** How many of a member's notifications are unread (for the header). */
export async function countUnread(db: Db, userId: number): Promise<number> {
  const [{ n }] = await db
    .select({ n: count() })
    .from(notifications)
    .leftJoin(comments, eq(comments.id, notifications.commentId))
    .where(and(eq(notifications.userId, userId), isNull(notifications.readAt), stillShown));
  return Number(n);
}

/** Marks some (or all) of a member's notifications read; others' ids are left alone. */
export async function markRead(db: Db, userId: number, ids: number[] | 'all'): Promise<number> {
  const [result] = await db
    .update(notifications)
    .set({ readAt: sql`CURRENT_TIMESTAMP` })
    .where(
      and(
        eq(notifications.userId, userId),
        isNull(notifications.readAt),
        ids === 'all' ? undefined : inArray(notifications.id, ids),
      ),
    );
  return result.affectedRows;
}
