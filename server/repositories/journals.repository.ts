import { and, asc, count, desc, eq, gte, inArray, isNull, lte, sql, type SQL } from 'drizzle-orm';
import type { Database } from '../db/client';
import {
  journalIngredients,
  journalPhotos,
  journalPressStages,
  journalReadings,
  journals,
  journalSteps,
  journalWeighIns,
  styles,
  users,
} from '../db/schema';
import type {
  HeatTreatment,
  JournalSort,
  RindTreatment,
  Species,
} from '../../shared/constants/journal';
import { refreshCompareFacts } from './compare.repository';

/** The pool or an open transaction: every function here runs on either. */
export type Db = Database | Parameters<Parameters<Database['transaction']>[0]>[0];

export type JournalRow = typeof journals.$inferSelect;
export type NewJournalRow = typeof journals.$inferInsert;
export type IngredientRow = typeof journalIngredients.$inferSelect;
export type StepRow = typeof journalSteps.$inferSelect;
export type PressStageRow = typeof journalPressStages.$inferSelect;
export type WeighInRow = typeof journalWeighIns.$inferSelect;
export type ReadingRow = typeof journalReadings.$inferSelect;
export type PhotoRow = typeof journalPhotos.$inferSelect;
export type StyleRow = typeof styles.$inferSelect;

/** The child rows of one journal, without journal_id and position (the array order is it). */
export type JournalChildren = {
  ingredients: Omit<IngredientRow, 'journalId' | 'position'>[];
  steps: Omit<StepRow, 'journalId' | 'position'>[];
  pressStages: Omit<PressStageRow, 'journalId' | 'position'>[];
  weighIns: Omit<WeighInRow, 'id' | 'journalId'>[];
};

export type MakerCols = { id: number; handle: string; displayName: string };
export type StyleCols = { slug: string; name: string; family: string };

const makerCols = { id: users.id, handle: users.handle, displayName: users.displayName };
const styleCols = { slug: styles.slug, name: styles.name, family: styles.family };

// --- styles and makers ------------------------------------------------------------------

/** One style by slug, or undefined. */
export async function findStyleBySlug(db: Db, slug: string): Promise<StyleRow | undefined> {
  const [row] = await db.select().from(styles).where(eq(styles.slug, slug)).limit(1);
  return row;
}

/** The ids of the styles with these slugs (unknown slugs are left out). */
export async function findStyleIdsBySlugs(db: Db, slugs: readonly string[]): Promise<number[]> {
  if (!slugs.length) return [];
  const rows = await db
    .select({ id: styles.id })
    .from(styles)
    .where(inArray(styles.slug, [...slugs]));
  return rows.map((r) => r.id);
}

// --- one journal --------------------------------------------------------------------------

/** One journal row by id, or undefined. */
export async function findJournalById(db: Db, id: number): Promise<JournalRow | undefined> {
  const [row] = await db.select().from(journals).where(eq(journals.id, id)).limit(1);
  return row;
}

/** One journal with its maker and style, or undefined. */
export async function findJournalWithRefs(db: Db, id: number) {
  const [row] = await db
    .select({ journal: journals, maker: makerCols, style: styleCols })
    .from(journals)
    .innerJoin(users, eq(users.id, journals.userId))
    .innerJoin(styles, eq(styles.id, journals.styleId))
    .where(eq(journals.id, id))
    .limit(1);
  return row;
}

/** A journal's title, owner, visibility and maker, for the "started from" link. */
export async function findJournalRef(db: Db, id: number) {
  const [row] = await db
    .select({
      id: journals.id,
      title: journals.title,
      userId: journals.userId,
      status: journals.status,
      visibility: journals.visibility,
      hiddenAt: journals.hiddenAt,
      maker: makerCols,
    })
    .from(journals)
    .innerJoin(users, eq(users.id, journals.userId))
    .where(eq(journals.id, id))
    .limit(1);
  return row;
}

/** Locks a journal row until the transaction ends, so writes to one journal run in turn. */
export async function lockJournal(db: Db, id: number): Promise<void> {
  await db.select({ id: journals.id }).from(journals).where(eq(journals.id, id)).for('update');
}

/** Inserts a journal row (and its Compare facts, in one transaction); resolves with its id. */
export async function insertJournal(db: Db, row: NewJournalRow): Promise<number> {
  return db.transaction(async (tx) => {
    const [result] = await tx.insert(journals).values(row).$returningId();
    await refreshCompareFacts(tx, result.id);
    return result.id;
  });
}

/** Updates some columns of a journal (and its Compare facts, in one transaction). */
export async function updateJournal(
  db: Db,
  id: number,
  set: Partial<NewJournalRow>,
): Promise<void> {
  await db.transaction(async (tx) => {
    await tx.update(journals).set(set).where(eq(journals.id, id));
    await refreshCompareFacts(tx, id);
  });
}

/** Deletes a journal; its child rows and photo rows cascade. */
export async function deleteJournal(db: Db, id: number): Promise<void> {
  await db.delete(journals).where(eq(journals.id, id));
}

