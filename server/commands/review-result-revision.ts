import { atLeast, can } from '@shared/permissions';
import type { ReviewInput, ResultRevisionStatus } from '@shared/schemas/result';
import { REVISION_STATUS_LABELS, STATUS_LABELS } from '@shared/vocabulary';
import type { AppContext } from '../context';
import { conflict, forbidden, HttpError, notFound } from '../errors';
import { Result, ResultEvent, ResultRevision, User } from '../models';
import { withTrail } from '../queries/results';
import { applyRevision } from './edit-result';
import { recordAudit, recordRefusal } from './record-audit';

const outcome: Record<ReviewInput['decision'], ResultRevisionStatus> = { approve: 'approved', return: 'returned', reject: 'rejected' };

/**
 * A moderator's decision on a pending correction of a published result. Approved, the
 * correction replaces the published version (input, derived values, its cells) in the same
 * transaction; returned or rejected, the published version stays as it is. The decision is
 * on the result's trail and in the audit log. Resolves with the result and the revision.
 */
export async function reviewResultRevision(ctx: AppContext, reviewer: User, id: number, number: number, review: ReviewInput) {
  const actor = reviewer.asActor();
  const audit = { action: `result-revision.${review.decision}`, subjectType: 'result', subjectId: id, reason: review.note ?? null };
  const done = await ctx.db
    .write(async (transaction) => {
      const result = await Result.findByPk(id, { include: withTrail, transaction });
      const revision = result && (await ResultRevision.findOne({ where: { resultId: id, number }, transaction }));
      if (!result || !revision) throw notFound('Revision');
      if (!can(actor, 'review:result', { authorId: revision.authorId, status: revision.status })) {
        throw forbidden(revision.authorId === actor.id ? 'You cannot review your own correction.' : 'Only moderators review corrections.');
      }
      if (revision.status !== 'pending') throw conflict(`This revision was already decided: it is "${REVISION_STATUS_LABELS[revision.status]}".`);
      if (result.status !== 'approved') throw conflict(`The result is now "${STATUS_LABELS[result.status]}"; only a published result takes a correction.`);
      const to = outcome[review.decision];
      if (to === 'approved') await applyRevision(result, revision, transaction);
      await revision.update({ status: to, reviewedById: actor.id, note: review.note ?? null, reviewedAt: new Date() }, { transaction });
      const words = { approved: 'published', returned: 'returned', rejected: 'declined' }[to as 'approved'];
      const event = await ResultEvent.create(
        { resultId: id, actorId: actor.id, fromStatus: 'approved', toStatus: 'approved', note: `Correction (revision ${number}) ${words}${review.note ? `: ${review.note}` : ''}` },
        { transaction },
      );
      event.actor = reviewer;
      result.events = [...(result.events ?? []), event];
      await recordAudit(actor, { ...audit, details: { revision: number, to } }, transaction);
      return { result, revision };
    })
    .catch(async (err: unknown) => {
      if (err instanceof HttpError && (err.status === 409 || err.status === 403) && atLeast(actor.role, 'moderator')) await recordRefusal(ctx, actor, audit, err.message);
      throw err;
    });
  return done;
}
