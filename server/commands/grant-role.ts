import os from 'node:os';
import { ROLES, type Role } from '@shared/permissions';
import type { AppContext } from '../context';
import { badRequest, conflict, notFound } from '../errors';
import { User } from '../models';
import { recordAudit } from './record-audit';

/** What a role change from the command line came to. */
export interface RoleGranted {
  handle: string;
  from: Role;
  to: Role;
}

/**
 * The operator gives an account a role from the machine the server runs on (`npm run admin --
 * grant <handle> <role>`): how a production site gets its first administrator, since no account
 * has a role above member until someone grants one. There is no signed-in actor, so the audit
 * entry names the account itself as its actor, with `via: 'command line'` and the operating-system
 * user who ran it; its shape is otherwise an admin's role change (`user.role`, from → to). The
 * account cache of every process follows the change feed, so the new role counts from the
 * member's next request, without a restart. An unknown role or handle, or the role the account
 * already has, is refused and nothing is written.
 */
export async function grantRoleFromCommandLine(ctx: Pick<AppContext, 'db'>, handle: string, role: string): Promise<RoleGranted> {
  if (!(ROLES as readonly string[]).includes(role)) {
    throw badRequest('Invalid input.', [{ path: 'role', message: `"${role}" is not a role; one of ${ROLES.join(', ')}` }]);
  }
  const to = role as Role;
  return ctx.db.write(async (transaction) => {
    const user = await User.findOne({ where: { handle }, transaction });
    if (!user) throw notFound(`Member "${handle}"`);
    const from = user.role;
    if (from === to) throw conflict(`@${handle} is already ${to}; nothing changed.`);
    await user.update({ role: to }, { transaction });
    await recordAudit(
      { id: user.id, role: from },
      {
        action: 'user.role', subjectType: 'user', subjectId: user.id, reason: 'Granted on the command line by the operator.',
        details: { handle, from: { role: from, banned: user.banned }, to: { role: to, banned: user.banned }, via: 'command line', operator: os.userInfo().username },
      },
      transaction,
    );
    return { handle, from, to };
  });
}
