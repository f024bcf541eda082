import { Router } from 'express';
import { can } from '@shared/permissions';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { forbidden, notFound } from '../../../errors';
import type { MailCatcher } from '../../../mail/mail-catcher';
import { emptyQuerySchema } from '@shared/schemas/common';
import { route } from '../../../middleware/validate';
import { caughtMailSchema, type Presented } from '@shared/schemas/responses';

/** Development aids (never in production): the local mail catcher's messages, for admins. */
export function devRouter(ctx: AppContext, mailCatcher?: MailCatcher): Router {
  const router = Router();
  router.get('/dev/mail', requireUser, route({ query: emptyQuerySchema }, (req, res) => {
    if (ctx.env.isProduction || !mailCatcher) throw notFound('The mail catcher');
    if (!can(actorOf(req), 'read:dev-mail')) throw forbidden('The mail catcher is for admins.');
    res.set('Cache-Control', 'no-store').json(mailCatcher.messages() satisfies Presented<typeof caughtMailSchema>);
  }));
  return router;
}
