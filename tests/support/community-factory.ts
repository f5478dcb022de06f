// Rows for the community tests, written straight into the database when a test only needs
// them to exist (the API paths that make them are tested on their own).
import { eq } from 'drizzle-orm';
import type { AppContext } from '../../server/context';
import { comments, journalPhotos, tastings, users } from '../../server/db/schema';
import { daysAgo, insertJournalRow } from './journal-rows';

/** Inserts a comment (visible by default); resolves with its id. */
export async function insertCommentRow(
  ctx: AppContext,
  journalId: number,
  authorId: number,
  overrides: Partial<typeof comments.$inferInsert> = {},
): Promise<number> {
  const [row] = await ctx.database.db
    .insert(comments)
    .values({ journalId, authorId, body: 'A fine wheel.', ...overrides })
    .$returningId();
  return row.id;
}

/** Inserts a tasting with every score the same; resolves with its id. */
export async function insertTastingRow(
  ctx: AppContext,
  journalId: number,
  tasterId: number,
  overall: number,
  overrides: Partial<typeof tastings.$inferInsert> = {},
): Promise<number> {
  const [row] = await ctx.database.db
    .insert(tastings)
    .values({
      journalId,
      tasterId,
      tastedOn: daysAgo(0),
      ageDays: 30,
      overall,
      appearance: overall,
      aroma: overall,
      flavour: overall,
      texture: overall,
      finish: overall,
      descriptors: [],
      defects: [],
      notes: '',
      ...overrides,
    })
    .$returningId();
  return row.id;
}

/** Inserts a photo row (no files: lists and reports only need the row). */
export async function insertPhotoRow(
  ctx: AppContext,
  journalId: number,
  caption = 'The cut face',
): Promise<number> {
  const key = Math.random().toString(16).slice(2).padEnd(32, '0').slice(0, 32);
  const [row] = await ctx.database.db
    .insert(journalPhotos)
    .values({ journalId, fileKey: key, width: 640, height: 480, widths: '320,640', caption })
    .$returningId();
  return row.id;
}

/**
 * Gives a member enough visible comments that "hold first comments" never holds them, so a
 * test elsewhere that switches the setting on cannot change this one's outcome.
 */
export async function makeSeasoned(ctx: AppContext, userId: number): Promise<void> {
  const journalId = await insertJournalRow(ctx, userId, { title: 'Practice wheel' });
  for (let i = 0; i < 3; i++) await insertCommentRow(ctx, journalId, userId);
}

/** Sets a member's bio directly. */
export async function setBio(ctx: AppContext, userId: number, bio: string): Promise<void> {
  await ctx.database.db.update(users).set({ bio }).where(eq(users.id, userId));
}
