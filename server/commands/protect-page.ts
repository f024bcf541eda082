import { can, type Actor } from '@shared/permissions';
import type { PageProtect, PageType } from '@shared/schemas/pages';
import type { AppContext } from '../context';
import { badRequest, forbidden } from '../errors';
import { PageEvent, type Method } from '../models';
import { findPageOfType, type PageModel } from '../queries/pages';
import { refuseIfMerged } from './revise-page';

/**
 * A moderator protects a page (from then on only moderators edit it; members' proposals are
 * refused) or releases it. Recorded as a page event with who, when and why. Setting the state it
 * already has is refused, so the trail holds only real changes.
 */
export async function protectPage(ctx: AppContext, actor: Actor, type: PageType, slug: string, input: PageProtect): Promise<PageModel> {
  if (!can(actor, 'protect:page')) throw forbidden('Only moderators protect pages.');
  return ctx.db.write(async (transaction) => {
    const page = await findPageOfType(type, slug, transaction);
    await refuseIfMerged(type, page);
    if (page.isProtected === input.protected) {
      throw badRequest('Invalid input.', [{ path: 'protected', message: input.protected ? 'the page is already protected' : 'the page is not protected' }]);
    }
    await (page as Method).update({ isProtected: input.protected }, { transaction });
    await PageEvent.create(
      { pageType: type, pageId: page.id, actorId: actor.id, action: input.protected ? 'protect' : 'unprotect', note: input.note ?? null, detail: null },
      { transaction },
    );
    return page;
  });
}
