import type { Actor } from '@shared/permissions';
import type { AppContext } from '../context';
import { notFound } from '../errors';
import { ApiToken } from '../models';

/** Revokes one of the actor's own tokens; the row stays (with its revocation time). Idempotent. */
export async function revokeToken(ctx: AppContext, actor: Actor, id: number): Promise<ApiToken> {
  return ctx.db.write(async (transaction) => {
    const token = await ApiToken.findOne({ where: { id, userId: actor.id }, transaction });
    if (!token) throw notFound('Token');
    if (!token.revokedAt) await token.update({ revokedAt: new Date() }, { transaction });
    return token;
  });
}
