import type { AppContext } from '../context';
import { ComparisonCell } from '../models';
import { cellDoc } from '../search/cell-docs';
import type { SearchDoc } from '../search/search-index';
import { lookups } from '../queries/compare-lookups';
import { presentCell } from '../queries/compare-view';
import { methodCells } from './cell-cache';
import { onCellsChanged, type CellKey, type CellRecord } from './comparison-cells';

// Keys of the cell documents this process has put in the index, so a cell that empties is removed.
const indexed = new Set<string>();

async function docsOf(cells: CellRecord[]): Promise<SearchDoc[]> {
  const look = await lookups();
  const docs: SearchDoc[] = [];
  const overall = new Map<number, number | null>();
  for (const c of cells) {
    const method = look.methods.get(c.methodId);
    if (!method) continue;
    if (!overall.has(c.methodId)) overall.set(c.methodId, (await methodCells(c.methodId, 1)).overallMedianG);
    const row = presentCell({ method, look }, c, overall.get(c.methodId) ?? null);
    const steel = look.steels.get(c.steelId);
    if (steel) docs.push(cellDoc(row, steel, method));
  }
  return docs;
}

/** Every whole-φ cell as a search document (for the index's build at start-up). */
export async function* allCellDocs(): AsyncGenerator<SearchDoc> {
  const cells = (await ComparisonCell.findAll({ where: { bandWidth: 2 }, raw: true })) as unknown as CellRecord[];
  for (const d of await docsOf(cells)) {
    indexed.add(d.key);
    yield d;
  }
}

async function refreshKeys(ctx: AppContext, keys: CellKey[]): Promise<void> {
  const look = await lookups();
  for (const k of keys) {
    const method = look.methods.get(k.methodId);
    const steel = look.steels.get(k.steelId);
    if (!method || !steel) continue;
    const key = `cell:${method.slug}:${steel.slug}:${k.material}:${k.gritPhi}`;
    const cell = (await ComparisonCell.findOne({ where: { methodId: k.methodId, steelId: k.steelId, material: k.material, bandWidth: 2, bandStart: 2 * k.gritPhi }, raw: true })) as unknown as CellRecord | null;
    if (cell) {
      const [doc] = await docsOf([cell]);
      ctx.search.upsert(doc);
      indexed.add(doc.key);
    } else {
      ctx.search.remove(key);
      indexed.delete(key);
    }
  }
}

async function refreshAll(ctx: AppContext): Promise<void> {
  const before = new Set(indexed);
  for await (const doc of allCellDocs()) {
    ctx.search.upsert(doc);
    before.delete(doc.key);
  }
  for (const key of before) {
    ctx.search.remove(key);
    indexed.delete(key);
  }
}

/**
 * Keeps the comparison cells in the search index in step with the table: after every commit
 * that refreshed cells, each touched whole-φ cell's document is replaced (or removed when the
 * cell emptied). Returns a function that stops listening.
 */
export function keepCellsInStep(ctx: AppContext): () => void {
  return onCellsChanged((change) => {
    const work = 'all' in change ? refreshAll(ctx) : refreshKeys(ctx, change.keys);
    work.catch((err) => console.error('search: could not update comparison cells', err));
  });
}
