import { Op } from 'sequelize';
import type { z } from 'zod';
import type { auditQuerySchema } from '@shared/schemas/publishing';
import { AuditEntry, User } from '../models';

const PAGE_SIZE = 50;

/** A page of the audit log, newest first; filtered by actor handle and by action (prefix, e.g. "result."). */
export async function auditLog(query: z.infer<typeof auditQuerySchema>) {
  const where: Record<string | symbol, unknown> = {};
  if (query.actor) {
    const actor = await User.findOne({ where: { handle: query.actor }, attributes: ['id'] });
    where.actorId = actor?.id ?? -1;
  }
  if (query.action) where.action = { [Op.startsWith]: query.action };
  const { rows, count } = await AuditEntry.findAndCountAll({
    where,
    include: [{ model: User, as: 'actor' }],
    order: [['createdAt', 'DESC'], ['id', 'DESC']],
    limit: PAGE_SIZE,
    offset: (query.page - 1) * PAGE_SIZE,
  });
  return { items: rows, page: query.page, pageSize: PAGE_SIZE, total: count };
}
