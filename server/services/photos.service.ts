import { randomBytes } from 'node:crypto';
import { open } from 'node:fs/promises';
import sharp, { type Metadata, type OutputInfo, type SharpOptions } from 'sharp';
import { PHOTO_WIDTHS } from '../../shared/constants/media';
import {
  PHOTO_FIELD,
  PHOTO_FORMATS_TEXT,
  PHOTO_LIMITS,
  photoUploadFieldsSchema,
  type ReorderPhotosInput,
  type UpdatePhotoInput,
} from '../../shared/schemas/photo';
import type { PhotoDto } from '../../shared/types/journal';
import type { AppContext } from '../context';
import { AppError, ForbiddenError, NotFoundError, ValidationError } from '../lib/errors';
import type { AuthMember } from '../middleware/authenticate';
import { fieldsFromZod } from '../middleware/error-handler';
import type { PhotoUpload, UploadedFile } from '../middleware/upload';
import { presentPhoto } from '../presenters/photo.presenter';
import {
  deletePhotoRow,
  findJournalAccess,
  findPhotoAccessByFileKey,
  findPhoto,
  insertPhotos,
  listPhotoFilesForJournal,
  listPhotoFilesForMember,
  listPhotos,
  listPhotosByIds,
  lockJournal,
  photoCountAndLastPosition,
  setPhotoPositions,
  updatePhotoCaption,
  type NewPhotoRow,
} from '../repositories/photos.repository';
import { accessTo, type Viewer } from './journal-access';

const NO_PHOTOS_ADDED = 'No photos were added: fix or remove it and upload the others again.';

/** Raster formats we decode; sharp also reads SVG (and more), which must never get through. */
const ALLOWED_FORMATS = new Set(['jpeg', 'png', 'webp', 'heif', 'tiff', 'gif']);
/** WebP cannot be taller than this, so very tall images are fitted inside it. */
const WEBP_MAX_SIDE = 16383;

/** File keys are 128 random bits in hex; the media route serves only names of this shape. */
export const PHOTO_FILE_PATTERN = /^[0-9a-f]{32}-[1-9][0-9]{0,3}\.webp$/;

/** Storage name of one rendition. */
export const photoFileName = (fileKey: string, width: number) => `${fileKey}-${width}.webp`;

/** Every storage name of a photo row (one per rendition width). */
function renditionNames(row: { fileKey: string; widths: string }): string[] {
  return row.widths
    .split(',')
    .map(Number)
    .filter((w) => Number.isInteger(w) && w > 0)
    .map((w) => photoFileName(row.fileKey, w));
}

/** A file refused for what it is (not an image, too many pixels, damaged): a 400 for the batch. */
class PhotoRejectedError extends AppError {
  constructor(code: string, index: number, reason: string) {
    super(400, code, `${reason} ${NO_PHOTOS_ADDED}`, { [`${PHOTO_FIELD}.${index}`]: reason });
  }
}

// ---------------------------------------------------------------------------------------------
// Access

type JournalAccess = NonNullable<Awaited<ReturnType<typeof findJournalAccess>>>;

const journalNotFound = () =>
  new NotFoundError('JOURNAL_NOT_FOUND', 'There is no journal with that id.');

/** The journal if the member owns it; 404 when they cannot see it, 403 when they can. */
export async function requirePhotoOwner(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
): Promise<JournalAccess> {
  const journal = await findJournalAccess(ctx.database.db, journalId);
  if (!journal) throw journalNotFound();
  if (journal.userId === member.id) return journal;
  if (accessTo(journal, member) !== 'none') {
    throw new ForbiddenError(
      'NOT_JOURNAL_OWNER',
      'Only the maker of this journal can change its photos.',
    );
  }
  throw journalNotFound();
}

/**
 * Who may fetch a stored rendition (a /media file name): 'public' when anyone may read the
 * photo (its journal is published, public or unlisted, not hidden, and the photo is not
 * hidden), so it may be cached anywhere; otherwise a check of the viewer, who must be the
 * journal's maker or staff who may read the journal; null when no photo names the file.
 */
export async function mediaAccess(
  ctx: AppContext,
  fileName: string,
): Promise<'public' | { allows: (viewer: Viewer) => boolean } | null> {
  const fileKey = fileName.slice(0, fileName.indexOf('-'));
  const row = await findPhotoAccessByFileKey(ctx.database.db, fileKey);
  if (!row) return null;
  if (row.photoHiddenAt === null && accessTo(row.journal, undefined) === 'reader') return 'public';
  return {
    allows: (viewer) => {
      const access = accessTo(row.journal, viewer);
      return access === 'owner' || access === 'staff';
    },
  };
}

