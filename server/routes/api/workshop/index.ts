import { Router } from 'express';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';
import { doneSchema, priceSummarySchema, type Presented } from '@shared/schemas/responses';
import {
  grinderInputSchema,
  jigInputSchema,
  priceReportInputSchema,
  priceReportQuerySchema,
  retireWheelSchema,
  setupInputSchema,
  workshopWheelInputSchema,
} from '@shared/schemas/workshop';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { addGrinder, addJig, addWorkshopWheel, reportPrice, retireWheel, saveSetup } from '../../../commands/equip-workshop';
import { abrasiveBySlug, priceSummary, readWorkshop } from '../../../queries/workshop';
import { notFound } from '../../../errors';

/**
 * A member's workshop: private, read and written only by its owner (every read is by the signed-in
 * member's id). Price reports are the one public part: medians with n, no reporter named.
 */
export function workshopRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/workshop', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    res.json(await readWorkshop(actorOf(req)!.id));
  }));

  router.post('/workshop/grinders', requireUser, route({ body: grinderInputSchema }, async (req, res) => {
    const grinder = await addGrinder(ctx, actorOf(req)!, req.valid.body);
    res.status(201).json({ id: grinder.id });
  }));

  router.post('/workshop/jigs', requireUser, route({ body: jigInputSchema }, async (req, res) => {
    const jig = await addJig(ctx, actorOf(req)!, req.valid.body);
    res.status(201).json({ id: jig.id });
  }));

  router.post('/workshop/setups', requireUser, route({ body: setupInputSchema }, async (req, res) => {
    const setup = await saveSetup(ctx, actorOf(req)!, req.valid.body);
    res.status(201).json({ id: setup.id });
  }));

  router.post('/workshop/wheels', requireUser, route({ body: workshopWheelInputSchema }, async (req, res) => {
    const wheel = await addWorkshopWheel(ctx, actorOf(req)!, req.valid.body);
    res.status(201).json({ id: wheel.id });
  }));

  router.post('/workshop/wheels/:id/retire', requireUser, route({ params: idParams, body: retireWheelSchema }, async (req, res) => {
    await retireWheel(ctx, actorOf(req)!, req.valid.params.id, req.valid.body);
    res.status(204).end();
  }));

  router.get('/price-reports', route({ query: priceReportQuerySchema }, async (req, res) => {
    const { abrasive: slug } = req.valid.query;
    const abrasive = await abrasiveBySlug(slug);
    if (!abrasive) throw notFound('Abrasive');
    res.json({ abrasive: abrasive.slug, groups: await priceSummary(abrasive.id) } satisfies Presented<typeof priceSummarySchema>);
  }));

  router.post('/price-reports', requireUser, route({ body: priceReportInputSchema }, async (req, res) => {
    await reportPrice(ctx, actorOf(req)!, req.valid.body);
    res.status(201).json({ ok: true } satisfies Presented<typeof doneSchema>);
  }));

  return router;
}
