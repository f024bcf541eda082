import { Router } from 'express';
import { z } from 'zod';
import { can } from '@shared/permissions';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import {
  applicationDecisionSchema,
  applicationListQuerySchema,
  publisherApplicationSchema,
  siteSettingsChangeSchema,
  type ApplicationDecisionInput,
  type PublisherApplicationInput,
} from '@shared/schemas/publishing';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { validate } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { applicationById, applications, publishers } from '../../../queries/accounts';
import { applyForPublisher } from '../../../commands/apply-for-publisher';
import { decidePublisherApplication } from '../../../commands/decide-publisher-application';
import { updateSiteSettings } from '../../../commands/update-site-settings';
import { siteSettings } from '../../../queries/site-settings';
import { badgeOf } from '../../../queries/profiles';
import { presentApplication } from '../../../presenters/publishing';
import { presentAccount } from '../../../presenters/user';


/** Publishers: the public list, applications and their decisions, and the publishing settings (admin). */
export function publishersRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/publishers', validate({ query: emptyQuerySchema }), async (_req, res) => {
    const users = await publishers();
    res.json({ items: await Promise.all(users.map(async (u) => ({ ...presentAccount(u), badge: await badgeOf(u) }))) });
  });

  router.post('/publishers/applications', requireUser, validate({ body: publisherApplicationSchema }), async (req, res) => {
    const application = await applyForPublisher(ctx, actorOf(req)!, req.valid.body as PublisherApplicationInput);
    const full = await applicationById(application.id);
    res.status(201).json(presentApplication(full!));
  });

  router.get('/publishers/applications', requireUser, validate({ query: applicationListQuerySchema }), async (req, res) => {
    if (!can(actorOf(req), 'decide:publisher-application')) throw forbidden('Publisher applications are decided by admins.');
    const { status } = req.valid.query as z.infer<typeof applicationListQuerySchema>;
    const rows = await applications(status);
    res.json({ items: rows.map(presentApplication) });
  });

  router.post('/publishers/applications/:id/decision', requireUser, validate({ params: idParams, body: applicationDecisionSchema }), async (req, res) => {
    const { id } = req.valid.params as z.infer<typeof idParams>;
    res.json(presentApplication(await decidePublisherApplication(ctx, actorOf(req)!, id, req.valid.body as ApplicationDecisionInput)));
  });

  router.get('/publishers/settings', requireUser, validate({ query: emptyQuerySchema }), async (req, res) => {
    if (!can(actorOf(req), 'manage:site-settings')) throw forbidden('Site settings are for admins.');
    res.json(await siteSettings());
  });

  router.put('/publishers/settings', requireUser, validate({ body: siteSettingsChangeSchema }), async (req, res) => {
    res.json(await updateSiteSettings(ctx, actorOf(req)!, req.valid.body as z.infer<typeof siteSettingsChangeSchema>));
  });

  return router;
}
