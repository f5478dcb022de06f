import type { z } from 'zod';
import type { ReportAction, ReportTarget } from '../../shared/constants/community';
import type {
  heldCommentActionSchema,
  ReportInput,
  reportActionSchema,
  reportListQuerySchema,
} from '../../shared/schemas/community';
import type { Page } from '../../shared/types/admin';
import type { HeldCommentDto, ReportDto } from '../../shared/types/community';
import type { Role } from '../../shared/types/member';
import type { AppContext } from '../context';
import { AppError, ConflictError, ForbiddenError, NotFoundError } from '../lib/errors';
import { takePoint } from '../lib/rate-limit';
import { mailTemplates } from '../mail/templates';
import type { AuthMember } from '../middleware/authenticate';
import {
  plainExcerpt,
  presentAuditEntry,
  presentHeldComment,
  presentReportedItem,
  targetSummary,
} from '../presenters/community.presenter';
import { findComment, listHeldComments, updateComment } from '../repositories/comments.repository';
import {
  findOpenReportBy,
  findReport,
  findTarget,
  findUsersByIds,
  insertReport,
  listAuditFor,
  listReports,
  listReportsForTargets,
  resolveOpenReports,
  setTargetHidden,
  setUserDisabledAt,
  type ReportWithPeople,
  type TargetInfo,
} from '../repositories/moderation.repository';
import { insertNotifications } from '../repositories/notifications.repository';
import { refreshJournalTastingStats } from '../repositories/tastings.repository';
import { findUserById } from '../repositories/users.repository';
import { recordAudit } from './audit.service';
import { endAllSessions } from './auth.service';
import { announceComment } from './comments.service';
import { accessTo } from './journal-access';

type Person = {
  id: number;
  handle: string;
  displayName: string;
  role: Role;
  disabledAt: Date | null;
};

const nothingToReport = () =>
  new NotFoundError(
    'REPORT_TARGET_NOT_FOUND',
    'There is nothing with that id to report, or it has already been taken down.',
  );

// --- reporting ------------------------------------------------------------------------------

/**
 * Files a member's report of something they can see (not their own), within the report rate
 * limit. A second report of the same item by the same member while the first is open is the
 * first one again.
 */
export async function fileReport(
  ctx: AppContext,
  member: AuthMember,
  input: ReportInput & { details: string },
): Promise<{ id: number; created: boolean }> {
  const db = ctx.database.db;
  const target = await findTarget(db, input.targetType, input.targetId);
  if (!target || target.deleted || target.hiddenAt || target.pending) throw nothingToReport();
  if (accessTo(target.journal, member) === 'none') throw nothingToReport();
  if (target.authorId === member.id)
    throw new AppError(400, 'CANNOT_REPORT_OWN', 'You cannot report your own contributions.');
  const existing = await findOpenReportBy(db, member.id, input.targetType, input.targetId);
  if (existing) return { id: existing.id, created: false };
  await takePoint(ctx.limiters.reportMember, `member:${member.id}`);
  const id = await insertReport(db, {
    targetType: input.targetType,
    targetId: input.targetId,
    targetUserId: target.authorId,
    reporterId: member.id,
    reason: input.reason,
    details: input.details,
  });
  ctx.logger.info(
    { event: 'report-filed', reportId: id, targetType: input.targetType, targetId: input.targetId },
    'report filed',
  );
  return { id, created: true };
}

// --- the queue --------------------------------------------------------------------------------

type Allowed = ReportDto['allowed'];

/**
 * What a moderator or admin may do with a report now. Nobody acts on a report about their own
 * contribution; suspending is for admins, and only of members (staff lose their role first).
 */
function allowedActions(
  actor: AuthMember,
  report: ReportWithPeople['report'],
  target: TargetInfo | undefined,
  author: Person | undefined,
): Allowed {
  const own = (target?.authorId ?? report.targetUserId) === actor.id;
  if (own) return { dismiss: false, hide: false, restore: false, suspend: false };
  const present = target !== undefined && !target.deleted;
  return {
    dismiss: report.status === 'open',
    hide: present && target.hiddenAt === null,
    restore: present && target.hiddenAt !== null,
    suspend:
      actor.role === 'admin' &&
      author !== undefined &&
      author.role === 'member' &&
      author.disabledAt === null,
  };
}

