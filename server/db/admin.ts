import { ROLES } from '@shared/permissions';
import type { AppContext } from '../context';
import { HttpError } from '../errors';
import { grantRoleFromCommandLine } from '../commands/grant-role';

const USAGE = `usage: npm run admin -- grant <handle> <role>   (role: ${ROLES.join(', ')})`;

/**
 * `npm run admin -- grant <handle> <role>`, as a function of its arguments: what to print and
 * the exit code (0 done, 1 refused, 2 wrong usage). Refusals are the command's messages, with
 * the field named; nothing is written then.
 */
export async function runAdmin(ctx: Pick<AppContext, 'db'>, args: string[]): Promise<{ code: number; message: string }> {
  const [verb, handle, role, ...extra] = args;
  if (verb !== 'grant' || !handle || !role || extra.length) return { code: 2, message: USAGE };
  try {
    const granted = await grantRoleFromCommandLine(ctx, handle, role);
    return { code: 0, message: `@${granted.handle} is now ${granted.to} (was ${granted.from}); recorded in the audit log.` };
  } catch (err) {
    if (!(err instanceof HttpError)) throw err;
    const issues = (err.issues ?? []).map((i) => `\n  ${i.path}: ${i.message}`).join('');
    const hint = err.status === 404 ? '\n  The account exists once its owner has signed in through the OAuth2 provider.' : '';
    return { code: 1, message: `${err.message}${issues}${hint}` };
  }
}