// ---------------------------------------------------------------------------------------------
// Checking and encoding one file

/** What the first bytes say the file is; null for anything that is not a raster image we take. */
export function sniffImage(head: Buffer): string | null {
  const ascii = (from: number, to: number) => head.subarray(from, to).toString('latin1');
  if (head.length >= 3 && head[0] === 0xff && head[1] === 0xd8 && head[2] === 0xff) return 'jpeg';
  if (head.length >= 8 && head.subarray(0, 8).equals(Buffer.from('89504e470d0a1a0a', 'hex')))
    return 'png';
  if (ascii(0, 6) === 'GIF87a' || ascii(0, 6) === 'GIF89a') return 'gif';
  if (ascii(0, 4) === 'RIFF' && ascii(8, 12) === 'WEBP') return 'webp';
  if (ascii(0, 4) === 'II*\u0000' || ascii(0, 4) === 'MM\u0000*') return 'tiff';
  // ISO base media (HEIF, AVIF): a box of type "ftyp" whose brand is an image brand.
  if (ascii(4, 8) === 'ftyp') {
    const brand = ascii(8, 12);
    if (['heic', 'heix', 'heim', 'heis', 'hevc', 'hevx'].includes(brand)) return 'heic';
    if (['avif', 'avis', 'mif1', 'msf1'].includes(brand)) return 'heif';
  }
  return null;
}

async function readHead(file: string, bytes = 32): Promise<Buffer> {
  const handle = await open(file, 'r');
  try {
    const buffer = Buffer.alloc(bytes);
    const { bytesRead } = await handle.read(buffer, 0, bytes, 0);
    return buffer.subarray(0, bytesRead);
  } finally {
    await handle.close();
  }
}

/** Decoding options for untrusted input: a pixel ceiling, and damaged data is an error. */
const DECODE: SharpOptions = {
  limitInputPixels: PHOTO_LIMITS.maxPixels,
  failOn: 'error',
};

type CheckedFile = UploadedFile & { width: number; height: number };

/**
 * Reads only the header: is it a raster image we take, and is it within the pixel limit?
 * Both checks run for every file before anything is decoded or written.
 */
async function checkFile(file: UploadedFile, index: number): Promise<CheckedFile> {
  const notAnImage = () =>
    new PhotoRejectedError(
      'NOT_AN_IMAGE',
      index,
      `${file.name} is not a photo we can use: upload a ${PHOTO_FORMATS_TEXT} image.`,
    );
  const sniffed = sniffImage(await readHead(file.path));
  if (!sniffed) throw notAnImage();
  if (sniffed === 'heic') {
    // sharp's prebuilt libvips decodes AV1 HEIF (AVIF) but has no HEVC decoder.
    throw new PhotoRejectedError(
      'HEIC_NOT_SUPPORTED',
      index,
      `${file.name} is a HEIC photo, which we cannot read yet: export or share it as JPEG and upload that.`,
    );
  }
  let meta: Metadata;
  try {
    // Header only, so no pixel limit here: it lets us say how large the image is.
    meta = await sharp(file.path, { limitInputPixels: false }).metadata();
  } catch {
    throw notAnImage();
  }
  if (meta.format === 'svg' || !ALLOWED_FORMATS.has(meta.format) || meta.format !== sniffed) {
    throw notAnImage();
  }
  const width = meta.autoOrient?.width ?? meta.width;
  const height = meta.autoOrient?.height ?? meta.height;
  if (!width || !height) throw notAnImage();
  if (width * height > PHOTO_LIMITS.maxPixels) {
    const mp = (n: number) => `${Math.round(n / 1_000_000)} megapixels`;
    throw new PhotoRejectedError(
      'IMAGE_TOO_MANY_PIXELS',
      index,
      `${file.name} is ${width} × ${height} px (${mp(width * height)}); photos can be at most ${mp(PHOTO_LIMITS.maxPixels)}. Scale it down and try again.`,
    );
  }
  return { ...file, width, height };
}

/** The widths to write: each standard width the photo reaches, or one at its own width. */
export function renditionWidths(originalWidth: number): number[] {
  const fits = PHOTO_WIDTHS.filter((w) => w <= originalWidth);
  return fits.length ? [...fits] : [Math.min(PHOTO_WIDTHS[0], originalWidth)];
}