async function presentReports(
  ctx: AppContext,
  actor: AuthMember,
  rows: ReportWithPeople[],
): Promise<ReportDto[]> {
  const db = ctx.database.db;
  const targets = await Promise.all(
    rows.map((r) => findTarget(db, r.report.targetType, r.report.targetId)),
  );
  const authorIds = [
    ...new Set(
      rows.flatMap((r, i) => {
        const id = targets[i]?.authorId ?? r.report.targetUserId;
        return id ? [id] : [];
      }),
    ),
  ];
  const people = new Map<number, Person>(
    (await findUsersByIds(db, authorIds)).map((p) => [p.id, p]),
  );
  const items = rows.map((r) => ({ type: r.report.targetType, id: r.report.targetId }));
  const [siblings, history] = await Promise.all([
    listReportsForTargets(db, items),
    listAuditFor(db, [...items, ...authorIds.map((id) => ({ type: 'member' as const, id }))]),
  ]);
  return rows.map((r, i) => {
    const { report } = r;
    const target = targets[i];
    const authorId = target?.authorId ?? report.targetUserId;
    const author = authorId ? people.get(authorId) : undefined;
    const same = (t: { targetType: string; targetId: number | null }) =>
      t.targetType === report.targetType && t.targetId === report.targetId;
    return {
      id: report.id,
      status: report.status,
      reason: report.reason,
      details: report.details,
      createdAt: report.createdAt.toISOString(),
      resolvedAt: report.resolvedAt?.toISOString() ?? null,
      reporter: r.reporter ? { ...r.reporter } : null,
      resolvedBy: r.resolver ? { ...r.resolver } : null,
      item: presentReportedItem(report.targetType, report.targetId, target, author),
      reports: siblings.filter(same).map((s) => ({
        id: s.id,
        reason: s.reason,
        status: s.status,
        createdAt: s.createdAt.toISOString(),
        reporter: s.reporter,
      })),
      history: history
        .filter(
          (h) =>
            same(h) || (h.targetType === 'member' && authorId !== null && h.targetId === authorId),
        )
        .map(presentAuditEntry),
      allowed: allowedActions(actor, report, target, author),
    };
  });
}

