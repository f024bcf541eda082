import { Router } from 'express';
import { can } from '@shared/permissions';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import {
  applicationDecisionSchema,
  applicationListQuerySchema,
  publisherApplicationSchema,
  siteSettingsChangeSchema,
} from '@shared/schemas/publishing';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { applicationById, applications, publishers } from '../../../queries/accounts';
import { applyForPublisher } from '../../../commands/apply-for-publisher';
import { decidePublisherApplication } from '../../../commands/decide-publisher-application';
import { updateSiteSettings } from '../../../commands/update-site-settings';
import { siteSettings } from '../../../queries/site-settings';
import { badgeOf } from '../../../queries/profiles';
import { presentApplication } from '../../../presenters/publishing';
import { presentAccount } from '../../../presenters/user';
import { publisherListSchema, siteSettingsAnswerSchema, type Presented } from '@shared/schemas/responses';


/** Publishers: the public list, applications and their decisions, and the publishing settings (admin). */
export function publishersRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/publishers', route({ query: emptyQuerySchema }, async (_req, res) => {
    const users = await publishers();
    res.json({ items: await Promise.all(users.map(async (u) => ({ ...presentAccount(u), badge: await badgeOf(u) }))) } satisfies Presented<typeof publisherListSchema>);
  }));

  router.post('/publishers/applications', requireUser, route({ body: publisherApplicationSchema }, async (req, res) => {
    const application = await applyForPublisher(ctx, actorOf(req)!, req.valid.body);
    const full = await applicationById(application.id);
    res.status(201).json(presentApplication(full!));
  }));

  router.get('/publishers/applications', requireUser, route({ query: applicationListQuerySchema }, async (req, res) => {
    if (!can(actorOf(req), 'decide:publisher-application')) throw forbidden('Publisher applications are decided by admins.');
    const { status } = req.valid.query;
    const rows = await applications(status);
    res.json({ items: rows.map(presentApplication) });
  }));

  router.post('/publishers/applications/:id/decision', requireUser, route({ params: idParams, body: applicationDecisionSchema }, async (req, res) => {
    const { id } = req.valid.params;
    res.json(presentApplication(await decidePublisherApplication(ctx, actorOf(req)!, id, req.valid.body)));
  }));

  router.get('/publishers/settings', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    if (!can(actorOf(req), 'manage:site-settings')) throw forbidden('Site settings are for admins.');
    res.json((await siteSettings()) satisfies Presented<typeof siteSettingsAnswerSchema>);
  }));

  router.put('/publishers/settings', requireUser, route({ body: siteSettingsChangeSchema }, async (req, res) => {
    res.json((await updateSiteSettings(ctx, actorOf(req)!, req.valid.body)) satisfies Presented<typeof siteSettingsAnswerSchema>);
  }));

  return router;
}