type Rendition = { name: string; width: number; height: number; data: Buffer };

/**
 * Decodes the file (EXIF orientation applied) and encodes one WebP per width. sharp writes no
 * metadata unless asked (no keepMetadata/withMetadata here), so EXIF, GPS, XMP and IPTC stay
 * behind; a truncated or damaged file fails the decode.
 */
async function encodeRenditions(
  file: CheckedFile,
  index: number,
  fileKey: string,
): Promise<Rendition[]> {
  const renditions: Rendition[] = [];
  for (const target of renditionWidths(file.width)) {
    let result: { data: Buffer; info: OutputInfo };
    try {
      result = await sharp(file.path, DECODE)
        .rotate()
        .resize({
          width: target,
          height: WEBP_MAX_SIDE,
          fit: 'inside',
          withoutEnlargement: true,
        })
        .webp({ quality: 82 })
        .toBuffer({ resolveWithObject: true });
    } catch {
      throw new PhotoRejectedError(
        'IMAGE_DAMAGED',
        index,
        `${file.name} is damaged or incomplete (perhaps cut off while copying) and cannot be read.`,
      );
    }
    const { width, height } = result.info;
    // Fitting a very tall image can land two targets on one width: keep one file per width.
    if (renditions.some((r) => r.width === width)) continue;
    renditions.push({ name: photoFileName(fileKey, width), width, height, data: result.data });
  }
  return renditions;
}

/** Removes stored files; every name is tried, and the first failure is thrown afterwards. */
async function removeFiles(ctx: AppContext, names: string[]): Promise<void> {
  const results = await Promise.allSettled(names.map((name) => ctx.storage.delete(name)));
  const failed = results.filter((r): r is PromiseRejectedResult => r.status === 'rejected');
  if (failed.length) {
    ctx.logger.error(
      { err: failed[0].reason, failed: failed.length, total: names.length },
      'could not remove photo files',
    );
    throw failed[0].reason;
  }
}

/** Rolls back written files after a failure; the original error is what the caller reports. */
async function discardFiles(ctx: AppContext, names: string[]): Promise<void> {
  try {
    await removeFiles(ctx, names);
  } catch {
    // Already logged with the file count; the keys are random, so leftovers cannot be found.
  }
}

// ---------------------------------------------------------------------------------------------
// Operations

/**
 * Adds an upload's photos to the member's journal, all or nothing: every file is checked,
 * re-encoded and written first, then the rows go in one transaction; if any file is refused or
 * any step fails, the files already written are removed and no row is added.
 */
export async function addPhotos(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  upload: PhotoUpload,
): Promise<PhotoDto[]> {
  await requirePhotoOwner(ctx, member, journalId);
  const parsed = photoUploadFieldsSchema.safeParse(upload.fields);
  if (!parsed.success) throw new ValidationError(fieldsFromZod(parsed.error));
  const { captions } = parsed.data;
  const { files } = upload;
  if (!files.length) {
    throw new ValidationError(
      { [PHOTO_FIELD]: 'Choose at least one photo.' },
      `Choose at least one photo to upload (in the "${PHOTO_FIELD}" field).`,
    );
  }
  if (captions.length > files.length) {
    throw new ValidationError({ captions: 'Send at most one caption per photo.' });
  }
  const tooMany = (total: number) =>
    new AppError(
      400,
      'TOO_MANY_PHOTOS',
      `A journal holds at most ${PHOTO_LIMITS.perJournal} photos and this one has ${total}; add at most ${Math.max(0, PHOTO_LIMITS.perJournal - total)} more. No photos were added.`,
      { [PHOTO_FIELD]: `At most ${PHOTO_LIMITS.perJournal} photos per journal.` },
    );
  const before = await photoCountAndLastPosition(ctx.database.db, journalId);
  if (before.total + files.length > PHOTO_LIMITS.perJournal) throw tooMany(before.total);

  // Cheap header checks for the whole batch before any decoding.
  const checked: CheckedFile[] = [];
  for (const [index, file] of files.entries()) checked.push(await checkFile(file, index));

  const written: string[] = [];
  try {
    const rows: NewPhotoRow[] = [];
    // One file at a time: decoding is memory-hungry and the pool is shared with other requests.
    for (const [index, file] of checked.entries()) {
      const fileKey = randomBytes(16).toString('hex');
      const renditions = await encodeRenditions(file, index, fileKey);
      for (const rendition of renditions) {
        written.push(rendition.name);
        await ctx.storage.put(rendition.name, rendition.data, 'image/webp');
      }
      const largest = renditions[renditions.length - 1];
      rows.push({
        journalId,
        fileKey,
        width: largest.width,
        height: largest.height,
        widths: renditions.map((r) => r.width).join(','),
        caption: captions[index] ?? '',
        position: 0,
      });
    }
    const ids = await ctx.database.db.transaction(async (tx) => {
      if (!(await lockJournal(tx, journalId))) throw journalNotFound();
      // Counted again under the lock: another upload may have finished meanwhile.
      const now = await photoCountAndLastPosition(tx, journalId);
      if (now.total + rows.length > PHOTO_LIMITS.perJournal) throw tooMany(now.total);
      rows.forEach((row, i) => (row.position = now.last + 1 + i));
      return insertPhotos(tx, rows);
    });
    ctx.logger.info(
      { event: 'photos-added', journalId, userId: member.id, count: ids.length },
      'photos added',
    );
    return (await listPhotosByIds(ctx.database.db, ids)).map(presentPhoto);
  } catch (error) {
    await discardFiles(ctx, written);
    throw error;
  }
}

