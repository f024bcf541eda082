import type { Transaction } from 'sequelize';
import { aggregateCell, type CellMember } from '@shared/aggregate';
import { ComparisonCell, Result } from '../models';
import type { Database } from '../db/database';

/** The key of a comparison cell. */
export interface CellKey {
  methodId: number;
  steelId: number;
  material: string;
  gritPhi: number;
}

export const cellKeyOf = (r: Pick<Result, 'sharpnessMethodId' | 'steelId' | 'material' | 'gritPhi'>): CellKey => ({
  methodId: r.sharpnessMethodId,
  steelId: r.steelId,
  material: r.material,
  gritPhi: r.gritPhi,
});

const memberAttributes = ['authorId', 'sharpnessMedianG', 'retentionCuts', 'hrc', 'perSideDeg'] as const;

/** The stored row for a cell from its approved members. */
function cellRow(key: CellKey, members: CellMember[]) {
  const a = aggregateCell(members);
  return {
    ...key,
    n: a.n,
    testers: a.testers,
    medianG: a.sharpnessG.median,
    q1G: a.sharpnessG.q1,
    q3G: a.sharpnessG.q3,
    meanG: a.sharpnessG.mean,
    sdG: a.sharpnessG.sd,
    ciLoG: a.sharpnessG.ci95?.[0] ?? null,
    ciHiG: a.sharpnessG.ci95?.[1] ?? null,
    retentionMedianCuts: a.retentionMedianCuts,
    hrcMin: a.hrcRange[0],
    hrcMax: a.hrcRange[1],
    angleMinDeg: a.angleRange[0],
    angleMaxDeg: a.angleRange[1],
    updatedAt: new Date(),
  };
}

/**
 * Recomputes one cell from its approved results, inside the caller's write transaction, so
 * the comparison changes in the same commit as the result that changed it.
 */
export async function refreshCell(key: CellKey, transaction: Transaction): Promise<void> {
  const where = { sharpnessMethodId: key.methodId, steelId: key.steelId, material: key.material, gritPhi: key.gritPhi, status: 'approved' as const };
  const members = (await Result.findAll({ where, attributes: [...memberAttributes], raw: true, transaction })) as unknown as CellMember[];
  await ComparisonCell.destroy({ where: { ...key }, transaction });
  if (members.length) await ComparisonCell.create(cellRow(key, members), { transaction });
}

/** Rebuilds every cell from the approved results in one transaction (`npm run reaggregate`). */
export async function rebuildAllCells(db: Database): Promise<number> {
  return db.write(async (transaction) => {
    const rows = (await Result.findAll({
      where: { status: 'approved' },
      attributes: ['sharpnessMethodId', 'steelId', 'material', 'gritPhi', ...memberAttributes],
      raw: true,
      transaction,
    })) as unknown as Parameters<typeof aggregateGroups>[0];
    await ComparisonCell.destroy({ where: {}, transaction });
    const cells = aggregateGroups(rows);
    for (let i = 0; i < cells.length; i += 500) await ComparisonCell.bulkCreate(cells.slice(i, i + 500), { transaction });
    return cells.length;
  });
}

/** Groups members by cell key and aggregates each (used for filtered views computed live). */
export function aggregateGroups(rows: (CellMember & { sharpnessMethodId: number; steelId: number; material: string; gritPhi: number })[]) {
  const groups = new Map<string, { key: CellKey; members: CellMember[] }>();
  for (const r of rows) {
    const key = cellKeyOf(r);
    const id = `${key.methodId}|${key.steelId}|${key.material}|${key.gritPhi}`;
    let g = groups.get(id);
    if (!g) groups.set(id, (g = { key, members: [] }));
    g.members.push(r);
  }
  return [...groups.values()].map((g) => cellRow(g.key, g.members));
}
