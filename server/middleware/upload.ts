import { mkdir, mkdtemp, readdir, rm, stat } from 'node:fs/promises';
import path from 'node:path';
import type { Request, Response } from 'express';
import multer, { MulterError } from 'multer';
import { PHOTO_FIELD, PHOTO_LIMITS } from '../../shared/schemas/photo';
import type { AppContext } from '../context';
import { AppError } from '../lib/errors';

/** One received file, still in the request's temporary folder. */
export type UploadedFile = {
  path: string;
  /** The client's file name, cleaned for use in messages only. */
  name: string;
  size: number;
};

/** What a multipart photo upload carried: the files in order and the text fields. */
export type PhotoUpload = {
  files: UploadedFile[];
  fields: Record<string, unknown>;
};

const NO_PHOTOS_ADDED = 'No photos were added.';
/** Temporary folders older than this are left over from a crash and may go. */
const STALE_AFTER_MS = 60 * 60 * 1000;
const sweptRoots = new Set<string>();

/** The folder every request's temporary folder lives in (the same disk as the uploads). */
export const uploadTempRoot = (ctx: AppContext) => path.join(ctx.config.uploadsDir, '.tmp');

/** A client file name is untrusted text: no control characters, bounded length. */
export function displayName(name: string | undefined): string {
  const clean = (name ?? '').replace(/[\u0000-\u001f\u007f]/g, '').trim();
  if (!clean) return 'a file';
  return `"${clean.length > 80 ? `${clean.slice(0, 77)}...` : clean}"`;
}

/** Turns multer's and busboy's errors into answers a maker can act on. */
function uploadError(error: unknown): AppError {
  if (error instanceof AppError) return error;
  if (error instanceof MulterError) {
    switch (error.code) {
      case 'LIMIT_FILE_SIZE':
        return new AppError(
          413,
          'PHOTO_TOO_LARGE',
          `${displayName((error as MulterError & { filename?: string }).filename)} is larger than ${PHOTO_LIMITS.maxBytes / 1024 / 1024} MB, the most one photo may be. ${NO_PHOTOS_ADDED}`,
          { [PHOTO_FIELD]: 'A photo is too large.' },
        );
      case 'LIMIT_FILE_COUNT':
        return new AppError(
          400,
          'TOO_MANY_FILES',
          `Send at most ${PHOTO_LIMITS.perUpload} photos at a time. ${NO_PHOTOS_ADDED}`,
          { [PHOTO_FIELD]: `At most ${PHOTO_LIMITS.perUpload} photos at a time.` },
        );
      case 'LIMIT_UNEXPECTED_FILE':
        return new AppError(
          400,
          'UNEXPECTED_FILE_FIELD',
          `Photos must be sent in the "${PHOTO_FIELD}" field, not "${String(error.field ?? '')}". ${NO_PHOTOS_ADDED}`,
        );
      case 'LIMIT_FIELD_VALUE':
        return new AppError(
          400,
          'FIELD_TOO_LONG',
          `The field "${String(error.field ?? '')}" is too long. ${NO_PHOTOS_ADDED}`,
        );
      default:
        return new AppError(
          400,
          'BAD_UPLOAD',
          `The upload could not be read (${error.message.toLowerCase()}). ${NO_PHOTOS_ADDED}`,
        );
    }
  }
  // busboy's own complaints (a cut-off body, a malformed part) and an aborted request.
  return new AppError(
    400,
    'BAD_UPLOAD',
    `The upload was incomplete or malformed. Please try again. ${NO_PHOTOS_ADDED}`,
  );
}

/** Removes temporary folders a crashed process left behind, once per root and process. */
async function sweepStale(root: string, ctx: AppContext): Promise<void> {
  if (sweptRoots.has(root)) return;
  sweptRoots.add(root);
  try {
    for (const entry of await readdir(root)) {
      const full = path.join(root, entry);
      const info = await stat(full).catch(() => null);
      if (info && Date.now() - info.mtimeMs > STALE_AFTER_MS) {
        await rm(full, { recursive: true, force: true });
      }
    }
  } catch (error) {
    ctx.logger.warn({ err: error, root }, 'could not sweep old upload folders');
  }
}

/**
 * Receives a multipart upload (field "photos", up to 10 files of up to 15 MB) into a
 * temporary folder of its own, hands it to the work, and removes the folder afterwards
 * whatever happened: success, a refused file, a failed service call or an aborted request.
 */
export async function withPhotoUpload<T>(
  ctx: AppContext,
  req: Request,
  res: Response,
  work: (upload: PhotoUpload) => Promise<T>,
): Promise<T> {
  if (!req.is('multipart/form-data')) {
    throw new AppError(
      400,
      'NOT_MULTIPART',
      `Send the photos as multipart/form-data in the "${PHOTO_FIELD}" field.`,
    );
  }
  const root = uploadTempRoot(ctx);
  await mkdir(root, { recursive: true });
  void sweepStale(root, ctx);
  const dir = await mkdtemp(path.join(root, 'req-'));
  try {
    const receive = multer({
      storage: multer.diskStorage({ destination: dir }),
      limits: {
        files: PHOTO_LIMITS.perUpload,
        fileSize: PHOTO_LIMITS.maxBytes,
        fields: PHOTO_LIMITS.perUpload + 5,
        parts: PHOTO_LIMITS.perUpload * 2 + 5,
        fieldSize: 4 * 1024,
        fieldNameSize: 100,
        fieldNestingDepth: 1,
        fieldArrayIndexLimit: PHOTO_LIMITS.perUpload,
      },
      // Client-sent file names are UTF-8 in every current browser.
      defParamCharset: 'utf8',
    }).array(PHOTO_FIELD);
    await new Promise<void>((resolve, reject) => {
      receive(req, res, (error?: unknown) => (error ? reject(uploadError(error)) : resolve()));
    });
    const files = ((req.files as Express.Multer.File[] | undefined) ?? []).map((file) => ({
      path: file.path,
      name: displayName(file.originalname),
      size: file.size,
    }));
    return await work({ files, fields: { ...(req.body ?? {}) } });
  } finally {
    await rm(dir, { recursive: true, force: true }).catch((error: unknown) =>
      ctx.logger.error({ err: error, dir }, 'could not remove an upload folder'),
    );
  }
}
