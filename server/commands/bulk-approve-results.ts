import { Op } from 'sequelize';
import { can, type Actor } from '@shared/permissions';
import { STATUS_LABELS } from '@shared/vocabulary';
import type { AppContext } from '../context';
import { forbidden, notFound } from '../errors';
import { AuditEntry, ImportBatch, ImportBatchResult, Result, ResultEvent, User } from '../models';
import { notifyMember } from '../mail/notify-member';
import { insertRows } from '../db/insert-rows';

const CHUNK = 1000;

/** What a bulk approval did: the results approved, and those refused with the reason. */
export interface BulkApproval {
  approved: number[];
  refused: { id: number; reason: string }[];
}

/**
 * A moderator approves many pending results at once (typically one trusted publisher's
 * import). In one transaction: each still-pending result not by the moderator is approved
 * with its trail entry, every decision and every refusal (already decided, own result,
 * unknown) gets an audit entry, and each comparison cell touched is refreshed once. The search
 * index follows with the change feed, and each author gets one summary e-mail.
 */
export async function bulkApproveResults(ctx: AppContext, actor: Actor, target: { ids?: number[]; importId?: number; note?: string }): Promise<BulkApproval> {
  if (!can(actor, 'bulk-approve:results')) throw forbidden('Only moderators approve results.');
  const outcome = await ctx.db.write(async (transaction) => {
    let ids = target.ids ?? [];
    if (target.importId) {
      const batch = await ImportBatch.findByPk(target.importId, { transaction });
      if (!batch) throw notFound('Import');
      ids = (await ImportBatchResult.findAll({ where: { batchId: batch.id }, attributes: ['resultId'], transaction })).map((r) => r.resultId);
    }
    ids = [...new Set(ids)];
    const results: Result[] = [];
    for (let i = 0; i < ids.length; i += CHUNK) results.push(...(await Result.findAll({ where: { id: { [Op.in]: ids.slice(i, i + CHUNK) } }, transaction })));
    const found = new Map(results.map((r) => [r.id, r]));
    const approved: Result[] = [];
    const refused: BulkApproval['refused'] = [];
    for (const id of ids) {
      const r = found.get(id);
      if (!r) refused.push({ id, reason: 'no such result' });
      else if (r.status !== 'pending') refused.push({ id, reason: `already decided: it is now "${STATUS_LABELS[r.status]}"` });
      else if (!can(actor, 'review:result', { authorId: r.authorId, status: r.status })) refused.push({ id, reason: 'you cannot review your own result' });
      else approved.push(r);
    }
    const now = new Date();
    const approvedIds = approved.map((r) => r.id);
    for (let i = 0; i < approvedIds.length; i += CHUNK) {
      await Result.update({ status: 'approved', approvedAt: now }, { where: { id: { [Op.in]: approvedIds.slice(i, i + CHUNK) }, status: 'pending' }, transaction });
    }
    const note = target.note ?? null;
    for (let i = 0; i < approved.length; i += CHUNK) {
      const slice = approved.slice(i, i + CHUNK);
      await insertRows(ResultEvent, slice.map((r) => ({ resultId: r.id, actorId: actor.id, fromStatus: 'pending' as const, toStatus: 'approved' as const, note })), transaction);
    }
    const details = { bulk: true, ...(target.importId ? { importId: target.importId } : {}) };
    const audits = [
      ...approved.map((r) => ({ actorId: actor.id, action: 'result.approve', outcome: 'done' as const, subjectType: 'result', subjectId: r.id, reason: note, details: { ...details, from: 'pending', to: 'approved' } })),
      ...refused.map((r) => ({ actorId: actor.id, action: 'result.approve', outcome: 'refused' as const, subjectType: 'result', subjectId: r.id, reason: note, details: { ...details, refusal: r.reason } })),
    ];
    for (let i = 0; i < audits.length; i += CHUNK) await insertRows(AuditEntry, audits.slice(i, i + CHUNK), transaction);
    if (target.importId) {
      // What was refused while still pending (the moderator's own) keeps the import open.
      const stillPending = refused.some((r) => found.get(r.id)?.status === 'pending');
      if (!stillPending && approved.length) await ImportBatch.update({ status: 'approved' }, { where: { id: target.importId }, transaction });
    }
    const perAuthor = new Map<number, number>();
    for (const r of approved) perAuthor.set(r.authorId, (perAuthor.get(r.authorId) ?? 0) + 1);
    return { approved: approvedIds, refused, perAuthor };
  });

  for (const [authorId, count] of outcome.perAuthor) {
    const author = await User.findByPk(authorId);
    if (!author) continue;
    notifyMember(ctx, author, 'review', {
      subject: `${count === 1 ? 'One result' : `${count} results`} of yours published`,
      greeting: `Hello ${author.displayName},`,
      paragraphs: [`A moderator approved ${target.importId ? `your import #${target.importId}` : 'a batch of your results'}: they are published now and count in the comparison tables.`],
      quote: target.note ? { label: "The moderator's note", text: target.note } : undefined,
      action: { label: 'Your results', url: `${ctx.baseUrl}/me` },
    }).catch(() => undefined);
  }
  return { approved: outcome.approved, refused: outcome.refused };
}
