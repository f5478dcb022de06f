import { aliasedTable, and, asc, count, eq, inArray, isNull, or, sql, type SQL } from 'drizzle-orm';
import { comments, journals, users } from '../db/schema';
import type { Db, MakerCols } from './journals.repository';

export type CommentRow = typeof comments.$inferSelect;
export type NewCommentRow = typeof comments.$inferInsert;

const authorCols = { id: users.id, handle: users.handle, displayName: users.displayName };

/** Who reads a thread: their id, and whether they are staff (who see every comment). */
export type CommentViewer = { id: number; staff: boolean } | undefined;

/**
 * The comments of table t that a viewer sees: everyone sees visible ones; the author also
 * their own pending or hidden ones; staff everything; nobody a deleted one.
 */
function seenBy(t: typeof comments, viewer: CommentViewer): SQL {
  if (viewer?.staff) return isNull(t.deletedAt);
  const open = and(eq(t.status, 'visible'), isNull(t.hiddenAt))!;
  return and(isNull(t.deletedAt), viewer ? or(open, eq(t.authorId, viewer.id))! : open)!;
}

/** What everyone sees (counts, notifications, profiles). */
export const publicComment = (t: typeof comments = comments) => seenBy(t, undefined);

/** Inserts a comment; resolves with its id. */
export async function insertComment(db: Db, row: NewCommentRow): Promise<number> {
  const [result] = await db.insert(comments).values(row).$returningId();
  return result.id;
}

/** Updates some columns of a comment. */
export async function updateComment(db: Db, id: number, set: Partial<NewCommentRow>) {
  await db.update(comments).set(set).where(eq(comments.id, id));
}

/** One comment with its author and what the rules need of its journal, or undefined. */
export async function findComment(db: Db, id: number) {
  const [row] = await db
    .select({
      comment: comments,
      author: authorCols,
      journal: {
        id: journals.id,
        userId: journals.userId,
        title: journals.title,
        status: journals.status,
        visibility: journals.visibility,
        hiddenAt: journals.hiddenAt,
      },
    })
    .from(comments)
    .innerJoin(users, eq(users.id, comments.authorId))
    .innerJoin(journals, eq(journals.id, comments.journalId))
    .where(eq(comments.id, id))
    .limit(1);
  return row;
}

export type CommentWithAuthor = { comment: CommentRow; author: MakerCols };

/**
 * One page of a journal's top-level comments, oldest first, as the viewer sees them: each
 * one they may read, and each one they may not (deleted, hidden) that has a reply they may
 * read, so replies keep their context. Resolves with the page, every reply of it the viewer
 * may read, and how many threads there are.
 */
export async function listJournalComments(
  db: Db,
  journalId: number,
  viewer: CommentViewer,
  page: { page: number; pageSize: number },
) {
  const reply = aliasedTable(comments, 'reply');
  const hasSeenReply = sql`EXISTS (SELECT 1 FROM ${sql.raw('`comments` AS `reply`')} WHERE ${reply.parentId} = ${comments.id} AND ${seenBy(reply, viewer)})`;
  const where = and(
    eq(comments.journalId, journalId),
    isNull(comments.parentId),
    or(seenBy(comments, viewer), hasSeenReply),
  );
  const [threads, [{ total }]] = await Promise.all([
    db
      .select({ comment: comments, author: authorCols })
      .from(comments)
      .innerJoin(users, eq(users.id, comments.authorId))
      .where(where)
      .orderBy(asc(comments.createdAt), asc(comments.id))
      .limit(page.pageSize)
      .offset((page.page - 1) * page.pageSize),
    db.select({ total: count() }).from(comments).where(where),
  ]);
  const ids = threads.map((t) => t.comment.id);
  const replies = ids.length
    ? await db
        .select({ comment: comments, author: authorCols })
        .from(comments)
        .innerJoin(users, eq(users.id, comments.authorId))
        .where(and(inArray(comments.parentId, ids), seenBy(comments, viewer)))
        .orderBy(asc(comments.createdAt), asc(comments.id))
    : [];
  return { threads, replies, threadCount: Number(total) };
}

/** How many comments of a journal everyone can see (replies included). */
export async function countPublicComments(db: Db, journalId: number): Promise<number> {
  const [{ total }] = await db
    .select({ total: count() })
    .from(comments)
    .where(and(eq(comments.journalId, journalId), publicComment()));
  return Number(total);
}

/** How many of a member's comments are visible to everyone (for the new-member hold). */
export async function countVisibleCommentsBy(db: Db, authorId: number): Promise<number> {
  const [{ total }] = await db
    .select({ total: count() })
    .from(comments)
    .where(and(eq(comments.authorId, authorId), publicComment()));
  return Number(total);
}

/** Comments held for review (pending, not rejected, not deleted), oldest first. */
export async function listHeldComments(db: Db, page: { page: number; pageSize: number }) {
  const where = and(
    eq(comments.status, 'pending'),
    isNull(comments.hiddenAt),
    isNull(comments.deletedAt),
  );
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({
        comment: comments,
        author: authorCols,
        journal: { id: journals.id, title: journals.title },
      })
      .from(comments)
      .innerJoin(users, eq(users.id, comments.authorId))
      .innerJoin(journals, eq(journals.id, comments.journalId))
      .where(where)
      .orderBy(asc(comments.createdAt), asc(comments.id))
      .limit(page.pageSize)
      .offset((page.page - 1) * page.pageSize),
    db.select({ total: count() }).from(comments).where(where),
  ]);
  return { rows, total: Number(total) };
}
