import { Router } from 'express';
import type { z } from 'zod';
import { can } from '@shared/permissions';
import { adminUserChangeSchema, adminUsersQuerySchema, handleParamsSchema, type AdminUserChange } from '@shared/schemas/admin';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { validate } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { listUsers } from '../../../queries/users';
import { manageUser } from '../../../commands/manage-user';
import { presentAccount, presentManagedAccount } from '../../../presenters/user';
import { setPageLinks } from '../../../presenters/page-links';

/** Admins manage accounts: find them, change a role, ban or lift a ban (audited). */
export function adminRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/admin/users', requireUser, validate({ query: adminUsersQuerySchema }), async (req, res) => {
    if (!can(actorOf(req), 'manage:users')) throw forbidden('Managing members is for admins.');
    const page = await listUsers(req.valid.query as z.infer<typeof adminUsersQuerySchema>);
    setPageLinks(req, res, page).set('Cache-Control', 'no-store').json({ ...page, items: page.items.map(({ user, ...counts }) => presentManagedAccount(user, counts)) });
  });

  router.patch('/admin/users/:handle', requireUser, validate({ params: handleParamsSchema, body: adminUserChangeSchema }), async (req, res) => {
    const { handle } = req.valid.params as z.infer<typeof handleParamsSchema>;
    const user = await manageUser(ctx, actorOf(req)!, handle, req.valid.body as AdminUserChange);
    res.json({ ...presentAccount(user), banned: user.banned });
  });

  return router;
}
