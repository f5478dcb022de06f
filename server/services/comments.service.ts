import type { z } from 'zod';
import { HELD_FIRST_COMMENTS } from '../../shared/constants/community';
import type { CommentInput, commentListQuerySchema } from '../../shared/schemas/community';
import type { CommentDto, CommentPageDto } from '../../shared/types/community';
import type { AppContext } from '../context';
import { ForbiddenError, NotFoundError, ValidationError } from '../lib/errors';
import { takePoint } from '../lib/rate-limit';
import { mailTemplates } from '../mail/templates';
import type { AuthMember } from '../middleware/authenticate';
import {
  editableUntil,
  plainExcerpt,
  presentComment,
  type CommentReader,
} from '../presenters/community.presenter';
import {
  countPublicComments,
  countVisibleCommentsBy,
  findComment,
  insertComment,
  listJournalComments,
  updateComment,
  type CommentRow,
} from '../repositories/comments.repository';
import { findJournalById, type JournalRow } from '../repositories/journals.repository';
import {
  insertNotifications,
  type NewNotificationRow,
} from '../repositories/notifications.repository';
import { findUserById } from '../repositories/users.repository';
import { hiddenMarks, recordAudit } from './audit.service';
import { accessTo, isStaff } from './journal-access';
import { holdsFirstComments } from './site-settings.service';

type Viewer = AuthMember | undefined;

const readerOf = (viewer: Viewer): CommentReader =>
  viewer ? { id: viewer.id, staff: isStaff(viewer) } : undefined;

const journalNotFound = () =>
  new NotFoundError('JOURNAL_NOT_FOUND', 'There is no journal with that id, or it is not shared.');
const commentNotFound = () =>
  new NotFoundError('COMMENT_NOT_FOUND', 'There is no comment with that id.');

type JournalRef = Pick<
  JournalRow,
  'id' | 'userId' | 'title' | 'status' | 'visibility' | 'hiddenAt'
>;

// Why a viewer may not write on a journal they can read; null when they may.
function closedReason(journal: JournalRef, viewer: Viewer): string | null {
  if (!viewer) return 'Sign in to join the conversation.';
  if (!viewer.emailVerified)
    return 'Confirm your e-mail address to comment: we sent you a link, and you can ask for a new one in your account settings.';
  if (journal.status !== 'published' || journal.visibility === 'private')
    return 'Comments open when the journal is published.';
  if (journal.hiddenAt) return 'Comments are closed while a moderator has this journal hidden.';
  return null;
}

async function readableJournal(ctx: AppContext, viewer: Viewer, id: number): Promise<JournalRow> {
  const journal = await findJournalById(ctx.database.db, id);
  if (!journal || accessTo(journal, viewer) === 'none') throw journalNotFound();
  return journal;
}

/**
 * A page of a journal's conversation as the viewer may see it: top-level comments oldest
 * first, each with its replies; held and hidden ones only for their author and staff.
 */
export async function listComments(
  ctx: AppContext,
  viewer: Viewer,
  journalId: number,
  query: z.infer<typeof commentListQuerySchema>,
): Promise<CommentPageDto> {
  const db = ctx.database.db;
  const journal = await readableJournal(ctx, viewer, journalId);
  const reader = readerOf(viewer);
  const [{ threads, replies, threadCount }, total] = await Promise.all([
    listJournalComments(db, journalId, reader, query),
    countPublicComments(db, journalId),
  ]);
  const now = new Date();
  const byParent = new Map<number, CommentDto[]>();
  for (const r of replies) {
    const list = byParent.get(r.comment.parentId!) ?? [];
    list.push(presentComment(r.comment, r.author, reader, [], now));
    byParent.set(r.comment.parentId!, list);
  }
  const reason = closedReason(journal, viewer);
  // A hidden comment reaches only its author and staff: tell them why it is hidden.
  const hiddenRows = [...threads, ...replies].filter(
    (r) =>
      r.comment.hiddenAt &&
      !r.comment.deletedAt &&
      reader &&
      (reader.staff || reader.id === r.comment.authorId),
  );
  const marks = await hiddenMarks(
    db,
    hiddenRows.map((r) => ({
      type: 'comment' as const,
      id: r.comment.id,
      hiddenAt: r.comment.hiddenAt!,
    })),
  );
  const marked = (c: CommentDto): CommentDto => ({
    ...c,
    hidden: c.state === 'hidden' ? (marks.get(`comment:${c.id}`) ?? null) : null,
    replies: c.replies.map(marked),
  });
  return {
    items: threads.map((t) =>
      marked(presentComment(t.comment, t.author, reader, byParent.get(t.comment.id) ?? [], now)),
    ),
    total,
    threads: threadCount,
    page: query.page,
    pageSize: query.pageSize,
    canComment: reason === null,
    cannotCommentReason: reason,
  };
}

/**
 * Tells the journal's owner (in the app, and by e-mail unless they turned it off) and the
 * author of the comment replied to (in the app) about a comment everyone can now see.
 */
