import { can, type Actor } from '@shared/permissions';
import { mergeEdits } from '@shared/page-diff';
import type { PageContent, PageReview } from '@shared/schemas/pages';
import type { AppContext } from '../context';
import { conflict, forbidden, notFound } from '../errors';
import { PageRevision } from '../models';
import { contentOf, findRevisionOf, PAGE_MODELS, type PageModel } from '../queries/pages';
import { applyContent, refuseIfMerged } from './revise-page';

/** What a review came to; 'conflict' means nothing was written. */
export type ReviewOutcome =
  | { outcome: 'approved' | 'declined'; revision: PageRevision; page: PageModel; applied: PageRevision }
  | { outcome: 'conflict'; revision: PageRevision; page: PageModel; current: PageRevision; conflicts: string[]; merged: PageContent };

/**
 * A moderator's decision on a proposed revision. Declining keeps the proposal, marked declined
 * with the reason. Approving makes it live: when the page is still at the revision the proposal
 * started from, the proposal itself becomes current; when others have saved since, their changes
 * and the proposal's are merged field by field into a new live revision (credited to the
 * proposal's author, linked by `appliedFromId`), unless both changed the same field, which is
 * refused with 409 and the conflicting fields, nothing written. A decided proposal is 409.
 */
export async function reviewPageRevision(ctx: AppContext, actor: Actor, id: number, review: PageReview): Promise<ReviewOutcome> {
  const outcome = await ctx.db.write(async (transaction): Promise<ReviewOutcome> => {
    const found = await PageRevision.findByPk(id, { transaction });
    if (!found) throw notFound('Revision');
    if (!can(actor, 'review:page-revision', { authorId: found.authorId, status: found.status })) {
      throw forbidden(found.authorId === actor.id ? 'You cannot review your own edit.' : 'Only moderators review page edits.');
    }
    if (found.status !== 'proposed') throw conflict(`This edit was already decided: it is now "${found.status}".`);
    const type = found.pageType;
    const page = (await (PAGE_MODELS[type] as typeof PAGE_MODELS.steel).findByPk(found.pageId, { transaction })) as PageModel | null;
    if (!page) throw notFound('Page');
    const reviewed = { reviewedById: actor.id, reviewedAt: new Date(), reviewNote: review.note ?? null };

    if (review.decision === 'decline') {
      await found.update({ status: 'declined', ...reviewed }, { transaction });
      return { outcome: 'declined', revision: found, page, applied: found };
    }

    await refuseIfMerged(type, page);
    if (found.baseRevisionId === page.currentRevisionId) {
      await found.update({ status: 'live', ...reviewed }, { transaction });
      await applyContent(type, page, contentOf(found), found.id, transaction);
      return { outcome: 'approved', revision: found, page, applied: found };
    }

    const current = await findRevisionOf(type, page.id, page.currentRevisionId!, transaction);
    const base = found.baseRevisionId ? await findRevisionOf(type, page.id, found.baseRevisionId, transaction) : current;
    const merge = mergeEdits(type, contentOf(base), contentOf(found), contentOf(current));
    if (merge.conflicts.length) return { outcome: 'conflict', revision: found, page, current, conflicts: merge.conflicts, merged: merge.content };
    await found.update({ status: 'live', ...reviewed }, { transaction });
    const applied = await PageRevision.create(
      {
        pageType: type,
        pageId: page.id,
        authorId: found.authorId,
        summary: `${found.summary} (merged with revision ${current.number})`.slice(0, 300),
        fields: merge.content.fields,
        body: merge.content.body,
        status: 'live',
        kind: 'merge',
        baseRevisionId: current.id,
        appliedFromId: found.id,
        ...reviewed,
      },
      { transaction },
    );
    await applyContent(type, page, merge.content, applied.id, transaction);
    return { outcome: 'approved', revision: found, page, applied };
  });
  return outcome;
}
