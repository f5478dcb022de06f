import { Router } from 'express';
import {
  photoParamsSchema,
  reorderPhotosSchema,
  updatePhotoSchema,
} from '../../shared/schemas/photo';
import type { AppContext } from '../context';
import { currentMember, requireMember } from '../middleware/authenticate';
import { withPhotoUpload } from '../middleware/upload';
import { validate, valid } from '../middleware/validate';
import {
  addPhotos,
  deletePhoto,
  reorderPhotos,
  requirePhotoOwner,
  updatePhoto,
} from '../services/photos.service';

/** /api/journals/:id/photos: upload, caption, delete and reorder a journal's photos (owner only). */
export function photosRouter(ctx: AppContext): Router {
  const router = Router({ mergeParams: true });
  router.use(requireMember, validate('params', photoParamsSchema));
  const journalId = (res: { locals: Record<string, unknown> }) =>
    valid(res, 'params', photoParamsSchema).id;
  const photoId = (res: { locals: Record<string, unknown> }) =>
    valid(res, 'params', photoParamsSchema).photoId!;

  router.post('/', async (req, res) => {
    const member = currentMember(req);
    // Refuse a stranger before their files are received and decoded.
    await requirePhotoOwner(ctx, member, journalId(res));
    const photos = await withPhotoUpload(ctx, req, res, (upload) =>
      addPhotos(ctx, member, journalId(res), upload),
    );
    res.status(201).json({ photos });
  });

  // Before /:photoId so "order" is never read as an id.
  router.put('/order', validate('body', reorderPhotosSchema), async (req, res) => {
    const photos = await reorderPhotos(
      ctx,
      currentMember(req),
      journalId(res),
      valid(res, 'body', reorderPhotosSchema),
    );
    res.json({ photos });
  });

  router.patch(
    '/:photoId',
    validate('params', photoParamsSchema),
    validate('body', updatePhotoSchema),
    async (req, res) => {
      const photo = await updatePhoto(
        ctx,
        currentMember(req),
        journalId(res),
        photoId(res),
        valid(res, 'body', updatePhotoSchema),
      );
      res.json({ photo });
    },
  );

  router.delete('/:photoId', validate('params', photoParamsSchema), async (req, res) => {
    await deletePhoto(ctx, currentMember(req), journalId(res), photoId(res));
    res.status(204).end();
  });

  return router;
}
