import { aliasedTable, and, count, desc, eq, inArray, or, sql, type SQL } from 'drizzle-orm';
import type { AuditTarget, ReportStatus, ReportTarget } from '../../shared/constants/community';
import {
  auditEntries,
  comments,
  journalPhotos,
  journals,
  reports,
  siteSettings,
  tastings,
  users,
} from '../db/schema';
import { refreshCompareFacts } from './compare.repository';
import type { Db } from './journals.repository';
import { updateTasting } from './tastings.repository';

export type ReportRow = typeof reports.$inferSelect;
export type NewReportRow = typeof reports.$inferInsert;
export type AuditRow = typeof auditEntries.$inferSelect;
export type NewAuditRow = typeof auditEntries.$inferInsert;

// --- reported items ------------------------------------------------------------------------

const journalCols = {
  id: journals.id,
  userId: journals.userId,
  title: journals.title,
  status: journals.status,
  visibility: journals.visibility,
  hiddenAt: journals.hiddenAt,
};

/** The parts of a journal, photo, tasting or comment that moderation needs. */
export type TargetInfo = {
  type: ReportTarget;
  id: number;
  authorId: number;
  hiddenAt: Date | null;
  pending: boolean;
  deleted: boolean;
  /** The journal it belongs to (the journal itself for a journal). */
  journal: {
    id: number;
    userId: number;
    title: string;
    status: 'draft' | 'published';
    visibility: 'public' | 'unlisted' | 'private';
    hiddenAt: Date | null;
  };
  /** The text that shows what it is: notes, caption, comment body, tasting notes. */
  text: string;
  photo: { fileKey: string; widths: string; caption: string } | null;
  tasting: { overall: number; ageDays: number; tastedOn: string } | null;
};

/** One reportable item with its author and journal, or undefined when it does not exist. */
export async function findTarget(
  db: Db,
  type: ReportTarget,
  id: number,
): Promise<TargetInfo | undefined> {
  const base = { type, id, pending: false, deleted: false, photo: null, tasting: null };
  switch (type) {
    case 'journal': {
      const [row] = await db
        .select({ journal: journalCols, notes: journals.notes })
        .from(journals)
        .where(eq(journals.id, id))
        .limit(1);
      if (!row) return undefined;
      const { journal } = row;
      return {
        ...base,
        authorId: journal.userId,
        hiddenAt: journal.hiddenAt,
        journal,
        text: row.notes,
      };
    }
    case 'photo': {
      const [row] = await db
        .select({ photo: journalPhotos, journal: journalCols })
        .from(journalPhotos)
        .innerJoin(journals, eq(journals.id, journalPhotos.journalId))
        .where(eq(journalPhotos.id, id))
        .limit(1);
      if (!row) return undefined;
      return {
        ...base,
        authorId: row.journal.userId,
        hiddenAt: row.photo.hiddenAt,
        journal: row.journal,
        text: row.photo.caption,
        photo: { fileKey: row.photo.fileKey, widths: row.photo.widths, caption: row.photo.caption },
      };
    }
    case 'tasting': {
      const [row] = await db
        .select({ tasting: tastings, journal: journalCols })
        .from(tastings)
        .innerJoin(journals, eq(journals.id, tastings.journalId))
        .where(eq(tastings.id, id))
        .limit(1);
      if (!row) return undefined;
      const t = row.tasting;
      return {
        ...base,
        authorId: t.tasterId,
        hiddenAt: t.hiddenAt,
        journal: row.journal,
        text: t.notes,
        tasting: { overall: t.overall, ageDays: t.ageDays, tastedOn: t.tastedOn },
      };
    }
    case 'comment': {
      const [row] = await db
        .select({ comment: comments, journal: journalCols })
        .from(comments)
        .innerJoin(journals, eq(journals.id, comments.journalId))
        .where(eq(comments.id, id))
        .limit(1);
      if (!row) return undefined;
      const c = row.comment;
      return {
        ...base,
        authorId: c.authorId,
        hiddenAt: c.hiddenAt,
        pending: c.status === 'pending',
        deleted: c.deletedAt !== null,
        journal: row.journal,
        text: c.body,
      };
    }
  }
}

