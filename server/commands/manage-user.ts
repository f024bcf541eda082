import { can, type Actor } from '@shared/permissions';
import type { AdminUserChange } from '@shared/schemas/admin';
import type { AppContext } from '../context';
import { conflict, forbidden, notFound } from '../errors';
import { ApiToken, User } from '../models';
import { recordAudit } from './record-audit';

/**
 * An admin changes a member's role or bans them (or lifts a ban), with the reason, audited in
 * the same transaction. A ban also revokes every API token of the account, so none works again
 * even after the ban is lifted. The account cache, and with it every session of the account,
 * follows the commit (onUsersChanged): the member's very next request, by session or token,
 * finds them signed out (401); a new role counts from their next request likewise.
 */
export async function manageUser(ctx: AppContext, actor: Actor, handle: string, change: AdminUserChange): Promise<User> {
  if (!can(actor, 'manage:users')) throw forbidden('Managing members is for admins.');
  return ctx.db.write(async (transaction) => {
    const user = await User.findOne({ where: { handle }, transaction });
    if (!user) throw notFound('Member');
    if (user.id === actor.id) throw conflict('You cannot change your own role or ban yourself; ask another admin.');
    const before = { role: user.role, banned: user.banned };
    const after = { role: change.role ?? user.role, banned: change.banned ?? user.banned };
    if (before.role === after.role && before.banned === after.banned) throw conflict('Nothing to change: the account already has this role and standing.');
    await user.update(after, { transaction });
    let tokensRevoked = 0;
    if (after.banned && !before.banned) {
      [tokensRevoked] = await ApiToken.update({ revokedAt: new Date() }, { where: { userId: user.id, revokedAt: null }, transaction });
    }
    const action = before.banned !== after.banned ? (after.banned ? 'user.ban' : 'user.unban') : 'user.role';
    await recordAudit(actor, { action, subjectType: 'user', subjectId: user.id, reason: change.reason, details: { handle, from: before, to: after, tokensRevoked } }, transaction);
    return user;
  });
}
