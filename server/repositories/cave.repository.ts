import { and, asc, desc, eq, inArray, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { journals, journalWeighIns, styles, users } from '../db/schema';
import { journalReminders } from '../db/schema/tastings';

export const CAVE_STATUSES = ['making', 'pressing', 'drying', 'aging'] as const;

/** The member's wheels not yet opened, oldest make first, with style and latest weigh-in. */
export async function listCaveWheels(db: Database, userId: number) {
  const rows = await db
    .select({
      id: journals.id,
      title: journals.title,
      styleName: styles.name,
      makeDate: journals.makeDate,
      wheelStatus: journals.wheelStatus,
      agingTargetDays: journals.agingTargetDays,
      agingTempC: journals.agingTempC,
      agingHumidityPercent: journals.agingHumidityPercent,
      rindTreatment: journals.rindTreatment,
      heatTreatment: journals.heatTreatment,
      styleSlug: styles.slug,
    })
    .from(journals)
    .innerJoin(styles, eq(styles.id, journals.styleId))
    .where(and(eq(journals.userId, userId), inArray(journals.wheelStatus, [...CAVE_STATUSES])))
    .orderBy(asc(journals.makeDate), asc(journals.id));
  if (!rows.length) return [];
  const weighIns = await db
    .select({
      journalId: journalWeighIns.journalId,
      date: journalWeighIns.date,
      massKg: journalWeighIns.massKg,
    })
    .from(journalWeighIns)
    .where(
      inArray(
        journalWeighIns.journalId,
        rows.map((r) => r.id),
      ),
    )
    .orderBy(desc(journalWeighIns.date), desc(journalWeighIns.id));
  const latest = new Map<number, { date: string; massKg: number }>();
  for (const w of weighIns)
    if (!latest.has(w.journalId)) latest.set(w.journalId, { date: w.date, massKg: w.massKg });
  return rows.map((r) => ({ ...r, lastWeighIn: latest.get(r.id) ?? null }));
}

/** Sets a journal's wheel status and the day it was opened (null while in the cave). */
export async function setWheelStatus(
  db: Database,
  journalId: number,
  wheelStatus: (typeof journals.$inferInsert)['wheelStatus'],
  openedOn: string | null,
) {
  await db.update(journals).set({ wheelStatus, openedOn }).where(eq(journals.id, journalId));
}

/** Every wheel of a member with an aging target (for the calendar feed). */
export function listReadyDates(db: Database, userId: number) {
  return db
    .select({
      id: journals.id,
      title: journals.title,
      makeDate: journals.makeDate,
      agingTargetDays: journals.agingTargetDays,
      agingCheckDate: journals.agingCheckDate,
      heatTreatment: journals.heatTreatment,
      wheelStatus: journals.wheelStatus,
    })
    .from(journals)
    .where(
      and(
        eq(journals.userId, userId),
        sql`${journals.agingTargetDays} IS NOT NULL`,
        inArray(journals.wheelStatus, [...CAVE_STATUSES]),
      ),
    );
}

/**
 * Inserts a reminder row for every aging wheel whose ready date (or check date) has come,
 * for members who want reminders; the unique key makes a second run a no-op.
 */
export async function queueDueReminders(db: Database, today: string): Promise<number> {
  const statuses = sql.join(
    CAVE_STATUSES.map((s) => sql`${s}`),
    sql`, `,
  );
  const [ready] = await db.execute(sql`
    INSERT IGNORE INTO journal_reminders (journal_id, kind, due_on)
    SELECT j.id, 'ready', DATE_ADD(j.make_date, INTERVAL j.aging_target_days DAY)
    FROM journals j JOIN users u ON u.id = j.user_id
    WHERE j.aging_target_days IS NOT NULL AND j.wheel_status IN (${statuses})
      AND u.reminders_enabled = 1 AND u.disabled_at IS NULL
      AND DATE_ADD(j.make_date, INTERVAL j.aging_target_days DAY) <= ${today}`);
  const [check] = await db.execute(sql`
    INSERT IGNORE INTO journal_reminders (journal_id, kind, due_on)
    SELECT j.id, 'check', j.aging_check_date
    FROM journals j JOIN users u ON u.id = j.user_id
    WHERE j.aging_check_date IS NOT NULL AND j.wheel_status IN (${statuses})
      AND u.reminders_enabled = 1 AND u.disabled_at IS NULL
      AND j.aging_check_date <= ${today}`);
  const affected = (r: unknown) => (r as { affectedRows?: number }).affectedRows ?? 0;
  return affected(ready) + affected(check);
}

export type ClaimedReminder = {
  id: number;
  kind: 'ready' | 'check';
  dueOn: string;
  journalId: number;
  title: string;
  makeDate: string;
  agingTargetDays: number | null;
  heatTreatment: string;
  email: string;
  displayName: string;
};

/**
 * Claims up to `limit` unsent reminders in one transaction (FOR UPDATE SKIP LOCKED, so
 * another app server running the same job takes other rows), marks them sent, and returns
 * them. Rows whose wheel was opened or discarded meanwhile, or whose member turned
 * reminders off, are marked sent without being returned, so they are never mailed.
 */
export async function claimReminders(db: Database, limit = 50): Promise<ClaimedReminder[]> {
  const claimed = await db.transaction(async (tx) => {
    const ids = await tx
      .select({ id: journalReminders.id })
      .from(journalReminders)
      .where(sql`${journalReminders.sentAt} IS NULL`)
      .orderBy(asc(journalReminders.id))
      .limit(limit)
      .for('update', { skipLocked: true });
    if (!ids.length) return [];
    await tx
      .update(journalReminders)
      .set({ sentAt: new Date() })
      .where(
        inArray(
          journalReminders.id,
          ids.map((r) => r.id),
        ),
      );
    return ids.map((r) => r.id);
  });
  if (!claimed.length) return [];
  const rows = await db
    .select({
      id: journalReminders.id,
      kind: journalReminders.kind,
      dueOn: journalReminders.dueOn,
      journalId: journals.id,
      title: journals.title,
      makeDate: journals.makeDate,
      agingTargetDays: journals.agingTargetDays,
      heatTreatment: journals.heatTreatment,
      wheelStatus: journals.wheelStatus,
      email: users.email,
      displayName: users.displayName,
      remindersEnabled: users.remindersEnabled,
      disabledAt: users.disabledAt,
    })
    .from(journalReminders)
    .innerJoin(journals, eq(journals.id, journalReminders.journalId))
    .innerJoin(users, eq(users.id, journals.userId))
    .where(inArray(journalReminders.id, claimed))
    .orderBy(asc(journalReminders.id));
  return rows
    .filter(
      (r) =>
        (CAVE_STATUSES as readonly string[]).includes(r.wheelStatus) &&
        r.remindersEnabled &&
        !r.disabledAt,
    )
    .map(({ wheelStatus: _w, remindersEnabled: _r, disabledAt: _d, ...rest }) => rest);
}

/** Puts a claimed reminder back in the queue after its mail could not be sent. */
export async function releaseReminder(db: Database, id: number): Promise<void> {
  await db.update(journalReminders).set({ sentAt: null }).where(eq(journalReminders.id, id));
}
