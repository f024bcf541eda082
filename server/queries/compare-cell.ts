import type { WhereOptions } from 'sequelize';
import type { z } from 'zod';
import { bandStartOf, type BandedMember } from '@shared/aggregate';
import type { CellRef, compareCellQuerySchema } from '@shared/schemas/compare';
import { limits } from '@shared/validations';
import { badRequest } from '../errors';
import { Result, User } from '../models';
import { cellsOf, memberAttributes } from '../aggregates/comparison-cells';
import { methodCells } from '../aggregates/cell-cache';
import { resultIncludes } from '../search/documents';
import { presentCell, resolveView, resultWhere, type ResolvedView } from './compare-view';

type Member = BandedMember & { id: number; createdAt: Date };

/** The view's results in one named cell (checked against the view's band step). */
export async function cellMembers(view: ResolvedView, ref: CellRef, field: string): Promise<Member[]> {
  const steel = view.look.steelBySlug.get(ref.steel);
  if (!steel) throw badRequest('Invalid query.', [{ path: field, message: `no steel page "${ref.steel}"` }]);
  if (view.step === 1 && !Number.isInteger(ref.phi)) {
    throw badRequest('Invalid query.', [{ path: field, message: `φ ${ref.phi} starts a half band; add step=0.5 or give a whole φ` }]);
  }
  const where = { ...(await resultWhere(view)), steelId: steel.id, material: ref.material, gritPhi: Math.floor(ref.phi) } as WhereOptions<Result>;
  const rows = (await Result.findAll({ where, attributes: [...memberAttributes, 'id', 'createdAt'], raw: true })) as unknown as Member[];
  return rows.filter((m) => bandStartOf(m, view.step) === Math.round(2 * ref.phi));
}

/**
 * GET /api/compare/cell: one cell's figures and a page of its results (newest first), under the
 * same filters as the view it was opened from (the route presents the results).
 */
export async function compareCell(query: z.infer<typeof compareCellQuerySchema>) {
  const { cell: ref, page, ...filters } = query;
  const view = await resolveView(filters);
  const members = await cellMembers(view, ref, 'cell');
  const [figures] = cellsOf(members, [view.step]);
  const { overallMedianG } = await methodCells(view.method.id, view.step);
  const row = figures ? presentCell(view, figures, overallMedianG) : null;
  const ordered = [...members].sort((a, b) => new Date(b.createdAt).getTime() - new Date(a.createdAt).getTime() || b.id - a.id);
  const ids = ordered.slice((page - 1) * limits.pageSize, page * limits.pageSize).map((m) => m.id);
  const results = ids.length ? await Result.findAll({ where: { id: ids }, include: resultIncludes }) : [];
  const byId = new Map(results.map((r) => [r.id, r]));
  return {
    method: { slug: view.method.slug, name: view.method.name, version: view.method.version },
    cell: row,
    results: ids.map((id) => byId.get(id)!),
    page,
    pageSize: limits.pageSize,
    total: members.length,
  };
}

/** Handles of the given user ids. */
export async function handlesOf(ids: number[]): Promise<Map<number, string>> {
  if (!ids.length) return new Map();
  const users = await User.findAll({ where: { id: ids }, attributes: ['id', 'handle'], raw: true });
  return new Map(users.map((u) => [u.id, u.handle]));
}
