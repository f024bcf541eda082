import type { WhereOptions } from 'sequelize';
import type { z } from 'zod';
import { bandStartOf } from '@shared/aggregate';
import { bandInfo } from '@shared/compare-view';
import type { comparePointsQuerySchema } from '@shared/schemas/compare';
import { Result } from '../models';
import { resolveView, resultWhere } from './compare-view';
import { handlesOf } from './compare-cell';

interface PointRow {
  id: number;
  steelId: number;
  abrasiveId: number;
  material: string;
  gritPhi: number;
  gritUm: number;
  sharpnessMedianG: number;
  hrc: number;
  perSideDeg: number;
  retentionCuts: number | null;
  authorId: number;
}

/**
 * GET /api/compare/points: the view's results as chart points (particle size, median reading,
 * hardness, angle, cuts), one per result. Beyond `limit` results an evenly spaced sample in id
 * order is returned, and the response says so.
 */
export async function comparePoints(query: z.infer<typeof comparePointsQuerySchema>) {
  const { limit, ...filters } = query;
  const view = await resolveView(filters);
  const where = (await resultWhere(view)) as WhereOptions<Result>;
  const rows = (await Result.findAll({
    where,
    attributes: ['id', 'steelId', 'abrasiveId', 'material', 'gritPhi', 'gritUm', 'sharpnessMedianG', 'hrc', 'perSideDeg', 'retentionCuts', 'authorId'],
    order: [['id', 'ASC']],
    raw: true,
  })) as unknown as PointRow[];
  const inView = rows.filter((r) => {
    if (filters.umMin === undefined && filters.umMax === undefined) return true;
    const b = bandInfo(bandStartOf(r, view.step) / 2, view.step);
    return (filters.umMax === undefined || b.loUm < filters.umMax) && (filters.umMin === undefined || b.hiUm > filters.umMin);
  });
  const every = Math.max(1, Math.ceil(inView.length / limit));
  const shown = every === 1 ? inView : inView.filter((_, i) => i % every === 0);
  const handles = await handlesOf([...new Set(shown.map((r) => r.authorId))]);
  const steels: Record<string, string> = {};
  const abrasives: Record<string, { name: string; material: string; bond: string }> = {};
  const points = shown.map((r) => {
    const steel = view.look.steels.get(r.steelId);
    const abrasive = view.look.abrasives.get(r.abrasiveId);
    if (steel) steels[steel.slug] = steel.name;
    if (abrasive) abrasives[abrasive.slug] = { name: abrasive.name, material: abrasive.material, bond: abrasive.bond };
    return {
      id: r.id,
      steel: steel?.slug ?? String(r.steelId),
      abrasive: abrasive?.slug ?? String(r.abrasiveId),
      material: r.material,
      gritUm: Math.round(r.gritUm * 1000) / 1000,
      medianG: Math.round(r.sharpnessMedianG * 100) / 100,
      hrc: Math.round(r.hrc * 10) / 10,
      perSideDeg: Math.round(r.perSideDeg * 100) / 100,
      retentionCuts: r.retentionCuts,
      author: handles.get(r.authorId) ?? null,
    };
  });
  return {
    method: { slug: view.method.slug, name: view.method.name, version: view.method.version },
    total: inView.length,
    sampledEvery: every,
    points,
    steels,
    abrasives,
  };
}
