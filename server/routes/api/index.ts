import { Router } from 'express';
import { compareQuerySchema, searchQuerySchema } from '@shared/schemas/result';
import type { z } from 'zod';
import type { AppContext } from '../../context';
import { actorOf, csrfProtection, csrfTokenOf, requireUser } from '../../middleware/auth';
import { validate } from '../../middleware/validate';
import { forbidden, notFound } from '../../errors';
import { can } from '@shared/permissions';
import { presentAccount } from '../../presenters/user';
import { compare } from '../../queries/compare';
import type { User } from '../../models';
import { resultsRouter } from './results';
import { pagesRouter } from './pages';
import { toolsRouter } from './tools';
import { wheelsRouter } from './wheels';
import type { MailCatcher } from '../../mail/mail-catcher';

/** The JSON API under /api. Every state-changing request passes the CSRF check first. */
export function apiRouter(ctx: AppContext, mailCatcher?: MailCatcher): Router {
  const router = Router();
  router.use(csrfProtection);

  router.get('/health', (_req, res) => {
    res.json({ ok: true, searchDocuments: ctx.search.size, pendingWrites: ctx.db.queue.size });
  });

  router.get('/session', (req, res) => {
    const user = req.user as User | undefined;
    res.set('Cache-Control', 'no-store').json({ user: user ? presentAccount(user) : null, csrfToken: csrfTokenOf(req) });
  });

  router.use(resultsRouter(ctx));
  router.use(pagesRouter());
  router.use(toolsRouter());
  router.use(wheelsRouter(ctx));

  router.get('/compare', validate({ query: compareQuerySchema }), async (req, res) => {
    res.json(await compare(req.valid.query as z.infer<typeof compareQuerySchema>));
  });

  router.get('/search', validate({ query: searchQuerySchema }), (req, res) => {
    const { q, type } = req.valid.query as z.infer<typeof searchQuerySchema>;
    res.json(ctx.search.search(q, type));
  });

  router.get('/dev/mail', requireUser, (req, res) => {
    if (ctx.env.isProduction || !mailCatcher) throw notFound('The mail catcher');
    if (!can(actorOf(req), 'read:dev-mail')) throw forbidden('The mail catcher is for admins.');
    res.json(mailCatcher.messages());
  });

  router.use(() => {
    throw notFound('That API route');
  });
  return router;
}
