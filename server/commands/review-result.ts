import { atLeast, can } from '@shared/permissions';
import type { ReviewInput, ResultStatus } from '@shared/schemas/result';
import { STATUS_LABELS } from '@shared/vocabulary';
import type { AppContext } from '../context';
import { conflict, forbidden, HttpError, notFound } from '../errors';
import { Result, ResultEvent, User } from '../models';
import { withTrail } from '../queries/results';
import { notifyReviewOutcome } from './notify-review-outcome';
import { recordAudit, recordRefusal } from './record-audit';

const outcome: Record<ReviewInput['decision'], ResultStatus> = { approve: 'approved', return: 'returned', reject: 'rejected' };

/**
 * A moderator's decision on a pending result. The state change, its trail entry and the
 * comparison cell it touches are written in one transaction; the search index follows the
 * change before the commit is acknowledged. A result already decided is refused with 409, naming its state. Resolves
 * with the result as it now stands, with its trail.
 */
export async function reviewResult(ctx: AppContext, reviewer: User, id: number, review: ReviewInput): Promise<Result> {
  const actor = reviewer.asActor();
  const audit = { action: `result.${review.decision}`, subjectType: 'result', subjectId: id, reason: review.note ?? null };
  // Read once, with its pages and trail, inside the write: the search document, the notice and
  // the answer all use it, and no read after the commit waits behind the caches catching up.
  const result = await ctx.db.write(async (transaction) => {
    const result = await Result.findByPk(id, { include: withTrail, transaction });
    if (!result) throw notFound('Result');
    if (!can(actor, 'review:result', { authorId: result.authorId, status: result.status })) {
      throw forbidden(result.authorId === actor.id ? 'You cannot review your own result.' : 'Only moderators review results.');
    }
    const decided = (status: ResultStatus) => conflict(`This result was already decided: it is now "${STATUS_LABELS[status]}".`);
    if (result.status !== 'pending') throw decided(result.status);
    const to = outcome[review.decision];
    // Only while it is still pending: of two decisions at once (two processes on PostgreSQL),
    // exactly one changes the row; the other finds it decided and answers 409.
    const now = new Date();
    const changes = { status: to, approvedAt: to === 'approved' ? now : null, updatedAt: now };
    const [changed] = await Result.update(changes, { where: { id, status: 'pending' }, transaction, silent: true });
    if (changed !== 1) throw decided((await Result.findByPk(id, { attributes: ['status'], transaction }))!.status);
    result.set(changes, { raw: true });
    const event = await ResultEvent.create({ resultId: id, actorId: actor.id, fromStatus: 'pending', toStatus: to, note: review.note ?? null }, { transaction });
    await recordAudit(actor, { ...audit, details: { from: 'pending', to } }, transaction);
    event.actor = reviewer;
    result.events = [...(result.events ?? []), event];
    return result;
  }).catch(async (err: unknown) => {
    // A moderator's refused attempt (already decided, or their own result) is kept in the audit log too.
    if (err instanceof HttpError && (err.status === 409 || err.status === 403) && atLeast(actor.role, 'moderator')) await recordRefusal(ctx, actor, audit, err.message);
    throw err;
  });
  const author = result.author as User;
  notifyReviewOutcome(ctx, author, result, review.note).catch(() => undefined);
  return result;
}
