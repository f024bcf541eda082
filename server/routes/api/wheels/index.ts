import { Router } from 'express';
import { measurementParams, wheelInputSchema, wheelMeasurementSchema } from '@shared/schemas/wheels';
import { summarizeWheelLog } from '@shared/wheel-log';
import type { AppContext } from '../../../context';
import { actorOf, requireUser } from '../../../middleware/auth';
import { route } from '../../../middleware/validate';
import { addWheel, deleteMeasurement, editMeasurement, measureWheel } from '../../../commands/log-wheel';
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

  router.get('/wheels', requireUser, route({ query: emptyQuerySchema }, async (req, res) => {
    res.json({ items: (await own(actorOf(req)!.id)).map(presentWheel) });
  }));

  router.post('/wheels', requireUser, route({ body: wheelInputSchema }, async (req, res) => {
    const actor = actorOf(req)!;
    const wheel = await addWheel(ctx, actor, req.valid.body);
    const [created] = await own(actor.id, wheel.id);
    res.status(201).json(presentWheel(created));
  }));

  router.post('/wheels/:id/measurements', requireUser, route({ params: idParams, body: wheelMeasurementSchema }, async (req, res) => {
    const actor = actorOf(req)!;
    const { id } = req.valid.params;
    await measureWheel(ctx, actor, id, req.valid.body);
    const [wheel] = await own(actor.id, id);
    if (!wheel) throw notFound('Wheel');
    res.status(201).json(presentWheel(wheel));
  }));

  router.patch('/wheels/:id/measurements/:measurementId', requireUser, route({ params: measurementParams, body: wheelMeasurementSchema }, async (req, res) => {
    const { id, measurementId } = req.valid.params;
    await editMeasurement(ctx, actorOf(req)!, id, measurementId, req.valid.body);
    res.status(204).end();
  }));

  router.delete('/wheels/:id/measurements/:measurementId', requireUser, route({ params: measurementParams }, async (req, res) => {
    const { id, measurementId } = req.valid.params;
    await deleteMeasurement(ctx, actorOf(req)!, id, measurementId);
    res.status(204).end();
  }));

  return router;
}
