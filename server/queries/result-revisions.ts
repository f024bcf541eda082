import { atLeast, type Actor } from '@shared/permissions';
import { Result, ResultRevision, User } from '../models';
import { findResult, withTrail } from './results';

const withPeople = [
  { model: User, as: 'author' },
  { model: User, as: 'reviewer' },
];

/** The versions that were, at some time, the result itself. */
export const WAS_LIVE = new Set(['applied', 'approved']);

/**
 * A result's revisions, newest first, each with the version it replaced
 * (the latest earlier one that was applied or published). Its author and moderators see every
 * revision; others only those that were the result itself. A result never edited has none.
 */
export async function resultRevisions(id: number, viewer: Actor | null) {
  const result = await findResult(id, viewer);
  const insider = !!viewer && (viewer.id === result.authorId || atLeast(viewer.role, 'moderator'));
  const all = await ResultRevision.findAll({ where: { resultId: id }, include: withPeople, order: [['number', 'ASC']] });
  const items = all.map((revision, i) => ({ revision, replaces: all.slice(0, i).findLast((r) => WAS_LIVE.has(r.status)) ?? null }));
  return items.filter(({ revision }) => insider || WAS_LIVE.has(revision.status)).reverse();
}

/**
 * Corrections of published results waiting for a moderator, oldest first: each with the
 * published result it would change and the changes against it.
 */
export async function pendingResultRevisions() {
  const revisions = await ResultRevision.findAll({ where: { status: 'pending' }, include: withPeople, order: [['createdAt', 'ASC'], ['id', 'ASC']], limit: 200 });
  const results = await Result.findAll({ where: { id: revisions.map((r) => r.resultId) }, include: withTrail });
  const byId = new Map(results.map((r) => [r.id, r]));
  return revisions.flatMap((revision) => {
    const result = byId.get(revision.resultId);
    return result ? [{ revision, result }] : [];
  });
}
