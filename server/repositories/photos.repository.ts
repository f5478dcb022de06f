import { and, asc, count, eq, inArray, max, sql } from 'drizzle-orm';
import type { Database } from '../db/client';
import { journalPhotos, journals } from '../db/schema';

export type PhotoRow = typeof journalPhotos.$inferSelect;
export type NewPhotoRow = typeof journalPhotos.$inferInsert;
/** A Drizzle transaction on the app's database. */
export type Tx = Parameters<Parameters<Database['transaction']>[0]>[0];
type Db = Database | Tx;

/** What the photo rules need to know about a journal: its owner and who may see it. */
export async function findJournalAccess(db: Db, journalId: number) {
  const [row] = await db
    .select({
      id: journals.id,
      userId: journals.userId,
      status: journals.status,
      visibility: journals.visibility,
      hiddenAt: journals.hiddenAt,
    })
    .from(journals)
    .where(eq(journals.id, journalId));
  return row ?? null;
}

/** Locks the journal row until the transaction ends, so concurrent uploads count in turn. */
export async function lockJournal(tx: Tx, journalId: number): Promise<boolean> {
  const rows = await tx
    .select({ id: journals.id })
    .from(journals)
    .where(eq(journals.id, journalId))
    .for('update');
  return rows.length > 0;
}

/** How many photos the journal holds and the highest position in use (-1 when none). */
export async function photoCountAndLastPosition(db: Db, journalId: number) {
  const [row] = await db
    .select({ total: count(), last: max(journalPhotos.position) })
    .from(journalPhotos)
    .where(eq(journalPhotos.journalId, journalId));
  return { total: Number(row?.total ?? 0), last: row?.last ?? -1 };
}

/** Inserts the rows and returns their ids in the same order. */
export async function insertPhotos(tx: Tx, rows: NewPhotoRow[]): Promise<number[]> {
  if (!rows.length) return [];
  const ids = await tx.insert(journalPhotos).values(rows).$returningId();
  return ids.map((r) => r.id);
}

/** A journal's photos in display order, hidden ones included (the owner manages them all). */
export function listPhotos(db: Db, journalId: number): Promise<PhotoRow[]> {
  return db
    .select()
    .from(journalPhotos)
    .where(eq(journalPhotos.journalId, journalId))
    .orderBy(asc(journalPhotos.position), asc(journalPhotos.id));
}

export function listPhotosByIds(db: Db, ids: number[]): Promise<PhotoRow[]> {
  if (!ids.length) return Promise.resolve([]);
  return db
    .select()
    .from(journalPhotos)
    .where(inArray(journalPhotos.id, ids))
    .orderBy(asc(journalPhotos.position), asc(journalPhotos.id));
}

export async function findPhoto(db: Db, journalId: number, photoId: number) {
  const [row] = await db
    .select()
    .from(journalPhotos)
    .where(and(eq(journalPhotos.id, photoId), eq(journalPhotos.journalId, journalId)));
  return row ?? null;
}

export async function updatePhotoCaption(db: Db, photoId: number, caption: string) {
  await db.update(journalPhotos).set({ caption }).where(eq(journalPhotos.id, photoId));
}

export async function deletePhotoRow(db: Db, photoId: number) {
  await db.delete(journalPhotos).where(eq(journalPhotos.id, photoId));
}

/** Sets position = index in ids for each photo, in one statement. */
export async function setPhotoPositions(tx: Tx, journalId: number, ids: number[]) {
  if (!ids.length) return;
  const cases = sql.join(
    ids.map((id, position) => sql`WHEN ${id} THEN ${position}`),
    sql` `,
  );
  await tx
    .update(journalPhotos)
    .set({ position: sql`CASE ${journalPhotos.id} ${cases} END` })
    .where(and(eq(journalPhotos.journalId, journalId), inArray(journalPhotos.id, ids)));
}

/** The stored files of a journal's photos: file key and rendition widths. */
export function listPhotoFilesForJournal(db: Db, journalId: number) {
  return db
    .select({ fileKey: journalPhotos.fileKey, widths: journalPhotos.widths })
    .from(journalPhotos)
    .where(eq(journalPhotos.journalId, journalId));
}

/** The stored files of every photo in a member's journals. */
export function listPhotoFilesForMember(db: Db, userId: number) {
  return db
    .select({ fileKey: journalPhotos.fileKey, widths: journalPhotos.widths })
    .from(journalPhotos)
    .innerJoin(journals, eq(journals.id, journalPhotos.journalId))
    .where(eq(journals.userId, userId));
}

/**
 * The photo a stored file belongs to (by its file key), with what decides who may fetch it:
 * the photo's hide and its journal's owner, status, visibility and hide; undefined when no
 * photo row names the key. One lookup on journal_photos_file_key_idx and the journal's key.
 */
export async function findPhotoAccessByFileKey(db: Db, fileKey: string) {
  const [row] = await db
    .select({
      photoHiddenAt: journalPhotos.hiddenAt,
      journal: {
        userId: journals.userId,
        status: journals.status,
        visibility: journals.visibility,
        hiddenAt: journals.hiddenAt,
      },
    })
    .from(journalPhotos)
    .innerJoin(journals, eq(journals.id, journalPhotos.journalId))
    .where(eq(journalPhotos.fileKey, fileKey))
    .limit(1);
  return row;
}