/** Replaces the ingredients, steps, press stages and weigh-ins of a journal (run in a transaction). */
export async function replaceJournalChildren(
  db: Db,
  journalId: number,
  children: JournalChildren,
): Promise<void> {
  await db.delete(journalIngredients).where(eq(journalIngredients.journalId, journalId));
  await db.delete(journalSteps).where(eq(journalSteps.journalId, journalId));
  await db.delete(journalPressStages).where(eq(journalPressStages.journalId, journalId));
  await db.delete(journalWeighIns).where(eq(journalWeighIns.journalId, journalId));
  await insertJournalChildren(db, journalId, children);
}

/** Inserts the child rows of a new journal, positions taken from the array order. */
export async function insertJournalChildren(
  db: Db,
  journalId: number,
  children: JournalChildren,
): Promise<void> {
  if (children.ingredients.length) {
    await db
      .insert(journalIngredients)
      .values(children.ingredients.map((row, position) => ({ ...row, journalId, position })));
  }
  if (children.steps.length) {
    await db
      .insert(journalSteps)
      .values(children.steps.map((row, position) => ({ ...row, journalId, position })));
  }
  if (children.pressStages.length) {
    await db
      .insert(journalPressStages)
      .values(children.pressStages.map((row, position) => ({ ...row, journalId, position })));
  }
  if (children.weighIns.length) {
    await db
      .insert(journalWeighIns)
      .values(children.weighIns.map((row) => ({ ...row, journalId })));
  }
}

/** Every child row of some journals (ingredients, steps, stages, weigh-ins, readings, photos). */
export async function listJournalChildren(db: Db, journalIds: readonly number[]) {
  const ids = [...journalIds];
  if (!ids.length) {
    return {
      ingredients: [] as IngredientRow[],
      steps: [] as StepRow[],
      pressStages: [] as PressStageRow[],
      weighIns: [] as WeighInRow[],
      readings: [] as ReadingRow[],
      photos: [] as PhotoRow[],
    };
  }
  const [ingredients, steps, pressStages, weighIns, readings, photos] = await Promise.all([
    db
      .select()
      .from(journalIngredients)
      .where(inArray(journalIngredients.journalId, ids))
      .orderBy(asc(journalIngredients.journalId), asc(journalIngredients.position)),
    db
      .select()
      .from(journalSteps)
      .where(inArray(journalSteps.journalId, ids))
      .orderBy(asc(journalSteps.journalId), asc(journalSteps.position)),
    db
      .select()
      .from(journalPressStages)
      .where(inArray(journalPressStages.journalId, ids))
      .orderBy(asc(journalPressStages.journalId), asc(journalPressStages.position)),
    db
      .select()
      .from(journalWeighIns)
      .where(inArray(journalWeighIns.journalId, ids))
      .orderBy(asc(journalWeighIns.journalId), asc(journalWeighIns.date), asc(journalWeighIns.id)),
    db
      .select()
      .from(journalReadings)
      .where(inArray(journalReadings.journalId, ids))
      .orderBy(
        asc(journalReadings.journalId),
        asc(journalReadings.takenAt),
        asc(journalReadings.id),
      ),
    db
      .select()
      .from(journalPhotos)
      .where(inArray(journalPhotos.journalId, ids))
      .orderBy(asc(journalPhotos.journalId), asc(journalPhotos.position), asc(journalPhotos.id)),
  ]);
  return { ingredients, steps, pressStages, weighIns, readings, photos };
}

// --- weigh-ins and readings -------------------------------------------------------------

/** Appends one weigh-in to a journal. */
export async function insertWeighIn(
  db: Db,
  row: Omit<typeof journalWeighIns.$inferInsert, 'id'>,
): Promise<void> {
  await db.insert(journalWeighIns).values(row);
}

/** The readings with these client ids, whatever journal they belong to. */
export async function findReadingsByIds(db: Db, ids: readonly string[]): Promise<ReadingRow[]> {
  if (!ids.length) return [];
  return db
    .select()
    .from(journalReadings)
    .where(inArray(journalReadings.id, [...ids]));
}

/**
 * Inserts readings; one whose id is already stored is left as it was (a replay of the same
 * write from an offline queue), so the first write wins.
 */
export async function insertReadingsOnce(
  db: Db,
  rows: readonly Omit<typeof journalReadings.$inferInsert, 'createdAt'>[],
): Promise<void> {
  if (!rows.length) return;
  await db
    .insert(journalReadings)
    .values([...rows])
    .onDuplicateKeyUpdate({ set: { id: sql`${journalReadings.id}` } });
}

// --- lists ---------------------------------------------------------------------------------

export type JournalListFilter = {
  /** Only this member's journals, whatever their status and visibility. */
  ownerId?: number;
  /** Only what others may list: published, public, not hidden. */
  listedOnly: boolean;
  makerId?: number;
  /** Only journals by these makers (the feed of makers a member follows). */
  makerIds?: number[];
  styleIds?: number[];
  species?: Species[];
  heat?: HeatTreatment[];
  rind?: RindTreatment[];
  agingBy: 'target' | 'tasted';
  agingMin?: number;
  agingMax?: number;
  minScore?: number;
  /** A BOOLEAN MODE query already made safe (see lib/fulltext). */
  fullText?: string;
  sort: JournalSort;
  page: number;
  pageSize: number;
};

