import type { Transaction } from 'sequelize';
import { cellColumns, groupIntoCells, type BandedCellKey, type BandedMember, type CellColumns } from '@shared/aggregate';
import { ComparisonCell, Result } from '../models';
import type { Database } from '../db/database';

/**
 * The precomputed comparison cells. A cell is method × steel × abrasive material × grit band,
 * stored for whole-φ bands and for the two half-φ bands inside each, from approved results
 * only. Any write that moves a result into or out of `approved` (approval, retraction, an edit
 * of an approved result, a merge) calls `refreshCell` (or `refreshCellsOf`) inside its own
 * transaction, so the comparison changes in the same commit; listeners registered with
 * `onCellsChanged` (the comparison's read cache, the search index) hear of it after the commit.
 */

/** The whole-φ key of the cells one result belongs to (its half-φ cells lie inside it). */
export interface CellKey {
  methodId: number;
  steelId: number;
  material: string;
  gritPhi: number;
}

/** One stored cell: its key (band in half-φ units) and its figures. */
export type CellRecord = BandedCellKey & CellColumns;

/** The whole-φ cell key of a result. */
export const cellKeyOf = (r: Pick<Result, 'sharpnessMethodId' | 'steelId' | 'material' | 'gritPhi'>): CellKey => ({
  methodId: r.sharpnessMethodId,
  steelId: r.steelId,
  material: r.material,
  gritPhi: r.gritPhi,
});

/** What changed: some cells (by whole-φ key), or every cell after a rebuild. */
export type CellChange = { keys: CellKey[] } | { all: true };
type Listener = (change: CellChange) => void;
const listeners = new Set<Listener>();

/**
 * Calls `listener` after every commit that refreshed cells, and after a full rebuild.
 * Returns a function that removes the listener. Listeners must not throw; errors are logged.
 */
export function onCellsChanged(listener: Listener): () => void {
  listeners.add(listener);
  return () => listeners.delete(listener);
}

function notify(change: CellChange): void {
  for (const l of listeners) {
    try {
      l(change);
    } catch (err) {
      console.error('comparison cells: a listener failed', err);
    }
  }
}

/** The attributes of a result that its cells need. */
export const memberAttributes = ['sharpnessMethodId', 'steelId', 'material', 'gritPhi', 'gritUm', 'authorId', 'sharpnessMedianG', 'retentionCuts', 'hrc', 'perSideDeg'] as const;

/** Cells (both band steps) of a set of results, with their figures. */
export function cellsOf(members: readonly BandedMember[], steps: readonly (1 | 0.5)[] = [1, 0.5]): CellRecord[] {
  return steps.flatMap((step) => groupIntoCells(members, step).map((g) => ({ ...g.key, ...cellColumns(g.members) })));
}

// Keys refreshed in a transaction that has not committed yet; one notification per commit.
const pending = new WeakMap<Transaction, Map<string, CellKey>>();

/**
 * Recomputes the whole-φ cell `key` and its two half-φ cells from their approved results,
 * inside the caller's write transaction. Listeners hear of it after the commit.
 */
export async function refreshCell(key: CellKey, transaction: Transaction): Promise<void> {
  const members = (await Result.findAll({
    where: { sharpnessMethodId: key.methodId, steelId: key.steelId, material: key.material, gritPhi: key.gritPhi, status: 'approved' },
    attributes: [...memberAttributes],
    raw: true,
    transaction,
  })) as unknown as BandedMember[];
  await ComparisonCell.destroy({
    where: { methodId: key.methodId, steelId: key.steelId, material: key.material, bandStart: [2 * key.gritPhi, 2 * key.gritPhi + 1] },
    transaction,
  });
  if (members.length) {
    const updatedAt = new Date();
    await ComparisonCell.bulkCreate(cellsOf(members).map((c) => ({ ...c, updatedAt })), { transaction });
  }
  let keys = pending.get(transaction);
  if (!keys) {
    const fresh = new Map<string, CellKey>();
    pending.set(transaction, fresh);
    keys = fresh;
    transaction.afterCommit(() => notify({ keys: [...fresh.values()] }));
  }
  keys.set(`${key.methodId}|${key.steelId}|${key.material}|${key.gritPhi}`, key);
}

/**
 * Refreshes the cells of every given result (each distinct cell once), inside the caller's
 * write transaction: call it after changing the status of results, e.g. on retraction, a
 * batch approval or an edit of an approved result (pass the result both before and after an
 * edit that changes its steel, abrasive material, grit or method).
 */
export async function refreshCellsOf(results: readonly Pick<Result, 'sharpnessMethodId' | 'steelId' | 'material' | 'gritPhi'>[], transaction: Transaction): Promise<void> {
  const seen = new Map<string, CellKey>();
  for (const r of results) {
    const key = cellKeyOf(r);
    seen.set(`${key.methodId}|${key.steelId}|${key.material}|${key.gritPhi}`, key);
  }
  for (const key of seen.values()) await refreshCell(key, transaction);
}

/** Rebuilds every cell from the approved results in one transaction (`npm run reaggregate`); returns how many. */
export async function rebuildAllCells(db: Database): Promise<number> {
  const count = await db.write(async (transaction) => {
    const rows = (await Result.findAll({ where: { status: 'approved' }, attributes: [...memberAttributes], raw: true, transaction })) as unknown as BandedMember[];
    await ComparisonCell.destroy({ where: {}, transaction });
    const updatedAt = new Date();
    const cells = cellsOf(rows).map((c) => ({ ...c, updatedAt }));
    for (let i = 0; i < cells.length; i += 500) await ComparisonCell.bulkCreate(cells.slice(i, i + 500), { transaction });
    return cells.length;
  });
  notify({ all: true });
  return count;
}
