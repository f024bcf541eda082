import { Router } from 'express';
import { can } from '@shared/permissions';
import { adminUserChangeSchema, adminUsersQuerySchema, handleParamsSchema } from '@shared/schemas/admin';
import { managedAccountChangeSchema, type Presented } from '@shared/schemas/responses';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { listUsers } from '../../../queries/users';
import { manageUser } from '../../../commands/manage-user';
import { presentAccount, presentManagedAccount } from '../../../presenters/user';
import { setPageLinks } from '../../../presenters/page-links';

/** Admins manage accounts: find them, change a role, ban or lift a ban (audited). */
export function adminRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/admin/users', requireUser, route({ query: adminUsersQuerySchema }, async (req, res) => {
    if (!can(actorOf(req), 'manage:users')) throw forbidden('Managing members is for admins.');
    const page = await listUsers(req.valid.query);
    setPageLinks(req, res, page).set('Cache-Control', 'no-store').json({ ...page, items: page.items.map(({ user, ...counts }) => presentManagedAccount(user, counts)) });
  }));

  router.patch('/admin/users/:handle', requireUser, route({ params: handleParamsSchema, body: adminUserChangeSchema }, async (req, res) => {
    const { handle } = req.valid.params;
    const user = await manageUser(ctx, actorOf(req)!, handle, req.valid.body);
    res.json({ ...presentAccount(user), banned: user.banned } satisfies Presented<typeof managedAccountChangeSchema>);
  }));

  return router;
}
