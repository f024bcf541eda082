import { can, type Actor } from '@shared/permissions';
import type { AppContext } from '../context';
import { forbidden, notFound } from '../errors';
import { Result, ResultEvent } from '../models';
import { findResult } from '../queries/results';

/**
 * The author withdraws their approved result: it is kept (state `retracted`), leaves the
 * comparison cell in the same transaction, gets a trail entry with the reason, and leaves the
 * search index with the change feed. Resolves with the result as it now stands, with its trail.
 */
export async function retractResult(ctx: AppContext, actor: Actor, id: number, reason: string): Promise<Result> {
  await ctx.db.write(async (transaction) => {
    const result = await Result.findByPk(id, { transaction });
    if (!result || !can(actor, 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Result');
    if (!can(actor, 'retract:result', { authorId: result.authorId, status: result.status })) {
      throw forbidden(result.authorId === actor.id ? 'Only a published result can be withdrawn.' : 'Only the author withdraws a result.');
    }
    await result.update({ status: 'retracted' }, { transaction });
    await ResultEvent.create({ resultId: id, actorId: actor.id, fromStatus: 'approved', toStatus: 'retracted', note: reason }, { transaction });
  });
  return findResult(id, actor);
}
