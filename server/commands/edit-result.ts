import type { Transaction } from 'sequelize';
import { can, type Actor } from '@shared/permissions';
import type { ResultInput, ResultStatus } from '@shared/schemas/result';
import { STATUS_LABELS } from '@shared/vocabulary';
import type { AppContext } from '../context';
import { conflict, forbidden, notFound } from '../errors';
import { Result, ResultEvent, ResultRevision, type User } from '../models';
import { withTrail } from '../queries/results';
import { resolveReferences, resultRow, type ResultReferences } from './submit-result';

/** What an edit did: updated the result at once, or proposed a correction of a published one. */
export interface EditOutcome {
  outcome: 'updated' | 'proposed';
  result: Result;
  revision: ResultRevision;
  /** The input the revision replaces (the result's before the edit). */
  previous: ResultInput;
}

/** The columns an edit rewrites: what was entered, its references and every derived value. */
export function editedColumns(result: Result, input: ResultInput, refs: ResultReferences) {
  const { authorId: _author, status: _status, approvedAt: _approved, ...columns } = resultRow(result.authorId, result.status, input, refs);
  return columns;
}

/**
 * The result's revisions so far, numbered per result. The first edit of a result also keeps
 * the version it replaces, as revision 1 (its input as first posted), so every version is kept.
 */
async function nextRevisionNumber(result: Result, transaction: Transaction): Promise<number> {
  const last = (await ResultRevision.max('number', { where: { resultId: result.id }, transaction })) as number | null;
  if (last) return last + 1;
  await ResultRevision.create(
    { resultId: result.id, number: 1, authorId: result.authorId, input: result.input, status: 'applied', reviewedById: null, note: null, reviewedAt: null, createdAt: result.createdAt },
    { transaction },
  );
  return 2;
}

/**
 * Stores `author`'s result as a draft: kept, not on the review desk, editable until submitted.
 */
export async function saveDraft(ctx: AppContext, author: User, input: ResultInput): Promise<Result> {
  const actor = author.asActor();
  if (!can(actor, 'create:result')) throw forbidden();
  const refs = await resolveReferences(input);
  const id = await ctx.db.write(async (transaction) => {
    const result = await Result.create(resultRow(actor.id, 'draft', input, refs), { transaction });
    await ResultEvent.create({ resultId: result.id, actorId: actor.id, fromStatus: null, toStatus: 'draft', note: null }, { transaction });
    return result.id;
  });
  return (await Result.findByPk(id, { include: withTrail }))!;
}

/**
 * The author's edit of their result, with the same input as a new one. A draft, pending or
 * returned result is updated at once, its derived values recomputed, and goes (back) on the
 * desk as pending (or stays a draft when `keepDraft` and it is one), with a trail entry. A
 * published result is left as it is: the edit becomes a pending revision (a newer one replaces
 * one still waiting) until a moderator decides on it. Every version is kept as a revision.
 */
export async function editResult(ctx: AppContext, actor: Actor, id: number, input: ResultInput, { keepDraft = false } = {}): Promise<EditOutcome> {
  const refs = await resolveReferences(input);
  return ctx.db.write(async (transaction) => {
    const result = await Result.findByPk(id, { include: withTrail, transaction });
    if (!result || !can(actor, 'read:result', { authorId: result.authorId, status: result.status })) throw notFound('Result');
    if (result.authorId !== actor.id) throw forbidden('Only its author edits a result.');
    if (!can(actor, 'edit:result', { authorId: result.authorId, status: result.status })) {
      throw conflict(`This result is "${STATUS_LABELS[result.status]}" and can no longer be edited.`);
    }
    if (keepDraft && result.status !== 'draft') throw conflict('Only a draft is saved as a draft; this result was already submitted.');
    const number = await nextRevisionNumber(result, transaction);
    const previous = result.input;
    if (result.status === 'approved') {
      await ResultRevision.update({ status: 'superseded' }, { where: { resultId: id, status: 'pending' }, transaction });
      const revision = await ResultRevision.create(
        { resultId: id, number, authorId: actor.id, input, status: 'pending', reviewedById: null, note: null, reviewedAt: null },
        { transaction },
      );
      return { outcome: 'proposed' as const, result, revision, previous };
    }
    const from = result.status;
    const to: ResultStatus = keepDraft ? 'draft' : 'pending';
    await result.update({ ...editedColumns(result, input, refs), status: to }, { transaction });
    const revision = await ResultRevision.create(
      { resultId: id, number, authorId: actor.id, input, status: 'applied', reviewedById: null, note: null, reviewedAt: null },
      { transaction },
    );
    const event = await ResultEvent.create({ resultId: id, actorId: actor.id, fromStatus: from, toStatus: to, note: `Edited: revision ${number}` }, { transaction });
    event.actor = result.author;
    Object.assign(result, { steel: refs.steel, abrasive: refs.abrasive, sharpnessMethod: refs.sharpnessMethod, retentionMethod: refs.retentionMethod ?? undefined });
    result.events = [...(result.events ?? []), event];
    return { outcome: 'updated' as const, result, revision, previous };
  });
}

/**
 * Applies an approved revision to its published result inside the reviewer's transaction:
 * the input and every derived value are rewritten; the change feed refreshes the cells it left
 * and joined in the same transaction, and the search index after the commit.
 */
export async function applyRevision(result: Result, revision: ResultRevision, transaction: Transaction): Promise<void> {
  const refs = await resolveReferences(revision.input);
  await result.update(editedColumns(result, revision.input, refs), { transaction });
  Object.assign(result, { steel: refs.steel, abrasive: refs.abrasive, sharpnessMethod: refs.sharpnessMethod, retentionMethod: refs.retentionMethod ?? undefined });
}
