import { and, avg, count, desc, eq, isNull } from 'drizzle-orm';
import { journals, styles, tastings, users } from '../db/schema';
import type { Db } from './journals.repository';

// What a profile shows is what anyone may list: published, public, not hidden journals, and
// only the visible tastings on them. The same rule as Discover and Compare.
const listedJournal = and(
  eq(journals.status, 'published'),
  eq(journals.visibility, 'public'),
  isNull(journals.hiddenAt),
)!;
const listedTasting = and(listedJournal, isNull(tastings.hiddenAt))!;

const meanOf = (value: string | null) => (value === null ? null : Number(value));

/** The styles of a member's listed journals with how many of each, most made first. */
export function topStylesOf(db: Db, userId: number, limit = 5) {
  return db
    .select({ slug: styles.slug, name: styles.name, count: count() })
    .from(journals)
    .innerJoin(styles, eq(styles.id, journals.styleId))
    .where(and(eq(journals.userId, userId), listedJournal))
    .groupBy(styles.id, styles.slug, styles.name)
    .orderBy(desc(count()), styles.name)
    .limit(limit);
}

/** Mean overall liking (and count) of the visible tastings of a member's listed journals. */
export async function scoresReceived(db: Db, userId: number) {
  const [row] = await db
    .select({ n: count(), mean: avg(tastings.overall) })
    .from(tastings)
    .innerJoin(journals, eq(journals.id, tastings.journalId))
    .where(and(eq(journals.userId, userId), listedTasting));
  return { n: Number(row.n), mean: meanOf(row.mean) };
}

/** Mean overall liking (and count) a member gave in visible tastings of listed journals. */
export async function scoresGiven(db: Db, userId: number) {
  const [row] = await db
    .select({ n: count(), mean: avg(tastings.overall) })
    .from(tastings)
    .innerJoin(journals, eq(journals.id, tastings.journalId))
    .where(and(eq(tastings.tasterId, userId), listedTasting));
  return { n: Number(row.n), mean: meanOf(row.mean) };
}

/** A member's latest visible tastings of listed journals, with each journal and its maker. */
export function recentTastingsBy(db: Db, userId: number, limit = 10) {
  return db
    .select({
      id: tastings.id,
      tastedOn: tastings.tastedOn,
      ageDays: tastings.ageDays,
      overall: tastings.overall,
      journal: { id: journals.id, title: journals.title },
      maker: { id: users.id, handle: users.handle, displayName: users.displayName },
    })
    .from(tastings)
    .innerJoin(journals, eq(journals.id, tastings.journalId))
    .innerJoin(users, eq(users.id, journals.userId))
    .where(and(eq(tastings.tasterId, userId), listedTasting))
    .orderBy(desc(tastings.tastedOn), desc(tastings.id))
    .limit(limit);
}
