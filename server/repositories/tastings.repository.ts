import { and, asc, eq, gt, isNull, ne, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { journals, styles, users } from '../db/schema';
import { tastingInvites, tastings } from '../db/schema/tastings';
import { refreshCompareFacts } from './compare.repository';

type Db = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

export type TastingRow = typeof tastings.$inferSelect;
export type NewTastingRow = typeof tastings.$inferInsert;

const tasterCols = { id: users.id, handle: users.handle, displayName: users.displayName };

/** A journal's tastings with their tasters, oldest first; hidden ones only when asked. */
export function listTastingsForJournal(
  db: Database,
  journalId: number,
  opts: { includeHiddenFor?: number | 'all' } = {},
) {
  const visible =
    opts.includeHiddenFor === 'all'
      ? undefined
      : opts.includeHiddenFor
        ? sql`(${tastings.hiddenAt} IS NULL OR ${tastings.tasterId} = ${opts.includeHiddenFor})`
        : isNull(tastings.hiddenAt);
  return db
    .select({ tasting: tastings, taster: tasterCols })
    .from(tastings)
    .innerJoin(users, eq(users.id, tastings.tasterId))
    .where(and(eq(tastings.journalId, journalId), visible))
    .orderBy(asc(tastings.tastedOn), asc(tastings.id));
}

/** One tasting with its taster, or undefined. */
export async function findTasting(db: Database, id: number) {
  const [row] = await db
    .select({ tasting: tastings, taster: tasterCols })
    .from(tastings)
    .innerJoin(users, eq(users.id, tastings.tasterId))
    .where(eq(tastings.id, id))
    .limit(1);
  return row;
}

// Every tasting write runs in one transaction with the journal's figures it changes (tasting
// stats, Compare's facts), the journal row locked first so two writes to one journal's
// tastings run in turn instead of deadlocking on each other's rows.
async function lockJournalRow(db: Db, journalId: number): Promise<void> {
  await db
    .select({ id: journals.id })
    .from(journals)
    .where(eq(journals.id, journalId))
    .for('update');
}

async function journalOfTasting(db: Db, id: number): Promise<number | undefined> {
  const [row] = await db
    .select({ journalId: tastings.journalId })
    .from(tastings)
    .where(eq(tastings.id, id))
    .limit(1);
  return row?.journalId;
}

/** Inserts a tasting and refreshes its journal's figures; resolves with its id. */
export async function insertTasting(db: Db, row: NewTastingRow): Promise<number> {
  return db.transaction(async (tx) => {
    await lockJournalRow(tx, row.journalId);
    const [result] = await tx.insert(tastings).values(row).$returningId();
    await refreshJournalTastingStats(tx, row.journalId);
    return result.id;
  });
}

/** Updates some columns of a tasting (hiding it too) and refreshes its journal's figures. */
export async function updateTasting(
  db: Db,
  id: number,
  set: Partial<NewTastingRow>,
): Promise<void> {
  await db.transaction(async (tx) => {
    const journalId = await journalOfTasting(tx, id);
    if (journalId === undefined) return;
    await lockJournalRow(tx, journalId);
    await tx.update(tastings).set(set).where(eq(tastings.id, id));
    await refreshJournalTastingStats(tx, journalId);
  });
}

/** Deletes a tasting and refreshes its journal's figures. */
export async function deleteTasting(db: Db, id: number): Promise<void> {
  await db.transaction(async (tx) => {
    const journalId = await journalOfTasting(tx, id);
    if (journalId === undefined) return;
    await lockJournalRow(tx, journalId);
    await tx.delete(tastings).where(eq(tastings.id, id));
    await refreshJournalTastingStats(tx, journalId);
  });
}

/**
 * Recomputes a journal's tasting count, mean overall liking and latest tasted age from its
 * visible tastings, in one statement, so Discover can filter and sort on them; then
 * Compare's facts for the journal.
 */
export async function refreshJournalTastingStats(db: Db, journalId: number): Promise<void> {
  await db.execute(sql`
    UPDATE journals j
    LEFT JOIN (
      SELECT journal_id, COUNT(*) AS n, SUM(overall) / CAST(COUNT(*) AS DOUBLE) AS mean_overall,
             MAX(age_days) AS last_age
      FROM tastings WHERE journal_id = ${journalId} AND hidden_at IS NULL GROUP BY journal_id
    ) s ON s.journal_id = j.id
    SET j.tasting_count = COALESCE(s.n, 0), j.mean_overall = s.mean_overall, j.last_tasted_age_days = s.last_age
    WHERE j.id = ${journalId}`);
  await refreshCompareFacts(db, journalId);
}

/**
 * The journals other than the member's own that the member has tasted: their figures change
 * when the member's account (and so the tastings) goes.
 */
export async function journalIdsTastedBy(db: Db, userId: number): Promise<number[]> {
  const rows = await db
    .selectDistinct({ id: tastings.journalId })
    .from(tastings)
    .innerJoin(journals, eq(journals.id, tastings.journalId))
    .where(and(eq(tastings.tasterId, userId), ne(journals.userId, userId)))
    .orderBy(asc(tastings.journalId));
  return rows.map((r) => r.id);
}

/** Recomputes every tasting's age for a journal after its make date changed. */
export async function refreshTastingAges(db: Db, journalId: number): Promise<void> {
  await db.execute(sql`
    UPDATE tastings t JOIN journals j ON j.id = t.journal_id
    SET t.age_days = DATEDIFF(t.tasted_on, j.make_date)
    WHERE t.journal_id = ${journalId}`);
  await refreshJournalTastingStats(db, journalId);
}

/** Stores a tasting invite (only the code's hash). */
export async function insertInvite(
  db: Database,
  row: { journalId: number; createdBy: number; codeHash: string; expiresAt: Date },
): Promise<void> {
  await db.insert(tastingInvites).values(row);
}

/** A live invite for this journal with this code hash, or undefined. */
export async function findLiveInvite(db: Database, journalId: number, codeHash: string) {
  const [row] = await db
    .select()
    .from(tastingInvites)
    .where(
      and(
        eq(tastingInvites.journalId, journalId),
        eq(tastingInvites.codeHash, codeHash),
        gt(tastingInvites.expiresAt, new Date()),
      ),
    )
    .limit(1);
  return row;
}

/** Journal columns the tasting rules need. */
export async function findJournalForTasting(db: Database, journalId: number) {
  const [row] = await db
    .select({
      id: journals.id,
      userId: journals.userId,
      title: journals.title,
      makeDate: journals.makeDate,
      status: journals.status,
      visibility: journals.visibility,
      hiddenAt: journals.hiddenAt,
      wheelStatus: journals.wheelStatus,
      openedOn: journals.openedOn,
      heatTreatment: journals.heatTreatment,
      styleSlug: styles.slug,
    })
    .from(journals)
    .innerJoin(styles, eq(styles.id, journals.styleId))
    .where(eq(journals.id, journalId))
    .limit(1);
  return row;
}

export type JournalForTasting = NonNullable<Awaited<ReturnType<typeof findJournalForTasting>>>;
