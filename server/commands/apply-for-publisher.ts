import { can, type Actor } from '@shared/permissions';
import type { PublisherApplicationInput } from '@shared/schemas/publishing';
import type { AppContext } from '../context';
import { conflict, forbidden } from '../errors';
import { PublisherApplication } from '../models';

/** A member applies to become a publisher; one open application at a time. */
export async function applyForPublisher(ctx: AppContext, actor: Actor, input: PublisherApplicationInput): Promise<PublisherApplication> {
  if (!can(actor, 'apply:publisher')) throw forbidden(actor.role === 'member' ? undefined : 'Your account already has what a publisher has.');
  return ctx.db.write(async (transaction) => {
    const open = await PublisherApplication.findOne({ where: { userId: actor.id, status: 'pending' }, transaction });
    if (open) throw conflict('You already have an application waiting for a decision.');
    return PublisherApplication.create({ userId: actor.id, ...input, status: 'pending', decidedById: null, decisionNote: null, decidedAt: null }, { transaction });
  });
}
