import { Photo, Result } from '../models';

/** Just what the photo rules need of a result: its author and state. */
export function resultForPhotos(id: number): Promise<Result | null> {
  return Result.findByPk(id, { attributes: ['id', 'authorId', 'status'] });
}

/** A result's photos not removed, in the order they were added. */
export function photosOf(resultId: number): Promise<Photo[]> {
  return Photo.findAll({ where: { resultId, removedAt: null }, order: [['id', 'ASC']] });
}

/** One photo with its result's author and state. */
export function photoWithResult(id: number): Promise<Photo | null> {
  return Photo.findByPk(id, { include: [{ model: Result, as: 'result', attributes: ['id', 'authorId', 'status'] }] });
}