export async function announceComment(
  ctx: AppContext,
  comment: Pick<CommentRow, 'id' | 'journalId' | 'parentId' | 'body' | 'authorId'>,
  journal: Pick<JournalRow, 'id' | 'userId' | 'title'>,
  author: Pick<AuthMember, 'id' | 'displayName'>,
): Promise<void> {
  const db = ctx.database.db;
  const rows: NewNotificationRow[] = [];
  const notified = new Set<number>([author.id]);
  const notice = (userId: number, kind: 'comment' | 'reply') => {
    notified.add(userId);
    rows.push({ userId, kind, actorId: author.id, journalId: journal.id, commentId: comment.id });
  };
  if (comment.parentId) {
    const parent = await findComment(db, comment.parentId);
    if (parent && !notified.has(parent.comment.authorId)) notice(parent.comment.authorId, 'reply');
  }
  if (!notified.has(journal.userId)) notice(journal.userId, 'comment');
  await insertNotifications(db, rows);

  if (journal.userId === author.id) return;
  const owner = await findUserById(db, journal.userId);
  if (!owner || !owner.notifyComments || !owner.emailVerifiedAt || owner.disabledAt) return;
  const mail = mailTemplates.newComment(
    owner.email,
    owner.displayName,
    author.displayName,
    journal.title,
    plainExcerpt(comment.body, 300),
    `${ctx.config.publicUrl}/journals/${journal.id}#comment-${comment.id}`,
  );
  // Not awaited: a slow relay must not hold up the comment; the mailer logs a failure.
  ctx.mailer.send(mail).catch(() => undefined);
}

/**
 * Posts a comment or a reply (replies attach to the top-level comment, one level deep) for a
 * verified member, within the comment rate limit. With "hold first comments" on, a member
 * with fewer than HELD_FIRST_COMMENTS visible comments waits for a moderator; otherwise the
 * owner and the author replied to are told at once.
 */
export async function postComment(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  input: CommentInput,
): Promise<{ comment: CommentDto; held: boolean }> {
  const db = ctx.database.db;
  const journal = await readableJournal(ctx, member, journalId);
  const reason = closedReason(journal, member);
  if (reason) throw new ForbiddenError('COMMENTS_CLOSED', reason);
  let parentId: number | null = null;
  if (input.parentId) {
    const parent = await findComment(db, input.parentId);
    const seen =
      parent &&
      parent.comment.journalId === journalId &&
      presentComment(parent.comment, parent.author, readerOf(member)).state === 'visible';
    if (!seen) {
      throw new ValidationError({
        parentId: 'That comment is not on this journal any more, so you cannot reply to it.',
      });
    }
    parentId = parent.comment.parentId ?? parent.comment.id;
  }
  await takePoint(ctx.limiters.commentMember, `member:${member.id}`);
  const held =
    !isStaff(member) &&
    (await holdsFirstComments(db)) &&
    (await countVisibleCommentsBy(db, member.id)) < HELD_FIRST_COMMENTS;
  const id = await insertComment(db, {
    journalId,
    authorId: member.id,
    parentId,
    body: input.body,
    status: held ? 'pending' : 'visible',
  });
  const stored = (await findComment(db, id))!;
  if (!held) await announceComment(ctx, stored.comment, journal, member);
  ctx.logger.info(
    { event: 'comment-posted', commentId: id, journalId, userId: member.id, held },
    'comment posted',
  );
  return { comment: presentComment(stored.comment, stored.author, readerOf(member)), held };
}

// The comment if the member may see it; 404 otherwise (a hidden one does not exist for others).
async function visibleComment(ctx: AppContext, member: AuthMember, id: number) {
  const found = await findComment(ctx.database.db, id);
  if (!found || found.comment.deletedAt) throw commentNotFound();
  if (accessTo(found.journal, member) === 'none') throw commentNotFound();
  const state = presentComment(found.comment, found.author, readerOf(member)).state;
  if (state === 'removed') throw commentNotFound();
  return { ...found, state };
}

/**
 * Changes a comment's body: only its author, only within the edit window from posting, and
 * never once a moderator has hidden it.
 */
export async function editComment(
  ctx: AppContext,
  member: AuthMember,
  id: number,
  body: string,
): Promise<CommentDto> {
  const { comment, state } = await visibleComment(ctx, member, id);
  if (comment.authorId !== member.id)
    throw new ForbiddenError('NOT_YOUR_COMMENT', 'Only its author can change a comment.');
  if (state === 'hidden')
    throw new ForbiddenError(
      'COMMENT_HIDDEN',
      'A moderator hid this comment, so it stays as it is.',
    );
  if (new Date() >= editableUntil(comment)) {
    throw new ForbiddenError(
      'EDIT_WINDOW_CLOSED',
      'Comments can be changed for 30 minutes after posting. You can still delete it, or add a reply.',
    );
  }
  const db = ctx.database.db;
  await updateComment(db, id, { body, editedAt: new Date() });
  const stored = (await findComment(db, id))!;
  return presentComment(stored.comment, stored.author, readerOf(member));
}

/**
 * Deletes a comment: its author at any time, or a moderator or admin (audited). The row stays,
 * marked deleted, so replies keep their place and a report still shows what was said.
 */
export async function deleteComment(ctx: AppContext, member: AuthMember, id: number, reason = '') {
  const { comment, author } = await visibleComment(ctx, member, id);
  const own = comment.authorId === member.id;
  if (!own && !isStaff(member))
    throw new ForbiddenError(
      'NOT_YOUR_COMMENT',
      'Only its author or a moderator can delete a comment.',
    );
  await ctx.database.db.transaction(async (tx) => {
    await updateComment(tx, id, { deletedAt: new Date() });
    if (!own) {
      await recordAudit(tx, member, {
        action: 'comment-deleted',
        targetType: 'comment',
        targetId: id,
        targetUser: author,
        summary: `Comment “${plainExcerpt(comment.body, 80)}”`,
        note: reason.trim(),
      });
    }
  });
  ctx.logger.info({ event: 'comment-deleted', commentId: id, actorId: member.id, own });
}