/** Sets or clears hidden_at on a journal, photo, tasting or comment. */
export async function setTargetHidden(
  db: Db,
  type: ReportTarget,
  id: number,
  hiddenAt: Date | null,
): Promise<void> {
  switch (type) {
    case 'journal':
      await db.update(journals).set({ hiddenAt }).where(eq(journals.id, id));
      await refreshCompareFacts(db, id);
      return;
    case 'photo':
      await db.update(journalPhotos).set({ hiddenAt }).where(eq(journalPhotos.id, id));
      return;
    case 'tasting':
      // With the journal's tasting figures and Compare's facts, in the caller's transaction.
      await updateTasting(db, id, { hiddenAt });
      return;
    case 'comment':
      await db.update(comments).set({ hiddenAt }).where(eq(comments.id, id));
      return;
  }
}

// --- reports ------------------------------------------------------------------------------

const reporter = aliasedTable(users, 'reporter');
const resolver = aliasedTable(users, 'resolver');

/** Inserts a report; resolves with its id. */
export async function insertReport(db: Db, row: NewReportRow): Promise<number> {
  const [result] = await db.insert(reports).values(row).$returningId();
  return result.id;
}

/** The open report this member already made of this item, if any. */
export async function findOpenReportBy(
  db: Db,
  reporterId: number,
  type: ReportTarget,
  targetId: number,
) {
  const [row] = await db
    .select()
    .from(reports)
    .where(
      and(
        eq(reports.reporterId, reporterId),
        eq(reports.targetType, type),
        eq(reports.targetId, targetId),
        eq(reports.status, 'open'),
      ),
    )
    .limit(1);
  return row;
}

const reportSelection = {
  report: reports,
  reporter: { id: reporter.id, handle: reporter.handle, displayName: reporter.displayName },
  resolver: { id: resolver.id, handle: resolver.handle, displayName: resolver.displayName },
};

/** One report with its reporter and resolver, or undefined. */
export async function findReport(db: Db, id: number) {
  const [row] = await db
    .select(reportSelection)
    .from(reports)
    .leftJoin(reporter, eq(reporter.id, reports.reporterId))
    .leftJoin(resolver, eq(resolver.id, reports.resolvedBy))
    .where(eq(reports.id, id))
    .limit(1);
  return row;
}

export type ReportWithPeople = NonNullable<Awaited<ReturnType<typeof findReport>>>;

/** A page of reports in one status (or all), oldest open first, newest closed first. */
export async function listReports(
  db: Db,
  opts: { status: ReportStatus | 'all'; page: number; pageSize: number },
) {
  const where = opts.status === 'all' ? undefined : eq(reports.status, opts.status);
  const order =
    opts.status === 'open'
      ? [sql`${reports.createdAt} ASC`, sql`${reports.id} ASC`]
      : [desc(reports.createdAt), desc(reports.id)];
  const [rows, [{ n }]] = await Promise.all([
    db
      .select(reportSelection)
      .from(reports)
      .leftJoin(reporter, eq(reporter.id, reports.reporterId))
      .leftJoin(resolver, eq(resolver.id, reports.resolvedBy))
      .where(where)
      .orderBy(...order)
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db.select({ n: count() }).from(reports).where(where),
  ]);
  return { rows, total: Number(n) };
}

/** Every report of some items, newest first, with the reporter's handle. */
export async function listReportsForTargets(
  db: Db,
  targets: readonly { type: ReportTarget; id: number }[],
) {
  if (!targets.length) return [];
  return db
    .select({
      id: reports.id,
      targetType: reports.targetType,
      targetId: reports.targetId,
      reason: reports.reason,
      status: reports.status,
      createdAt: reports.createdAt,
      reporter: reporter.handle,
    })
    .from(reports)
    .leftJoin(reporter, eq(reporter.id, reports.reporterId))
    .where(
      or(...targets.map((t) => and(eq(reports.targetType, t.type), eq(reports.targetId, t.id))!)),
    )
    .orderBy(desc(reports.createdAt), desc(reports.id));
}

