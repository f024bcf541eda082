import { Router } from 'express';
import { can } from '@shared/permissions';
import { flagInputSchema, flagResolutionSchema } from '@shared/schemas/publishing';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { forbidden } from '../../../errors';
import { flagItem, resolveFlag } from '../../../commands/flag-item';
import { openFlags } from '../../../queries/review-desk';
import { presentOpenFlags } from '../../../presenters/review-desk';
import { presentFlag } from '../../../presenters/publishing';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';


/** Flags: any member flags an approved result or a page; moderators list and close them. */
export function flagsRouter(ctx: AppContext): Router {
  const router = Router();

  router.post('/flags', requireUser, route({ body: flagInputSchema }, async (req, res) => {
    const flag = await flagItem(ctx, actorOf(req)!, req.valid.body);
    res.status(201).json(presentFlag(flag, null));
  }));

  router.get('/flags', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    if (!can(actorOf(req), 'resolve:flag')) throw forbidden('Flags are read by moderators.');
    res.json({ items: presentOpenFlags(await openFlags()) });
  }));

  router.post('/flags/:id/resolve', requireUser, route({ params: idParams, body: flagResolutionSchema }, async (req, res) => {
    const { id } = req.valid.params;
    res.json(presentFlag(await resolveFlag(ctx, actorOf(req)!, id, req.valid.body), null));
  }));

  return router;
}
