import { and, count, desc, eq, inArray, like, or, sql, type SQL } from 'drizzle-orm';
import type { Database } from '../db/client';
import { journals, users } from '../db/schema';
import { journalIdsTastedBy, refreshJournalTastingStats } from './tastings.repository';

export type UserRow = typeof users.$inferSelect;
export type NewUserRow = typeof users.$inferInsert;

/** One user by id, or undefined. */
export async function findUserById(db: Database, id: number): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.id, id)).limit(1);
  return row;
}

/** One user by (lower-cased) e-mail, or undefined. */
export async function findUserByEmail(db: Database, email: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.email, email)).limit(1);
  return row;
}

/** One user by handle, or undefined. */
export async function findUserByHandle(db: Database, handle: string): Promise<UserRow | undefined> {
  const [row] = await db.select().from(users).where(eq(users.handle, handle)).limit(1);
  return row;
}

/** Inserts a user; resolves with the new id. */
export async function insertUser(db: Database, row: NewUserRow): Promise<number> {
  const [result] = await db.insert(users).values(row).$returningId();
  return result.id;
}

/** Updates some columns of a user. */
export async function updateUser(
  db: Database,
  id: number,
  set: Partial<NewUserRow>,
): Promise<void> {
  await db.update(users).set(set).where(eq(users.id, id));
}

/**
 * Deletes a user (tokens, journals and tastings cascade); the other makers' journals the user
 * had tasted get their tasting figures and Compare's facts refreshed in the same transaction.
 */
export async function deleteUser(db: Database, id: number): Promise<void> {
  await db.transaction(async (tx) => {
    const tasted = await journalIdsTastedBy(tx, id);
    if (tasted.length) {
      await tx
        .select({ id: journals.id })
        .from(journals)
        .where(inArray(journals.id, tasted))
        .orderBy(journals.id)
        .for('update');
    }
    await tx.delete(users).where(eq(users.id, id));
    for (const journalId of tasted) await refreshJournalTastingStats(tx, journalId);
  });
}

/** A page of users, newest first, optionally filtered by e-mail, handle or name. */
export async function listUsers(
  db: Database,
  opts: { q?: string; page: number; pageSize: number },
) {
  const filters: SQL[] = [];
  if (opts.q) {
    const pattern = `%${opts.q.replace(/[\\%_]/g, (c) => `\\${c}`)}%`;
    filters.push(
      or(
        like(users.email, pattern),
        like(users.handle, pattern),
        like(users.displayName, pattern),
      )!,
    );
  }
  const where = filters.length ? and(...filters) : undefined;
  const [rows, [{ total }]] = await Promise.all([
    db
      .select()
      .from(users)
      .where(where)
      .orderBy(desc(users.createdAt), desc(users.id))
      .limit(opts.pageSize)
      .offset((opts.page - 1) * opts.pageSize),
    db.select({ total: count() }).from(users).where(where),
  ]);
  return { rows, total: Number(total) };
}

/** How many enabled admins there are (so the last one is never demoted or disabled). */
export async function countActiveAdmins(db: Database): Promise<number> {
  const [{ total }] = await db
    .select({ total: count() })
    .from(users)
    .where(and(eq(users.role, 'admin'), sql`${users.disabledAt} IS NULL`));
  return Number(total);
}
