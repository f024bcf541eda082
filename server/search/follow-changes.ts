import { Op } from 'sequelize';
import type { AppContext } from '../context';
import { Abrasive, Method, Result, Steel } from '../models';
import { follow, type PageChange } from '../changes';
import { changedCells } from '../aggregates/cell-cache';
import { reindexAllCells, reindexCells } from '../aggregates/cell-search';
import { pageSearchDoc, resultDoc, resultDocsOfPage, resultIncludes } from './documents';

const CHUNK = 2000;

/** A changed page's document as it now stands, or none once merged away; with its results' when it was renamed. */
async function reindexPages(ctx: Pick<AppContext, 'search'>, change: PageChange): Promise<void> {
  const model = (change.pageType === 'steel' ? Steel : change.pageType === 'abrasive' ? Abrasive : Method) as typeof Steel;
  for (const id of change.ids) {
    const doc = await pageSearchDoc(change.pageType, id);
    if (doc) ctx.search.upsert(doc);
    else {
      const page = await model.findByPk(id, { attributes: ['slug'] });
      if (page) ctx.search.remove(`${change.pageType}:${page.slug}`);
    }
    if (change.renamed) for (const d of await resultDocsOfPage(change.pageType, id)) ctx.search.upsert(d);
  }
}

/** The documents of results that were or are published: upserted while approved, removed otherwise. */
async function reindexResults(ctx: Pick<AppContext, 'search'>, ids: number[]): Promise<void> {
  for (let i = 0; i < ids.length; i += CHUNK) {
    const slice = ids.slice(i, i + CHUNK);
    const approved = await Result.findAll({ where: { id: { [Op.in]: slice }, status: 'approved' }, include: resultIncludes });
    for (const r of approved) ctx.search.upsert(resultDoc(r));
    const kept = new Set(approved.map((r) => r.id));
    for (const id of slice) if (!kept.has(id)) ctx.search.remove(`result:${id}`);
  }
}

/**
 * The search index follows the change feed of `ctx.db`: after each commit that changed a page
 * or published results, the documents of those pages, results and comparison cells are read
 * again (the search's kept answers are dropped after this). Returns a function that stops it.
 */
export function searchFollowsChanges(ctx: Pick<AppContext, 'search' | 'db'>): () => void {
  return follow(
    ['page', 'cells'],
    async (batch) => {
      if (batch.db !== ctx.db) return;
      const published: number[] = [];
      for (const { change } of batch.changes) {
        if (change.kind === 'page') await reindexPages(ctx, change);
        else if (change.kind === 'result') published.push(...change.published);
      }
      await reindexResults(ctx, [...new Set(published)]);
      const cells = changedCells(batch);
      if (cells === 'all') await reindexAllCells(ctx);
      else if (cells.length) await reindexCells(ctx, cells);
    },
    'index',
  );
}