async function requireOwnedPhoto(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  photoId: number,
) {
  await requirePhotoOwner(ctx, member, journalId);
  const photo = await findPhoto(ctx.database.db, journalId, photoId);
  if (!photo) throw new NotFoundError('PHOTO_NOT_FOUND', 'This journal has no photo with that id.');
  return photo;
}

/** Changes a photo's caption (owner only). */
export async function updatePhoto(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  photoId: number,
  change: UpdatePhotoInput,
): Promise<PhotoDto> {
  const photo = await requireOwnedPhoto(ctx, member, journalId, photoId);
  await updatePhotoCaption(ctx.database.db, photo.id, change.caption);
  return presentPhoto({ ...photo, caption: change.caption });
}

/**
 * Deletes a photo (owner only): its files first, then its row. A failure in between leaves a
 * row without files, which the next attempt removes; never a file that outlives its row.
 */
export async function deletePhoto(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  photoId: number,
): Promise<void> {
  const photo = await requireOwnedPhoto(ctx, member, journalId, photoId);
  await removeFiles(ctx, renditionNames(photo));
  await deletePhotoRow(ctx.database.db, photo.id);
  ctx.logger.info(
    { event: 'photo-deleted', journalId, userId: member.id, photoId },
    'photo deleted',
  );
}

/** Puts the journal's photos in the given order; the ids must be exactly its photos. */
export async function reorderPhotos(
  ctx: AppContext,
  member: AuthMember,
  journalId: number,
  input: ReorderPhotosInput,
): Promise<PhotoDto[]> {
  await requirePhotoOwner(ctx, member, journalId);
  return ctx.database.db.transaction(async (tx) => {
    if (!(await lockJournal(tx, journalId))) throw journalNotFound();
    const current = await listPhotos(tx, journalId);
    const known = new Set(current.map((p) => p.id));
    if (input.ids.length !== known.size || input.ids.some((id) => !known.has(id))) {
      throw new ValidationError(
        { ids: `Send each of this journal's ${known.size} photo ids exactly once.` },
        'The order must list every photo of this journal, and only those.',
      );
    }
    await setPhotoPositions(tx, journalId, input.ids);
    return (await listPhotos(tx, journalId)).map(presentPhoto);
  });
}

/**
 * Removes the stored files of every photo of a journal; call it before deleting the journal
 * (the rows cascade with it). Throws if a file could not be removed, so the delete can stop
 * and be retried rather than leave files behind.
 */
export async function deletePhotoFilesForJournal(
  ctx: AppContext,
  journalId: number,
): Promise<void> {
  const rows = await listPhotoFilesForJournal(ctx.database.db, journalId);
  await removeFiles(ctx, rows.flatMap(renditionNames));
}

/** Removes the stored files of every photo in a member's journals, before the account goes. */
export async function deletePhotoFilesForMember(ctx: AppContext, userId: number): Promise<void> {
  const rows = await listPhotoFilesForMember(ctx.database.db, userId);
  await removeFiles(ctx, rows.flatMap(renditionNames));
  if (rows.length) ctx.logger.info({ userId, photos: rows.length }, 'member photo files removed');
}