/** Closes every open report of an item with one status; resolves with the ids closed. */
export async function resolveOpenReports(
  db: Db,
  type: ReportTarget,
  targetId: number,
  status: Exclude<ReportStatus, 'open'>,
  resolvedBy: number,
): Promise<void> {
  await db
    .update(reports)
    .set({ status, resolvedBy, resolvedAt: new Date() })
    .where(
      and(eq(reports.targetType, type), eq(reports.targetId, targetId), eq(reports.status, 'open')),
    );
}

/** Marks one report resolved (one that was already closed keeps its first resolution). */
export async function resolveReport(
  db: Db,
  id: number,
  status: Exclude<ReportStatus, 'open'>,
  resolvedBy: number,
): Promise<void> {
  await db
    .update(reports)
    .set({ status, resolvedBy, resolvedAt: new Date() })
    .where(and(eq(reports.id, id), eq(reports.status, 'open')));
}

// --- audit log ----------------------------------------------------------------------------

/** Appends one entry to the audit log. */
export async function insertAuditEntry(db: Db, row: NewAuditRow): Promise<void> {
  await db.insert(auditEntries).values(row);
}

/** A page of the audit log, newest first, optionally by one actor. */
export async function listAuditEntries(
  db: Db,
  opts: { page: number; pageSize: number; actorHandle?: string },
) {
  const where = opts.actorHandle ? eq(auditEntries.actorHandle, opts.actorHandle) : undefined;
  const [rows, [{ n }]] = await Promise.all([
    db
      .select()
      .from(auditEntries)
      .where(where)
      .orderBy(desc(auditEntries.createdAt), desc(auditEntries.id))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db.select({ n: count() }).from(auditEntries).where(where),
  ]);
  return { rows, total: Number(n) };
}

/** The audit entries about some items and members, newest first. */
export async function listAuditFor(
  db: Db,
  targets: readonly { type: AuditTarget; id: number }[],
): Promise<AuditRow[]> {
  if (!targets.length) return [];
  const conditions: SQL[] = targets.map((t) =>
    and(eq(auditEntries.targetType, t.type), eq(auditEntries.targetId, t.id))!,
  );
  return db
    .select()
    .from(auditEntries)
    .where(or(...conditions))
    .orderBy(desc(auditEntries.createdAt), desc(auditEntries.id))
    .limit(200);
}

// --- site settings ------------------------------------------------------------------------

/** One setting row, or undefined when it was never set. */
export async function findSetting(db: Db, key: string) {
  const [row] = await db
    .select({
      key: siteSettings.key,
      value: siteSettings.value,
      updatedAt: siteSettings.updatedAt,
      updatedBy: users.handle,
    })
    .from(siteSettings)
    .leftJoin(users, eq(users.id, siteSettings.updatedBy))
    .where(eq(siteSettings.key, key))
    .limit(1);
  return row;
}

/** Writes one setting. */
export async function upsertSetting(
  db: Db,
  key: string,
  value: string,
  updatedBy: number,
): Promise<void> {
  await db
    .insert(siteSettings)
    .values({ key, value, updatedBy })
    .onDuplicateKeyUpdate({ set: { value, updatedBy, updatedAt: new Date() } });
}

/** Ids of the users with these ids that exist (for labelling audit rows). */
export async function findUsersByIds(db: Db, ids: number[]) {
  if (!ids.length) return [];
  return db
    .select({
      id: users.id,
      handle: users.handle,
      displayName: users.displayName,
      role: users.role,
      disabledAt: users.disabledAt,
    })
    .from(users)
    .where(inArray(users.id, ids));
}

/** Sets a member's disabled_at (the suspension), inside the caller's transaction. */
export async function setUserDisabledAt(db: Db, id: number, at: Date | null): Promise<void> {
  await db.update(users).set({ disabledAt: at }).where(eq(users.id, id));
}
