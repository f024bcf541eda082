import type { Transaction } from 'sequelize';
import type { Actor } from '@shared/permissions';
import type { AppContext } from '../context';
import { AuditEntry } from '../models';

/** One moderator or admin action for the audit log. */
export interface AuditRecord {
  action: string;
  subjectType: string;
  subjectId?: number | null;
  reason?: string | null;
  details?: Record<string, unknown> | null;
}

/** Records a done action inside the caller's write transaction, so it commits with the action. */
export async function recordAudit(actor: Actor, record: AuditRecord, transaction: Transaction): Promise<void> {
  await AuditEntry.create(
    { actorId: actor.id, outcome: 'done', action: record.action, subjectType: record.subjectType, subjectId: record.subjectId ?? null, reason: record.reason ?? null, details: record.details ?? null },
    { transaction },
  );
}

/**
 * Records a refused attempt (e.g. a second decision on an item already decided) in its own
 * write, since the attempt's transaction was rolled back. `why` is the refusal the actor saw.
 */
export async function recordRefusal(ctx: AppContext, actor: Actor, record: AuditRecord, why: string): Promise<void> {
  await ctx.db.write((transaction) =>
    AuditEntry.create(
      { actorId: actor.id, outcome: 'refused', action: record.action, subjectType: record.subjectType, subjectId: record.subjectId ?? null, reason: record.reason ?? null, details: { ...(record.details ?? {}), refusal: why } },
      { transaction },
    ),
  );
}
