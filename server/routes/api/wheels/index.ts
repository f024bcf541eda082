import { Router } from 'express';
import { z } from 'zod';
import { wheelInputSchema, wheelMeasurementSchema, type WheelInput, type WheelMeasurementInput } from '@shared/schemas/wheels';
import { summarizeWheelLog } from '@shared/wheel-log';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { validate } from '../../../middleware/validate';
import { addWheel, measureWheel } from '../../../commands/log-wheel';
import { notFound } from '../../../errors';
import { wheelsOf as own } from '../../../queries/wheels';
import type { Wheel } from '../../../models';
import { emptyQuerySchema, idParams } from '@shared/schemas/common';


function presentWheel(wheel: Wheel) {
  const measurements = (wheel.measurements ?? []).map((m) => ({ measuredOn: m.measuredOn, diameterMm: m.diameterMm }));
  return {
    id: wheel.id,
    name: wheel.name,
    wears: wheel.wears,
    originalDiameterMm: wheel.originalDiameterMm,
    barDiameterMm: wheel.barDiameterMm,
    projectionMm: wheel.projectionMm,
    usualAnglesDeg: wheel.usualAnglesDeg,
    ...summarizeWheelLog({ ...wheel.get({ plain: true }), measurements }),
  };
}

/** A member's wheel log: their wheels, measured diameters over time, and today's gaps. */
export function wheelsRouter(ctx: AppContext): Router {
  const router = Router();

  router.get('/wheels', requireUser, validate({ query: emptyQuerySchema }), async (req, res) => {
    res.json({ items: (await own(actorOf(req)!.id)).map(presentWheel) });
  });

  router.post('/wheels', requireUser, validate({ body: wheelInputSchema }), async (req, res) => {
    const actor = actorOf(req)!;
    const wheel = await addWheel(ctx, actor, req.valid.body as WheelInput);
    const [created] = await own(actor.id, wheel.id);
    res.status(201).json(presentWheel(created));
  });

  router.post('/wheels/:id/measurements', requireUser, validate({ params: idParams, body: wheelMeasurementSchema }), async (req, res) => {
    const actor = actorOf(req)!;
    const { id } = req.valid.params as z.infer<typeof idParams>;
    await measureWheel(ctx, actor, id, req.valid.body as WheelMeasurementInput);
    const [wheel] = await own(actor.id, id);
    if (!wheel) throw notFound('Wheel');
    res.status(201).json(presentWheel(wheel));
  });

  return router;
}
