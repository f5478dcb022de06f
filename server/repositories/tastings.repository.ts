import { and, asc, eq, gt, isNull, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { journals, users } from '../db/schema';
import { tastingInvites, tastings } from '../db/schema/tastings';

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

/** Inserts a tasting; resolves with its id. */
export async function insertTasting(db: Database, row: NewTastingRow): Promise<number> {
  const [result] = await db.insert(tastings).values(row).$returningId();
  return result.id;
}

/** Updates some columns of a tasting. */
export async function updateTasting(
  db: Database,
  id: number,
  set: Partial<NewTastingRow>,
): Promise<void> {
  await db.update(tastings).set(set).where(eq(tastings.id, id));
}

/** Deletes a tasting. */
export async function deleteTasting(db: Database, id: number): Promise<void> {
  await db.delete(tastings).where(eq(tastings.id, id));
}

/**
 * Recomputes a journal's tasting count, mean overall liking, Σ overall² and latest tasted age
 * from its visible tastings, in one statement, so Discover can filter and sort on them and
 * Compare can add up overall liking per journal instead of per tasting.
 */
export async function refreshJournalTastingStats(db: Database, journalId: number): Promise<void> {
  await db.execute(sql`
    UPDATE journals j
    LEFT JOIN (
      SELECT journal_id, COUNT(*) AS n, SUM(overall) / CAST(COUNT(*) AS DOUBLE) AS mean_overall,
             MAX(age_days) AS last_age,
             SUM(overall * overall) AS ssq
      FROM tastings WHERE journal_id = ${journalId} AND hidden_at IS NULL GROUP BY journal_id
    ) s ON s.journal_id = j.id
    SET j.tasting_count = COALESCE(s.n, 0), j.mean_overall = s.mean_overall, j.last_tasted_age_days = s.last_age,
        j.overall_sum_squares = s.ssq
    WHERE j.id = ${journalId}`);
}

/** Recomputes every tasting's age for a journal after its make date changed. */
export async function refreshTastingAges(db: Database, journalId: number): Promise<void> {
  await db.execute(sql`
    UPDATE tastings t JOIN journals j ON j.id = t.journal_id
    SET t.age_days = DATEDIFF(t.tasted_on, j.make_date)
    WHERE t.journal_id = ${journalId}`);
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
    })
    .from(journals)
    .where(eq(journals.id, journalId))
    .limit(1);
  return row;
}

export type JournalForTasting = NonNullable<Awaited<ReturnType<typeof findJournalForTasting>>>;
