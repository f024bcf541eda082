import crypto from 'node:crypto';
import { can, type Actor } from '@shared/permissions';
import type { AppContext } from '../context';
import { conflict, forbidden } from '../errors';
import { ApiToken } from '../models';
import { hashToken, TOKEN_PREFIX } from '../auth/api-token';

/** The most active tokens one publisher may hold. */
export const TOKENS_PER_PUBLISHER = 20;


/**
 * Creates a named API token for a publisher: 32 random bytes, returned once; only its hash and
 * a short prefix are stored.
 */
export async function createToken(ctx: AppContext, actor: Actor, name: string): Promise<{ record: ApiToken; token: string }> {
  if (!can(actor, 'manage:tokens')) throw forbidden('API tokens are for publishers.');
  const token = `${TOKEN_PREFIX}${crypto.randomBytes(32).toString('base64url')}`;
  const record = await ctx.db.write(async (transaction) => {
    const active = await ApiToken.count({ where: { userId: actor.id, revokedAt: null }, transaction });
    if (active >= TOKENS_PER_PUBLISHER) throw conflict(`You have ${active} active tokens; revoke one first.`);
    return ApiToken.create({ userId: actor.id, name, tokenHash: hashToken(token), prefix: token.slice(0, TOKEN_PREFIX.length + 6), lastUsedAt: null, revokedAt: null }, { transaction });
  });
  return { record, token };
}
