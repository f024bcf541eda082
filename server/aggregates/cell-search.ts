import type { AppContext } from '../context';
import { ComparisonCell } from '../models';
import { cellDoc } from '../search/cell-docs';
import type { SearchDoc } from '../search/search-index';
import { lookups } from '../queries/compare-lookups';
import { presentCell } from '../queries/compare-view';
import { methodCells } from './cell-cache';
import type { CellKey } from '../changes';
import type { CellRecord } from './comparison-cells';

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

/** Replaces the documents of the whole-φ cells `keys` (removes those of cells that emptied). */
export async function reindexCells(ctx: Pick<AppContext, 'search'>, keys: CellKey[]): Promise<void> {
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

/** Replaces every cell document (after a full rebuild). */
export async function reindexAllCells(ctx: Pick<AppContext, 'search'>): Promise<void> {
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