function listConditions(f: JournalListFilter): SQL | undefined {
  const where: SQL[] = [];
  if (f.ownerId !== undefined) where.push(eq(journals.userId, f.ownerId));
  if (f.listedOnly) {
    where.push(
      eq(journals.status, 'published'),
      eq(journals.visibility, 'public'),
      isNull(journals.hiddenAt),
    );
  }
  if (f.makerId !== undefined) where.push(eq(journals.userId, f.makerId));
  if (f.makerIds) where.push(inArray(journals.userId, f.makerIds));
  if (f.styleIds) where.push(inArray(journals.styleId, f.styleIds));
  if (f.species?.length) where.push(inArray(journals.species, f.species));
  if (f.heat?.length) where.push(inArray(journals.heatTreatment, f.heat));
  if (f.rind?.length) where.push(inArray(journals.rindTreatment, f.rind));
  const agingColumn =
    f.agingBy === 'tasted' ? journals.lastTastedAgeDays : journals.agingTargetDays;
  if (f.agingMin !== undefined) where.push(gte(agingColumn, f.agingMin));
  if (f.agingMax !== undefined) where.push(lte(agingColumn, f.agingMax));
  if (f.minScore !== undefined) where.push(gte(journals.meanOverall, f.minScore));
  if (f.fullText) {
    where.push(
      sql`MATCH (${journals.title}, ${journals.notes}) AGAINST (${f.fullText} IN BOOLEAN MODE)`,
    );
  }
  return where.length ? and(...where) : undefined;
}

function listOrder(sort: JournalSort): SQL[] {
  switch (sort) {
    case 'oldest':
      return [asc(journals.makeDate), asc(journals.id)];
    case 'best':
      // NULL sorts lowest in MariaDB, so unscored journals come last when descending.
      return [desc(journals.meanOverall), desc(journals.tastingCount), desc(journals.id)];
    case 'most-tasted':
      return [desc(journals.tastingCount), desc(journals.meanOverall), desc(journals.id)];
    case 'newest':
    default:
      return [desc(journals.makeDate), desc(journals.id)];
  }
}

const summaryCols = {
  id: journals.id,
  userId: journals.userId,
  title: journals.title,
  makeDate: journals.makeDate,
  status: journals.status,
  visibility: journals.visibility,
  wheelStatus: journals.wheelStatus,
  openedOn: journals.openedOn,
  species: journals.species,
  heatTreatment: journals.heatTreatment,
  rindTreatment: journals.rindTreatment,
  milkVolumeL: journals.milkVolumeL,
  agingTargetDays: journals.agingTargetDays,
  tastingCount: journals.tastingCount,
  meanOverall: journals.meanOverall,
  updatedAt: journals.updatedAt,
  hiddenAt: journals.hiddenAt,
};

export type JournalSummaryRow = {
  journal: { [K in keyof typeof summaryCols]: JournalRow[K] };
  maker: MakerCols;
  style: StyleCols;
};

/** One page of journals with maker and style, and the total that match. */
export async function listJournals(
  db: Db,
  filter: JournalListFilter,
): Promise<{ rows: JournalSummaryRow[]; total: number }> {
  const where = listConditions(filter);
  const [rows, [{ total }]] = await Promise.all([
    db
      .select({ journal: summaryCols, maker: makerCols, style: styleCols })
      .from(journals)
      .innerJoin(users, eq(users.id, journals.userId))
      .innerJoin(styles, eq(styles.id, journals.styleId))
      .where(where)
      .orderBy(...listOrder(filter.sort))
      .limit(filter.pageSize)
      .offset((filter.page - 1) * filter.pageSize),
    db.select({ total: count() }).from(journals).where(where),
  ]);
  return { rows, total: Number(total) };
}

/** The first visible photo of each journal (by position), for cards. */
export async function listCoverPhotos(
  db: Db,
  journalIds: readonly number[],
): Promise<Map<number, PhotoRow>> {
  const covers = new Map<number, PhotoRow>();
  if (!journalIds.length) return covers;
  const rows = await db
    .select()
    .from(journalPhotos)
    .where(and(inArray(journalPhotos.journalId, [...journalIds]), isNull(journalPhotos.hiddenAt)))
    .orderBy(asc(journalPhotos.journalId), asc(journalPhotos.position), asc(journalPhotos.id));
  for (const row of rows) if (!covers.has(row.journalId)) covers.set(row.journalId, row);
  return covers;
}

/** Every journal of a member with maker and style, newest make first (for export). */
export async function listJournalsOfMember(db: Db, userId: number) {
  return db
    .select({ journal: journals, maker: makerCols, style: styleCols })
    .from(journals)
    .innerJoin(users, eq(users.id, journals.userId))
    .innerJoin(styles, eq(styles.id, journals.styleId))
    .where(eq(journals.userId, userId))
    .orderBy(desc(journals.makeDate), desc(journals.id));
}
