import { eq } from 'drizzle-orm';
import type { AppContext } from '../../server/context';
import { journals, styles } from '../../server/db/schema';
import { refreshCompareFacts } from '../../server/repositories/compare.repository';

type JournalOverrides = Partial<typeof journals.$inferInsert>;

/** The calendar date `days` before today, UTC, as YYYY-MM-DD. */
export const daysAgo = (days: number) =>
  new Date(Date.now() - days * 86_400_000).toISOString().slice(0, 10);

/**
 * Inserts a bare journal row straight into the database (a published public cheddar by
 * default), for tests of features that only need a journal to exist. Its Compare facts are
 * written as the journals repository would.
 */
export async function insertJournalRow(
  ctx: AppContext,
  userId: number,
  overrides: JournalOverrides = {},
): Promise<number> {
  const [style] = await ctx.database.db
    .select({ id: styles.id })
    .from(styles)
    .where(eq(styles.slug, 'cheddar'));
  const [row] = await ctx.database.db
    .insert(journals)
    .values({
      userId,
      styleId: style.id,
      title: 'Test cheddar',
      makeDate: daysAgo(30),
      status: 'published',
      visibility: 'public',
      wheelStatus: 'aging',
      milkVolumeL: 15,
      species: 'cow',
      heatTreatment: 'pasteurised',
      notes: '',
      agingTargetDays: 90,
      publishedAt: new Date(),
      ...overrides,
    })
    .$returningId();
  await refreshCompareFacts(ctx.database.db, row.id);
  return row.id;
}
