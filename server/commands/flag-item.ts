import { can, type Actor } from '@shared/permissions';
import type { FlagInput, FlagResolutionInput, FlagSubject } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { conflict, forbidden, HttpError, notFound } from '../errors';
import { Abrasive, Flag, Method, Result, Steel } from '../models';
import { recordAudit, recordRefusal } from './record-audit';

const pageModels = { steel: Steel, abrasive: Abrasive, method: Method } as const;

/** The id of what a flag is about: an approved result by number, or a page by slug. */
async function subjectIdOf(type: FlagSubject, subject: number | string): Promise<number> {
  if (type === 'result') {
    const result = await Result.findByPk(subject as number, { attributes: ['id', 'status'] });
    // Only published results can be flagged; anything else is not visible to the flagger.
    if (!result || result.status !== 'approved') throw notFound('Published result');
    return result.id;
  }
  const page = await (pageModels[type] as typeof Steel).findOne({ where: { slug: subject as string }, attributes: ['id'] });
  if (!page) throw notFound(`The ${type} page`);
  return page.id;
}

/** A member flags an approved result or a page; one open flag per member and item. */
export async function flagItem(ctx: AppContext, actor: Actor, input: FlagInput): Promise<Flag> {
  if (!can(actor, 'create:flag')) throw forbidden();
  const subjectId = await subjectIdOf(input.subjectType, input.subject);
  return ctx.db.write(async (transaction) => {
    const open = await Flag.findOne({ where: { subjectType: input.subjectType, subjectId, reporterId: actor.id, status: 'open' }, transaction });
    if (open) throw conflict('You already flagged this; a moderator will look at it.');
    return Flag.create(
      { subjectType: input.subjectType, subjectId, reporterId: actor.id, reason: input.reason, text: input.text ?? null, status: 'open', resolvedById: null, resolutionNote: null, resolvedAt: null },
      { transaction },
    );
  });
}

/** A moderator closes an open flag as upheld or dismissed, with a note; audited, a second close refused with 409. */
export async function resolveFlag(ctx: AppContext, actor: Actor, id: number, input: FlagResolutionInput): Promise<Flag> {
  if (!can(actor, 'resolve:flag')) throw forbidden('Only moderators close flags.');
  const audit = { action: `flag.${input.outcome === 'upheld' ? 'uphold' : 'dismiss'}`, subjectType: 'flag', subjectId: id, reason: input.note };
  return ctx.db
    .write(async (transaction) => {
      const flag = await Flag.findByPk(id, { transaction });
      if (!flag) throw notFound('Flag');
      if (flag.status !== 'open') throw conflict(`This flag was already closed: ${flag.status}.`);
      await flag.update({ status: input.outcome, resolvedById: actor.id, resolutionNote: input.note, resolvedAt: new Date() }, { transaction });
      await recordAudit(actor, { ...audit, details: { on: `${flag.subjectType}:${flag.subjectId}`, reason: flag.reason } }, transaction);
      return flag;
    })
    .catch(async (err: unknown) => {
      if (err instanceof HttpError && err.status === 409) await recordRefusal(ctx, actor, audit, err.message);
      throw err;
    });
}