/** A page of reports for moderators and admins, with each item, its reporter and history. */
export async function listReportsFor(
  ctx: AppContext,
  actor: AuthMember,
  query: z.infer<typeof reportListQuerySchema>,
): Promise<Page<ReportDto>> {
  const { rows, total } = await listReports(ctx.database.db, query);
  return {
    items: await presentReports(ctx, actor, rows),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}

/** One report as the queue shows it. */
export async function getReport(ctx: AppContext, actor: AuthMember, id: number) {
  const row = await findReport(ctx.database.db, id);
  if (!row) throw new NotFoundError('REPORT_NOT_FOUND', 'There is no report with that id.');
  return (await presentReports(ctx, actor, [row]))[0];
}

const REFUSED: Record<ReportAction, string> = {
  dismiss: 'This report is already closed.',
  hide: 'There is nothing to hide: it is already hidden, or it was deleted.',
  restore: 'There is nothing to restore: it is not hidden.',
  suspend: 'This member cannot be suspended from here: they are staff, already suspended, or gone.',
};

// The journal a tasting belongs to recomputes its count and mean once the tasting is hidden or
// back, so Discover, profiles and Compare agree with what readers see.
async function afterVisibilityChange(ctx: AppContext, target: TargetInfo) {
  if (target.type === 'tasting')
    await refreshJournalTastingStats(ctx.database.db, target.journal.id);
}

/**
 * Acts on a report: dismiss it, hide or restore the item (its author gets a notification with
 * the note), or suspend its author (admins only: the account is disabled, every session ends,
 * the member is told by e-mail). Every action closes the item's open reports and is written
 * to the audit log in the same transaction.
 */
export async function actOnReport(
  ctx: AppContext,
  actor: AuthMember,
  reportId: number,
  input: z.infer<typeof reportActionSchema>,
): Promise<ReportDto> {
  const db = ctx.database.db;
  const row = await findReport(db, reportId);
  if (!row) throw new NotFoundError('REPORT_NOT_FOUND', 'There is no report with that id.');
  const { report } = row;
  if (input.action === 'suspend' && actor.role !== 'admin')
    throw new ForbiddenError('ADMIN_ONLY', 'Only admins can suspend a member.');
  const target = await findTarget(db, report.targetType, report.targetId);
  const authorId = target?.authorId ?? report.targetUserId;
  const [author] = authorId ? await findUsersByIds(db, [authorId]) : [];
  if (authorId === actor.id) {
    throw new ForbiddenError(
      'OWN_CONTRIBUTION',
      'This report is about something of yours: another moderator has to decide it.',
    );
  }
  const allowed = allowedActions(actor, report, target, author);
  if (!allowed[input.action]) throw new ConflictError('ACTION_NOT_POSSIBLE', REFUSED[input.action]);

  const type: ReportTarget = report.targetType;
  const summary = target ? targetSummary(target) : `Deleted ${type} #${report.targetId}`;
  const targetUser = author ? { id: author.id, handle: author.handle } : null;
  const note = input.note;
  await db.transaction(async (tx) => {
    const audit = (action: Parameters<typeof recordAudit>[2]['action']) =>
      recordAudit(tx, actor, {
        action,
        targetType: type,
        targetId: report.targetId,
        targetUser,
        reportId,
        summary,
        note,
      });
    switch (input.action) {
      case 'dismiss':
        await resolveOpenReports(tx, type, report.targetId, 'dismissed', actor.id);
        await audit('report-dismissed');
        break;
      case 'hide':
      case 'restore': {
        const hide = input.action === 'hide';
        await setTargetHidden(tx, type, report.targetId, hide ? new Date() : null);
        await resolveOpenReports(
          tx,
          type,
          report.targetId,
          hide ? 'actioned' : 'dismissed',
          actor.id,
        );
        await audit(hide ? 'item-hidden' : 'item-restored');
        await insertNotifications(tx, [
          {
            userId: target!.authorId,
            kind: hide ? 'hidden' : 'restored',
            journalId: target!.journal.id,
            targetType: type,
            targetId: report.targetId,
            note,
          },
        ]);
        break;
      }
      case 'suspend':
        await setUserDisabledAt(tx, author!.id, new Date());
        await resolveOpenReports(tx, type, report.targetId, 'actioned', actor.id);
        await recordAudit(tx, actor, {
          action: 'member-suspended',
          targetType: 'member',
          targetId: author!.id,
          targetUser,
          reportId,
          summary: `@${author!.handle}, after a report of: ${summary}`,
          note,
        });
        break;
    }
  });
  if (target && (input.action === 'hide' || input.action === 'restore'))
    await afterVisibilityChange(ctx, target);
  if (input.action === 'suspend') await suspendAftermath(ctx, author!.id, note);
  ctx.logger.info(
    { event: 'moderation-action', action: input.action, reportId, actorId: actor.id, type },
    'moderation action',
  );
  return getReport(ctx, actor, reportId);
}

// Sessions end at once (authenticate also refuses a disabled member on the next request);
// the member hears why by e-mail, since they can no longer sign in to read a notification.
async function suspendAftermath(ctx: AppContext, userId: number, note: string) {
  await endAllSessions(ctx, userId);
  const user = await findUserById(ctx.database.db, userId);
  if (!user) return;
  ctx.mailer
    .send(mailTemplates.accountSuspended(user.email, user.displayName, note))
    .catch(() => undefined);
}

// --- comments held for review -----------------------------------------------------------------

/** The comments waiting for review, oldest first. */
export async function listHeld(
  ctx: AppContext,
  query: { page: number; pageSize: number },
): Promise<Page<HeldCommentDto>> {
  const { rows, total } = await listHeldComments(ctx.database.db, query);
  return { items: rows.map(presentHeldComment), total, page: query.page, pageSize: query.pageSize };
}

/**
 * Approves a held comment (it appears for everyone, and the owner and the author are told) or
 * rejects it (it stays hidden; the author gets the note). Audited.
 */
export async function actOnHeldComment(
  ctx: AppContext,
  actor: AuthMember,
  id: number,
  input: z.infer<typeof heldCommentActionSchema>,
): Promise<void> {
  const db = ctx.database.db;
  const found = await findComment(db, id);
  if (!found) throw new NotFoundError('COMMENT_NOT_FOUND', 'There is no comment with that id.');
  const { comment, author, journal } = found;
  if (comment.status !== 'pending' || comment.hiddenAt || comment.deletedAt)
    throw new ConflictError('NOT_HELD', 'This comment is no longer waiting for review.');
  if (comment.authorId === actor.id)
    throw new ForbiddenError('OWN_CONTRIBUTION', 'Another moderator has to review your comment.');
  const approve = input.action === 'approve';
  await db.transaction(async (tx) => {
    await updateComment(tx, id, approve ? { status: 'visible' } : { hiddenAt: new Date() });
    await recordAudit(tx, actor, {
      action: approve ? 'comment-approved' : 'comment-rejected',
      targetType: 'comment',
      targetId: id,
      targetUser: { id: author.id, handle: author.handle },
      summary: `Comment “${plainExcerpt(comment.body, 80)}” on “${journal.title}”`,
      note: input.note,
    });
    await insertNotifications(tx, [
      {
        userId: author.id,
        kind: approve ? 'comment-approved' : 'hidden',
        journalId: journal.id,
        targetType: 'comment',
        targetId: id,
        note: input.note,
      },
    ]);
  });
  if (approve) await announceComment(ctx, comment, journal, author);
  ctx.logger.info({
    event: 'held-comment',
    action: input.action,
    commentId: id,
    actorId: actor.id,
  });
}
