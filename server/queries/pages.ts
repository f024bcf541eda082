import { fn, col } from 'sequelize';
import { Abrasive, Method, Result, Steel } from '../models';
import { notFound } from '../errors';

/** Approved result counts per steel or abrasive id. */
export async function approvedCounts(by: 'steelId' | 'abrasiveId'): Promise<Map<number, number>> {
  const rows = (await Result.findAll({ where: { status: 'approved' }, attributes: [by, [fn('COUNT', col('id')), 'n']], group: [by], raw: true })) as unknown as Record<string, number>[];
  return new Map(rows.map((r) => [Number(r[by]), Number(r.n)]));
}

export const listSteels = () => Steel.findAll({ order: [['name', 'ASC']] });
export const listAbrasives = () => Abrasive.findAll({ order: [['material', 'ASC'], ['gritUm', 'DESC']] });
export const listMethods = () => Method.findAll({ order: [['name', 'ASC'], ['version', 'ASC']] });

/** One page by slug, or 404. */
export async function findPage<T extends typeof Steel | typeof Abrasive | typeof Method>(model: T, slug: string, what: string): Promise<InstanceType<T>> {
  const page = await (model as typeof Steel).findOne({ where: { slug } });
  if (!page) throw notFound(what);
  return page as InstanceType<T>;
}
