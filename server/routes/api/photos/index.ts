import { Router } from 'express';
import { can } from '@shared/permissions';
import { photoFieldsSchema, photoLimits } from '@shared/schemas/publishing';
import { photoListSchema, type Presented } from '@shared/schemas/responses';
import { idParams } from '@shared/schemas/common';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden, notFound } from '../../../errors';
import { photosOf, photoWithResult, resultForPhotos } from '../../../queries/photos';
import { receiveFile } from '../../../storage/upload';
import { removePhoto, uploadPhoto } from '../../../commands/upload-photo';
import { presentPhoto } from '../../../presenters/publishing';


/** Photos of results: upload (the author), list, the image and its thumbnail, removal. */
export function photosRouter(ctx: AppContext): Router {
  const router = Router();

  router.post(
    '/results/:id/photos',
    requireUser,
    route({ params: idParams }, async (req, _res, next) => {
      // Refuse before reading the upload: only the author sends a file.
      const { id } = req.valid.params;
      const result = await resultForPhotos(id);
      const actor = actorOf(req);
      if (!result || !can(actor, 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Result');
      if (!can(actor, 'upload:photo', { authorId: result.authorId, status: result.status })) {
        throw forbidden(result.authorId === actor?.id ? `Photos cannot be added to a result that is ${result.status}.` : 'Only the result’s author adds photos.');
      }
      next();
    }),
    receiveFile({ field: 'photo', maxBytes: photoLimits.fileBytesMax, fields: 2, fieldBytes: 1000, what: 'photo' }),
    route({ params: idParams, body: photoFieldsSchema }, async (req, res) => {
      const { id } = req.valid.params;
      const { alt } = req.valid.body;
      const photo = await uploadPhoto(ctx, actorOf(req)!, id, req.file!.buffer, alt);
      res.status(201).json(presentPhoto(photo));
    }),
  );

  router.get('/results/:id/photos', route({ params: idParams }, async (req, res) => {
    const { id } = req.valid.params;
    const result = await resultForPhotos(id);
    if (!result || !can(actorOf(req), 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Result');
    const photos = await photosOf(id);
    res.json({ items: photos.map(presentPhoto), max: photoLimits.perResult, canAdd: can(actorOf(req), 'upload:photo', { authorId: result.authorId, status: result.status }) } satisfies Presented<typeof photoListSchema>);
  }));

  for (const variant of ['image', 'thumb'] as const) {
    router.get(variant === 'image' ? '/photos/:id' : '/photos/:id/thumb', route({ params: idParams }, async (req, res) => {
      const { id } = req.valid.params;
      const photo = await photoWithResult(id);
      const result = photo?.result;
      if (!photo || photo.removedAt || !result || !can(actorOf(req), 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Photo');
      const object = await ctx.storage.get(variant === 'image' ? photo.objectKey : photo.thumbKey);
      if (!object) throw notFound('Photo');
      res.set({
        'Content-Type': 'image/jpeg',
        'Content-Disposition': `inline; filename="edgeledger-photo-${photo.id}${variant === 'thumb' ? '-thumb' : ''}.jpg"`,
        // Published photos may be cached; others are private to their author and moderators.
        'Cache-Control': result.status === 'approved' ? 'public, max-age=86400' : 'private, no-store',
        ...(object.contentLength ? { 'Content-Length': String(object.contentLength) } : {}),
      });
      object.body.pipe(res);
    }));
  }

  router.delete('/photos/:id', requireUser, route({ params: idParams }, async (req, res) => {
    const { id } = req.valid.params;
    await removePhoto(ctx, actorOf(req)!, id);
    res.status(204).end();
  }));

  return router;
}
