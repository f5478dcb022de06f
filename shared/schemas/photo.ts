import { z } from 'zod';

/** Upload limits, shared so the editor can refuse a file before sending it. */
export const PHOTO_LIMITS = {
  /** Files in one upload request. */
  perUpload: 10,
  /** Photos one journal can hold. */
  perJournal: 30,
  /** Bytes per file as uploaded (15 MB). */
  maxBytes: 15 * 1024 * 1024,
  /** Pixels (width × height) of an uploaded image; larger ones are refused before decoding. */
  maxPixels: 50_000_000,
  captionMax: 200,
} as const;

/** The multipart field the photos travel in. */
export const PHOTO_FIELD = 'photos';

/** The formats PHOTO_ACCEPT names, in words (the editor's hint and the server's messages). */
export const PHOTO_FORMATS_TEXT = 'JPEG, PNG, WebP, AVIF, TIFF or GIF';

/** What an <input type="file" accept> may offer; the server sniffs the bytes regardless. */
export const PHOTO_ACCEPT = 'image/jpeg,image/png,image/webp,image/avif,image/tiff,image/gif';

export const photoCaptionSchema = z
  .string({ error: 'Write the caption as text.' })
  .trim()
  .max(PHOTO_LIMITS.captionMax, `Use at most ${PHOTO_LIMITS.captionMax} characters.`);

/** Route parameters of /api/journals/:id/photos[/:photoId]. */
export const photoParamsSchema = z.object({
  id: z.coerce
    .number({ error: 'Use a journal id.' })
    .int('Use a journal id.')
    .positive('Use a journal id.'),
  photoId: z.coerce
    .number({ error: 'Use a photo id.' })
    .int('Use a photo id.')
    .positive('Use a photo id.')
    .optional(),
});

/**
 * The text fields sent with an upload: "captions" once per file, in the order of the files
 * (a single caption arrives as a string, several as an array).
 */
export const photoUploadFieldsSchema = z.object({
  captions: z
    .union([photoCaptionSchema, z.array(photoCaptionSchema)])
    .optional()
    .transform((value) => (value === undefined ? [] : Array.isArray(value) ? value : [value]))
    .pipe(
      z
        .array(z.string())
        .max(PHOTO_LIMITS.perUpload, `Send at most ${PHOTO_LIMITS.perUpload} captions.`),
    ),
});

export const updatePhotoSchema = z.object({
  caption: photoCaptionSchema,
});

export const reorderPhotosSchema = z.object({
  ids: z
    .array(
      z
        .number({ error: 'Each id must be a photo id.' })
        .int('Each id must be a photo id.')
        .positive('Each id must be a photo id.'),
      { error: 'Send the photo ids in their new order.' },
    )
    .min(1, 'Send the photo ids in their new order.')
    .max(PHOTO_LIMITS.perJournal, `A journal holds at most ${PHOTO_LIMITS.perJournal} photos.`)
    .refine((ids) => new Set(ids).size === ids.length, 'Each photo may appear only once.'),
});

export type PhotoUploadFields = z.infer<typeof photoUploadFieldsSchema>;
export type UpdatePhotoInput = z.infer<typeof updatePhotoSchema>;
export type ReorderPhotosInput = z.infer<typeof reorderPhotosSchema>;
