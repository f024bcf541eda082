import { can, type Actor } from '@shared/permissions';
import { PAGE_SECTIONS, splitCreate, type PageCreate, type PageType, type SteelFields } from '@shared/schemas/pages';
import type { AppContext } from '../context';
import { badRequest, conflict, forbidden } from '../errors';
import { Abrasive, Method, PageRevision, Steel } from '../models';
import { PAGE_MODELS, type PageModel } from '../queries/pages';
import { checkDesignationsFree, columnsOf } from './revise-page';
import { recordAudit } from './record-audit';

/** A new page and its first revision (numbered 1 on the page, live). */
export interface CreatedPage {
  page: PageModel;
  revision: PageRevision;
}

/**
 * A moderator or admin starts a reference page: the page's row, its first revision (live, so the
 * page is its content at once) and an audit entry commit together; lists, search and kept
 * answers follow with the change feed (page kind). The slug is the one given or the name's
 * (`slugFromName`); a slug any page of the type holds, merged pages included, is refused with 409
 * so that no old link changes meaning. A new method page is version 1 of its protocol.
 */
export async function createPage(ctx: AppContext, actor: Actor, type: PageType, input: PageCreate): Promise<CreatedPage> {
  if (!can(actor, 'create:page')) throw forbidden('Only moderators and admins start new reference pages; propose changes to an existing page instead.');
  const { slug, summary, content } = splitCreate(type, input);
  if (!slug) throw badRequest('Invalid input.', [{ path: 'slug', message: 'the name gives no slug (no Latin letter or digit): give one, such as "aisi-d2"' }]);
  // The interface's form for a new page lives at /{section}/new.
  if (slug === 'new') throw badRequest('Invalid input.', [{ path: 'slug', message: '"new" is the address of the form for a new page: give another slug' }]);
  return ctx.db.write(async (transaction) => {
    const taken = await (PAGE_MODELS[type] as typeof Method).count({ where: { slug }, transaction });
    if (taken) throw conflict(`The slug "${slug}" is taken by another ${type} page (/${PAGE_SECTIONS[type]}/${slug}); give another slug, or edit that page.`);
    let page: PageModel;
    if (type === 'steel') {
      // The columns are checked first (columnsOf), so the designations are known to be well formed.
      const columns = columnsOf('steel', content);
      await checkDesignationsFree(null, content.fields as SteelFields, transaction);
      page = await Steel.create({ slug, ...columns }, { transaction });
    } else if (type === 'abrasive') {
      page = await Abrasive.create({ slug, ...columnsOf('abrasive', content) }, { transaction });
    } else {
      page = await Method.create({ slug, version: 1, ...columnsOf('method', content) }, { transaction });
    }
    const revision = await PageRevision.create(
      { pageType: type, pageId: page.id, authorId: actor.id, summary, fields: content.fields, body: content.body, status: 'live', kind: 'edit', baseRevisionId: null },
      { transaction },
    );
    await (page as Method).update({ currentRevisionId: revision.id }, { transaction });
    await recordAudit(actor, { action: 'page.create', subjectType: type, subjectId: page.id, details: { slug, name: page.name, revision: revision.number } }, transaction);
    return { page, revision };
  });
}
