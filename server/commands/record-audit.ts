import type { Transaction } from 'sequelize';
import type { Actor } from '@shared/permissions';
import type { AppContext } from '../context';
import { AuditEntry } from '../models';
import { record } from '../changes';

/** One moderator or admin action for the audit log. */
export interface AuditRecord {
  action: string;
  subjectType: string;
  subjectId?: number | null;
  reason?: string | null;
  details?: Record<string, unknown> | null;
}

/** Records a done action inside the caller's write transaction, so it commits with the action. */
export async function recordAudit(actor: Actor, entry: AuditRecord, transaction: Transaction): Promise<void> {
  const row = await AuditEntry.create(
    { actorId: actor.id, outcome: 'done', action: entry.action, subjectType: entry.subjectType, subjectId: entry.subjectId ?? null, reason: entry.reason ?? null, details: entry.details ?? null },
    { transaction },
  );
  record(transaction, { kind: 'audit', ids: [row.id] });
}

/**
 * Records a refused attempt (e.g. a second decision on an item already decided) in its own
 * write, since the attempt's transaction was rolled back. `why` is the refusal the actor saw.
 */
export async function recordRefusal(ctx: AppContext, actor: Actor, entry: AuditRecord, why: string): Promise<void> {
  await ctx.db.write(async (transaction) => {
    const row = await AuditEntry.create(
      { actorId: actor.id, outcome: 'refused', action: entry.action, subjectType: entry.subjectType, subjectId: entry.subjectId ?? null, reason: entry.reason ?? null, details: { ...(entry.details ?? {}), refusal: why } },
      { transaction },
    );
    record(transaction, { kind: 'audit', ids: [row.id] });
  });
}
