import { Op, fn, col, where as sqlWhere } from 'sequelize';
import type { z } from 'zod';
import type { adminUsersQuerySchema } from '@shared/schemas/admin';
import type { ResultStatus } from '@shared/schemas/result';
import { Result, User } from '../models';

const PAGE_SIZE = 50;

/**
 * Accounts for the admins' screen, by handle, whose handle or display name contains `q`
 * (case-insensitive), with how many of their results are published and how many were returned.
 */
export async function listUsers(query: z.infer<typeof adminUsersQuerySchema>) {
  const q = query.q?.toLowerCase();
  const filter = q
    ? { [Op.or]: [sqlWhere(fn('lower', col('handle')), { [Op.substring]: q }), sqlWhere(fn('lower', col('displayName')), { [Op.substring]: q })] }
    : {};
  const { rows, count } = await User.findAndCountAll({ where: filter, order: [['handle', 'ASC']], limit: PAGE_SIZE, offset: (query.page - 1) * PAGE_SIZE });
  const countOf = await resultCountsByAuthor(rows.map((u) => u.id));
  return {
    items: rows.map((u) => ({ user: u, published: countOf(u.id, 'approved'), returned: countOf(u.id, 'returned'), pending: countOf(u.id, 'pending') })),
    page: query.page,
    pageSize: PAGE_SIZE,
    total: count,
  };
}

/** How many of each author's results are in each status (0 when none): `countOf(authorId, status)`. */
export async function resultCountsByAuthor(authorIds: number[]): Promise<(authorId: number, status: ResultStatus) => number> {
  const counts = (await Result.findAll({
    attributes: ['authorId', 'status', [fn('COUNT', col('id')), 'n']],
    where: { authorId: authorIds },
    group: ['authorId', 'status'],
    raw: true,
  })) as unknown as { authorId: number; status: string; n: number }[];
  return (authorId, status) => Number(counts.find((c) => c.authorId === authorId && c.status === status)?.n ?? 0);
}
