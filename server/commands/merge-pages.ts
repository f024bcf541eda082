import { Op } from 'sequelize';
import { can, type Actor } from '@shared/permissions';
import { deriveResult } from '@shared/derive-result';
import type { GritStandard } from '@shared/grit';
import type { PageMerge, PageType } from '@shared/schemas/pages';
import type { AppContext } from '../context';
import { badRequest, conflict, forbidden, HttpError } from '../errors';
import { Abrasive, Method, PageEvent, Result } from '../models';
import { findPageOfType, PAGE_MODELS, PAGE_WHAT, RESULT_COLUMNS, survivorOf, type PageModel } from '../queries/pages';
import { insertRows } from '../db/insert-rows';

/** What a merge did. */
export interface MergeOutcome {
  source: PageModel;
  target: PageModel;
  /** Ids of the results that now refer to the target instead of the source. */
  movedResultIds: number[];
}

/**
 * A moderator merges a duplicate page (`slug`) into the page that survives (`input.into`), in
 * one transaction: every result on the duplicate moves to the survivor (an abrasive's results
 * re-derive grit and material from the survivor), the comparison cells they leave and enter are
 * refreshed, pages earlier merged into the duplicate now point at the survivor, and the duplicate
 * keeps all its revisions but redirects (`mergedIntoId`). Both pages record a page event naming
 * the other and the moved results. With the change feed the duplicate leaves the search index
 * and the survivor (with the duplicate's names as aliases) and the moved results are re-indexed.
 */
export async function mergePages(ctx: AppContext, actor: Actor, type: PageType, slug: string, input: PageMerge): Promise<MergeOutcome> {
  if (!can(actor, 'merge:page')) throw forbidden('Only moderators merge pages.');
  const outcome = await ctx.db.write(async (transaction): Promise<MergeOutcome> => {
    const source = await findPageOfType(type, slug, transaction);
    const target = await findPageOfType(type, input.into, transaction).catch((err) => {
      if (err instanceof HttpError && err.status === 404) throw badRequest('Invalid input.', [{ path: 'into', message: `no ${PAGE_WHAT[type].toLowerCase()} "${input.into}"` }]);
      throw err;
    });
    if (source.id === target.id) throw badRequest('Invalid input.', [{ path: 'into', message: 'a page cannot be merged into itself' }]);
    if (source.mergedIntoId) {
      const survivor = await survivorOf(type, source);
      throw conflict(`This page was already merged into "${survivor?.name ?? 'another page'}".`);
    }
    if (target.mergedIntoId) {
      const survivor = await survivorOf(type, target);
      throw badRequest('Invalid input.', [{ path: 'into', message: `"${target.name}" was itself merged into "${survivor?.name}" (${survivor?.slug}); merge into that page` }]);
    }

    const columns = RESULT_COLUMNS[type];
    const rows = await Result.findAll({ where: { [Op.or]: columns.map((c) => ({ [c]: source.id })) }, transaction });
    for (const r of rows) {
      const change: Partial<Record<string, unknown>> = {};
      for (const c of columns) if (r[c] === source.id) change[c] = target.id;
      if (type === 'abrasive') {
        const a = target as Abrasive;
        const d = deriveResult(r.input, { standard: a.gritStandard as GritStandard, grade: a.gritGrade });
        Object.assign(change, { material: a.material, gritStandard: d.gritStandard, gritGrade: d.gritGrade, gritUm: d.gritUm, gritPhi: d.gritPhi });
      }
      await r.update(change, { transaction });
    }

    const model = PAGE_MODELS[type] as typeof Method;
    await model.update({ mergedIntoId: target.id }, { where: { mergedIntoId: source.id }, transaction });
    if (type === 'method') {
      // Versions that replaced the duplicate now replace the survivor (never the survivor itself).
      await Method.update({ replacesId: target.id }, { where: { replacesId: source.id, id: { [Op.ne]: target.id } }, transaction });
      if ((target as Method).replacesId === source.id) await (target as Method).update({ replacesId: (source as Method).replacesId }, { transaction });
    }
    await (source as Method).update({ mergedIntoId: target.id }, { transaction });
    const movedResultIds = rows.map((r) => r.id);
    await insertRows(
      PageEvent,
      [
        { pageType: type, pageId: source.id, actorId: actor.id, action: 'merged-into', note: input.note ?? null, detail: { into: target.slug, intoName: target.name, resultIds: movedResultIds } },
        { pageType: type, pageId: target.id, actorId: actor.id, action: 'absorbed', note: input.note ?? null, detail: { from: source.slug, fromName: source.name, resultIds: movedResultIds } },
      ],
      transaction,
    );
    return { source, target, movedResultIds };
  });
  return outcome;
}
