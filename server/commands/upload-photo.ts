import crypto from 'node:crypto';
import { can, type Actor } from '@shared/permissions';
import { photoLimits } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { conflict, forbidden, notFound } from '../errors';
import { Photo, Result } from '../models';
import { processPhoto } from '../storage/images';

const tooMany = () => conflict(`A result carries at most ${photoLimits.perResult} photos; remove one first.`);

/**
 * Adds a photo to the author's result: checked by content and re-encoded (metadata stripped),
 * stored with a thumbnail under generated keys through the S3 API, then recorded. The image
 * work and the upload happen outside the write queue; if recording fails, the objects are
 * deleted again.
 */
export async function uploadPhoto(ctx: AppContext, actor: Actor, resultId: number, upload: Buffer, alt: string): Promise<Photo> {
  const result = await Result.findByPk(resultId);
  if (!result || !can(actor, 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Result');
  if (!can(actor, 'upload:photo', { authorId: result.authorId, status: result.status })) {
    throw forbidden(result.authorId === actor.id ? `Photos cannot be added to a result that is ${result.status}.` : 'Only the result’s author adds photos.');
  }
  if ((await Photo.count({ where: { resultId, removedAt: null } })) >= photoLimits.perResult) throw tooMany();

  const processed = await processPhoto(upload);
  const name = crypto.randomUUID();
  const objectKey = `results/${resultId}/${name}.jpg`;
  const thumbKey = `results/${resultId}/${name}-thumb.jpg`;
  await ctx.storage.put(objectKey, processed.image, 'image/jpeg');
  await ctx.storage.put(thumbKey, processed.thumb, 'image/jpeg');
  try {
    return await ctx.db.write(async (transaction) => {
      if ((await Photo.count({ where: { resultId, removedAt: null }, transaction })) >= photoLimits.perResult) throw tooMany();
      return Photo.create(
        { resultId, uploaderId: actor.id, objectKey, thumbKey, alt, width: processed.width, height: processed.height, bytes: processed.image.length, removedAt: null },
        { transaction },
      );
    });
  } catch (err) {
    await Promise.allSettled([ctx.storage.delete(objectKey), ctx.storage.delete(thumbKey)]);
    throw err;
  }
}

/** The author removes a photo: hidden from then on, its row kept (nothing is hard-deleted). */
export async function removePhoto(ctx: AppContext, actor: Actor, photoId: number): Promise<void> {
  await ctx.db.write(async (transaction) => {
    const photo = await Photo.findByPk(photoId, { include: [{ model: Result, as: 'result' }], transaction });
    if (!photo || photo.removedAt) throw notFound('Photo');
    if (photo.result?.authorId !== actor.id) throw forbidden('Only the result’s author removes its photos.');
    await photo.update({ removedAt: new Date() }, { transaction });
  });
}
