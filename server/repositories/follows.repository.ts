import { and, count, eq } from 'drizzle-orm';
import { follows } from '../db/schema';
import type { Db } from './journals.repository';

/** Records that follower follows followee; resolves true when it is new. */
export async function insertFollow(db: Db, followerId: number, followeeId: number) {
  const [result] = await db.insert(follows).ignore().values({ followerId, followeeId });
  return result.affectedRows > 0;
}

/** Ends a follow; resolves true when there was one. */
export async function deleteFollow(db: Db, followerId: number, followeeId: number) {
  const [result] = await db
    .delete(follows)
    .where(and(eq(follows.followerId, followerId), eq(follows.followeeId, followeeId)));
  return result.affectedRows > 0;
}

/** Whether follower follows followee. */
export async function isFollowing(db: Db, followerId: number, followeeId: number) {
  const [row] = await db
    .select({ id: follows.followeeId })
    .from(follows)
    .where(and(eq(follows.followerId, followerId), eq(follows.followeeId, followeeId)))
    .limit(1);
  return row !== undefined;
}

/** How many members follow this one, and how many this one follows. */
export async function followCounts(db: Db, userId: number) {
  const [[followers], [following]] = await Promise.all([
    db.select({ n: count() }).from(follows).where(eq(follows.followeeId, userId)),
    db.select({ n: count() }).from(follows).where(eq(follows.followerId, userId)),
  ]);
  return { followers: Number(followers.n), following: Number(following.n) };
}

/** The ids of the makers a member follows. */
export async function listFolloweeIds(db: Db, followerId: number): Promise<number[]> {
  const rows = await db
    .select({ id: follows.followeeId })
    .from(follows)
    .where(eq(follows.followerId, followerId));
  return rows.map((r) => r.id);
}
