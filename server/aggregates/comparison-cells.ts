import type { Transaction } from 'sequelize';
import { cellColumns, groupIntoCells, type BandedCellKey, type BandedMember, type CellColumns } from '@shared/aggregate';
import { ComparisonCell, Result } from '../models';
import type { Database } from '../db/database';
import { record } from '../changes/feed';
import type { CellKey } from '../changes/kinds';

/**
 * The precomputed comparison cells. A cell is method × steel × abrasive material × grit band,
 * stored for whole-φ bands and for the two half-φ bands inside each, from approved results
 * only. They follow the change feed inside the transaction: a write that records a change of
 * approved results (`record(transaction, resultsChanged(now, before))`, server/changes/) has
 * their cells refreshed by the feed before its commit, so the comparison changes in the same
 * commit, and the followers of `cells` (the cell cache, the search index, kept answers) hear
 * of it after.
 */

export type { CellKey };

/** One stored cell: its key (band in half-φ units) and its figures. */
export type CellRecord = BandedCellKey & CellColumns;

/** The attributes of a result that its cells need. */
export const memberAttributes = ['sharpnessMethodId', 'steelId', 'material', 'gritPhi', 'gritUm', 'authorId', 'sharpnessMedianG', 'retentionCuts', 'hrc', 'perSideDeg'] as const;

/** Cells (both band steps) of a set of results, with their figures. */
export function cellsOf(members: readonly BandedMember[], steps: readonly (1 | 0.5)[] = [1, 0.5]): CellRecord[] {
  return steps.flatMap((step) => groupIntoCells(members, step).map((g) => ({ ...g.key, ...cellColumns(g.members) })));
}

/**
 * Recomputes the whole-φ cells `keys` and the half-φ cells inside them from their approved
 * results, inside the caller's write transaction. Only the change feed calls it, for the cells
 * of the result changes a transaction recorded.
 */
export async function refreshCells(keys: readonly CellKey[], transaction: Transaction): Promise<void> {
  for (const key of keys) {
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
  }
}

/** Rebuilds every cell from the approved results in one transaction (`npm run reaggregate`); returns how many. */
export async function rebuildAllCells(db: Database): Promise<number> {
  const count = await db.write(async (transaction) => {
    const rows = (await Result.findAll({ where: { status: 'approved' }, attributes: [...memberAttributes], raw: true, transaction })) as unknown as BandedMember[];
    await ComparisonCell.destroy({ where: {}, transaction });
    const updatedAt = new Date();
    const cells = cellsOf(rows).map((c) => ({ ...c, updatedAt }));
    for (let i = 0; i < cells.length; i += 500) await ComparisonCell.bulkCreate(cells.slice(i, i + 500), { transaction });
    record(transaction, { kind: 'cells', all: true });
    return cells.length;
  });
  return count;
}
