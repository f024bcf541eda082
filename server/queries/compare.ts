import { Op, type WhereOptions } from 'sequelize';
import type { z } from 'zod';
import type { compareQuerySchema } from '@shared/schemas/result';
import { bandOfPhi } from '@shared/derive-result';
import { ABRASIVE_MATERIALS } from '@shared/vocabulary';
import { ComparisonCell, Method, Result, Steel } from '../models';
import { aggregateGroups } from '../aggregates/comparison-cells';

type CompareQuery = z.infer<typeof compareQuerySchema>;
type CellRow = ReturnType<typeof aggregateGroups>[number];

/**
 * The comparison: one row per method × steel × abrasive material × grit band, from approved
 * results only. Without a hardness filter the rows come from the precomputed cells; with one,
 * they are aggregated from the matching results, by the same function.
 */
export async function compare(query: CompareQuery) {
  const [methods, steels] = await Promise.all([Method.findAll({ attributes: ['id', 'slug', 'name'] }), Steel.findAll({ attributes: ['id', 'slug', 'name'] })]);
  const methodById = new Map(methods.map((m) => [m.id, m]));
  const steelById = new Map(steels.map((s) => [s.id, s]));
  const idOf = (list: { id: number; slug: string }[], slug?: string) => (slug ? (list.find((x) => x.slug === slug)?.id ?? -1) : undefined);
  const methodId = idOf(methods, query.method);
  const steelId = idOf(steels, query.steel);

  let cells: CellRow[];
  if (query.hrcMin === undefined && query.hrcMax === undefined) {
    const where: WhereOptions<ComparisonCell> & Record<string, unknown> = {};
    if (methodId !== undefined) where.methodId = methodId;
    if (steelId !== undefined) where.steelId = steelId;
    if (query.material) where.material = query.material;
    cells = (await ComparisonCell.findAll({ where, raw: true })) as unknown as CellRow[];
  } else {
    const where: Record<string, unknown> = { status: 'approved' };
    if (methodId !== undefined) where.sharpnessMethodId = methodId;
    if (steelId !== undefined) where.steelId = steelId;
    if (query.material) where.material = query.material;
    where.hrc = { ...(query.hrcMin !== undefined ? { [Op.gte]: query.hrcMin } : {}), ...(query.hrcMax !== undefined ? { [Op.lte]: query.hrcMax } : {}) };
    const rows = await Result.findAll({
      where,
      attributes: ['sharpnessMethodId', 'steelId', 'material', 'gritPhi', 'authorId', 'sharpnessMedianG', 'retentionCuts', 'hrc', 'perSideDeg'],
      raw: true,
    });
    cells = aggregateGroups(rows as unknown as Parameters<typeof aggregateGroups>[0]);
  }

  const rows = cells.map((c) => ({
    method: methodById.get(c.methodId)?.slug ?? String(c.methodId),
    methodName: methodById.get(c.methodId)?.name ?? '',
    steel: steelById.get(c.steelId)?.slug ?? String(c.steelId),
    steelName: steelById.get(c.steelId)?.name ?? '',
    material: c.material,
    materialLabel: ABRASIVE_MATERIALS[c.material as keyof typeof ABRASIVE_MATERIALS] ?? c.material,
    gritBand: bandOfPhi(c.gritPhi),
    n: c.n,
    testers: c.testers,
    sharpnessG: {
      median: c.medianG,
      q1: c.q1G,
      q3: c.q3G,
      mean: c.meanG,
      sd: c.sdG,
      ci95: c.ciLoG !== null && c.ciHiG !== null ? ([c.ciLoG, c.ciHiG] as [number, number]) : null,
    },
    retentionCuts: c.retentionMedianCuts !== null ? { median: c.retentionMedianCuts } : null,
    hrcRange: [c.hrcMin, c.hrcMax] as [number, number],
    angleRange: [c.angleMinDeg, c.angleMaxDeg] as [number, number],
  }));
  rows.sort((a, b) => a.methodName.localeCompare(b.methodName) || a.steelName.localeCompare(b.steelName) || a.material.localeCompare(b.material) || b.gritBand.hiUm - a.gritBand.hiUm);
  return { rows };
}
