import type { z } from 'zod';
import type { feedQuerySchema } from '../../shared/schemas/community';
import { journalListQuerySchema } from '../../shared/schemas/journal';
import type { Page } from '../../shared/types/admin';
import type { FollowDto, MemberProfileDto } from '../../shared/types/community';
import type { JournalSummaryDto } from '../../shared/types/journal';
import type { AppContext } from '../context';
import { AppError, NotFoundError } from '../lib/errors';
import { renderComment } from '../lib/markdown';
import type { AuthMember } from '../middleware/authenticate';
import { presentJournalSummary } from '../presenters/journal.presenter';
import {
  deleteFollow,
  followCounts,
  insertFollow,
  isFollowing,
  listFolloweeIds,
} from '../repositories/follows.repository';
import { listCoverPhotos, listJournals } from '../repositories/journals.repository';
import {
  recentTastingsBy,
  scoresGiven,
  scoresReceived,
  topStylesOf,
} from '../repositories/members.repository';
import { deleteNoticesFrom, insertNotifications } from '../repositories/notifications.repository';
import { findUserByHandle, type UserRow } from '../repositories/users.repository';
import { isStaff } from './journal-access';
import { listJournalsFor } from './journals.service';

const PROFILE_JOURNALS = 12;

const round2 = (value: number | null) => (value === null ? null : Math.round(value * 100) / 100);

async function memberByHandle(ctx: AppContext, handle: string): Promise<UserRow> {
  const user = await findUserByHandle(ctx.database.db, handle);
  if (!user) throw new NotFoundError('MEMBER_NOT_FOUND', 'No member has that handle.');
  return user;
}

/**
 * A maker's public profile: name, sanitised bio (no images), their listed journals (the
 * Discover list with the maker filter) and visible tastings, counts, the styles they make
 * most, mean scores, and whether the viewer follows them. Hidden items count nowhere.
 */
export async function getProfile(
  ctx: AppContext,
  viewer: AuthMember | undefined,
  handle: string,
): Promise<MemberProfileDto> {
  const db = ctx.database.db;
  const user = await memberByHandle(ctx, handle);
  const journalQuery = journalListQuerySchema.parse({
    maker: user.handle,
    pageSize: PROFILE_JOURNALS,
  });
  const [journals, tastings, styles, received, given, follow, follows] = await Promise.all([
    listJournalsFor(ctx, undefined, journalQuery),
    recentTastingsBy(db, user.id),
    topStylesOf(db, user.id),
    scoresReceived(db, user.id),
    scoresGiven(db, user.id),
    followCounts(db, user.id),
    viewer && viewer.id !== user.id ? isFollowing(db, viewer.id, user.id) : false,
  ]);
  return {
    handle: user.handle,
    displayName: user.displayName,
    role: user.role,
    bioHtml: renderComment(user.bio ?? ''),
    memberSince: user.createdAt.toISOString(),
    counts: {
      journals: journals.total,
      tastings: given.n,
      followers: follow.followers,
      following: follow.following,
    },
    topStyles: styles.map((s) => ({ slug: s.slug, name: s.name, count: Number(s.count) })),
    scores: {
      received: { mean: round2(received.mean), n: received.n },
      given: { mean: round2(given.mean), n: given.n },
    },
    journals: journals.items,
    tastings: tastings.map((t) => ({
      id: t.id,
      journal: { id: t.journal.id, title: t.journal.title, maker: { ...t.maker } },
      tastedOn: t.tastedOn,
      ageDays: t.ageDays,
      overall: t.overall,
    })),
    viewer: {
      signedIn: viewer !== undefined,
      isSelf: viewer?.id === user.id,
      follows,
    },
    ...(isStaff(viewer) ? { suspended: user.disabledAt !== null } : {}),
  };
}

/** Follows a maker (idempotent); the maker is told once per follower. */
export async function followMaker(
  ctx: AppContext,
  member: AuthMember,
  handle: string,
): Promise<FollowDto> {
  const db = ctx.database.db;
  const maker = await memberByHandle(ctx, handle);
  if (maker.id === member.id)
    throw new AppError(400, 'CANNOT_FOLLOW_SELF', 'You cannot follow yourself.');
  if (await insertFollow(db, member.id, maker.id)) {
    // One notice per follower, however often they unfollow and follow again.
    await deleteNoticesFrom(db, maker.id, 'follow', member.id);
    await insertNotifications(db, [{ userId: maker.id, kind: 'follow', actorId: member.id }]);
  }
  return { following: true, followers: (await followCounts(db, maker.id)).followers };
}

/** Stops following a maker (idempotent). */
export async function unfollowMaker(
  ctx: AppContext,
  member: AuthMember,
  handle: string,
): Promise<FollowDto> {
  const db = ctx.database.db;
  const maker = await memberByHandle(ctx, handle);
  await deleteFollow(db, member.id, maker.id);
  return { following: false, followers: (await followCounts(db, maker.id)).followers };
}

/**
 * A page of the journals of makers the member follows, newest make first: only what Discover
 * lists (published, public, not hidden).
 */
export async function followingFeed(
  ctx: AppContext,
  member: AuthMember,
  query: z.infer<typeof feedQuerySchema>,
): Promise<Page<JournalSummaryDto>> {
  const db = ctx.database.db;
  const makerIds = await listFolloweeIds(db, member.id);
  if (!makerIds.length) return { items: [], total: 0, page: query.page, pageSize: query.pageSize };
  const { rows, total } = await listJournals(db, {
    listedOnly: true,
    makerIds,
    agingBy: 'target',
    sort: 'newest',
    page: query.page,
    pageSize: query.pageSize,
  });
  const covers = await listCoverPhotos(
    db,
    rows.map((r) => r.journal.id),
  );
  const now = new Date();
  return {
    items: rows.map((r) => presentJournalSummary(r, covers.get(r.journal.id) ?? null, now)),
    total,
    page: query.page,
    pageSize: query.pageSize,
  };
}
