import { can, type Actor } from '@shared/permissions';
import { changedFields } from '@shared/page-diff';
import type { PageRevert, PageType } from '@shared/schemas/pages';
import type { AppContext } from '../context';
import { badRequest, forbidden } from '../errors';
import { PageRevision } from '../models';
import { contentOf, findPageOfType, findRevisionOf, type PageModel } from '../queries/pages';
import type { ReviseOutcome } from './revise-page';
import { applyContent, refuseIfMerged } from './revise-page';

/**
 * A moderator restores an earlier accepted revision: its fields and body become a new live
 * revision (kind 'revert', `revertedFromId` naming the one restored), so the history only
 * grows. Reverting to the current revision, or to one that was never live, is refused; with a
 * `baseRevision` that is no longer current the outcome is 'stale' and nothing is written.
 */
export async function revertPage(ctx: AppContext, actor: Actor, type: PageType, slug: string, input: PageRevert): Promise<ReviseOutcome> {
  if (!can(actor, 'revert:page')) throw forbidden('Only moderators revert pages.');
  const outcome = await ctx.db.write(async (transaction): Promise<ReviseOutcome> => {
    const page: PageModel = await findPageOfType(type, slug, transaction);
    await refuseIfMerged(type, page);
    const current = await findRevisionOf(type, page.id, page.currentRevisionId!, transaction);
    if (input.baseRevision !== undefined && input.baseRevision !== current.id) {
      return { outcome: 'stale', page, current, conflicts: [], merged: contentOf(current) };
    }
    const target = await findRevisionOf(type, page.id, input.toRevision, transaction).catch(() => {
      throw badRequest('Invalid input.', [{ path: 'toRevision', message: `no revision of this page has the id ${input.toRevision}` }]);
    });
    if (target.status !== 'live') throw badRequest('Invalid input.', [{ path: 'toRevision', message: `revision ${target.number} was never live (it is ${target.status})` }]);
    if (target.id === current.id) throw badRequest('Invalid input.', [{ path: 'toRevision', message: `revision ${target.number} is already the current one` }]);
    const content = contentOf(target);
    if (changedFields(type, contentOf(current), content).length === 0) {
      throw badRequest('Invalid input.', [{ path: 'toRevision', message: `revision ${target.number} has the same content as the current one` }]);
    }
    const revision = await PageRevision.create(
      {
        pageType: type,
        pageId: page.id,
        authorId: actor.id,
        summary: (input.summary || `Reverted to revision ${target.number}`).slice(0, 300),
        fields: content.fields,
        body: content.body,
        status: 'live',
        kind: 'revert',
        baseRevisionId: current.id,
        revertedFromId: target.id,
      },
      { transaction },
    );
    await applyContent(type, page, content, revision.id, transaction);
    return { outcome: 'live', revision, page };
  });
  return outcome;
}
