import type { Actor } from '@shared/permissions';
import type { WheelInput, WheelMeasurementInput } from '@shared/schemas/wheels';
import type { Transaction } from 'sequelize';
import type { AppContext } from '../context';
import { badRequest, notFound } from '../errors';
import { Abrasive, Wheel, WheelMeasurement } from '../models';

/** Adds a wheel to the member's log. */
export async function addWheel(ctx: AppContext, actor: Actor, input: WheelInput): Promise<Wheel> {
  const abrasive = input.abrasive ? await Abrasive.findOne({ where: { slug: input.abrasive } }) : null;
  if (input.abrasive && !abrasive) throw badRequest('Invalid input.', [{ path: 'abrasive', message: `no abrasive page "${input.abrasive}"` }]);
  return ctx.db.write((transaction) =>
    Wheel.create(
      {
        ownerId: actor.id,
        name: input.name,
        abrasiveId: abrasive?.id ?? null,
        wears: input.wears,
        originalDiameterMm: input.originalDiameterMm,
        barDiameterMm: input.barDiameterMm,
        projectionMm: input.projectionMm,
        usualAnglesDeg: input.usualAnglesDeg,
      },
      { transaction },
    ),
  );
}

/** Records a measured diameter of one of the member's own wheels. */
export async function measureWheel(ctx: AppContext, actor: Actor, wheelId: number, input: WheelMeasurementInput): Promise<void> {
  await ctx.db.write(async (transaction) => {
    const wheel = await Wheel.findOne({ where: { id: wheelId, ownerId: actor.id }, transaction });
    if (!wheel) throw notFound('Wheel');
    if (input.diameterMm > wheel.originalDiameterMm) {
      throw badRequest('Invalid input.', [{ path: 'diameterMm', message: `larger than the wheel's original ${wheel.originalDiameterMm} mm` }]);
    }
    await WheelMeasurement.create(
      { wheelId, measuredOn: input.measuredOn, diameterMm: input.diameterMm, dressed: input.dressed ?? false, sharpenings: input.sharpenings ?? 0 },
      { transaction },
    );
  });
}

/** The member's own measurement of their own wheel, or 404. */
async function ownMeasurement(actor: Actor, wheelId: number, measurementId: number, transaction: Transaction) {
  const wheel = await Wheel.findOne({ where: { id: wheelId, ownerId: actor.id }, transaction });
  const measurement = wheel ? await WheelMeasurement.findOne({ where: { id: measurementId, wheelId }, transaction }) : null;
  if (!wheel || !measurement) throw notFound('Measurement');
  return { wheel, measurement };
}

/** Corrects one of the member's measurements (date, diameter, dressing, sharpenings counted). */
export async function editMeasurement(ctx: AppContext, actor: Actor, wheelId: number, measurementId: number, input: WheelMeasurementInput): Promise<void> {
  await ctx.db.write(async (transaction) => {
    const { wheel, measurement } = await ownMeasurement(actor, wheelId, measurementId, transaction);
    if (input.diameterMm > wheel.originalDiameterMm) {
      throw badRequest('Invalid input.', [{ path: 'diameterMm', message: `larger than the wheel's original ${wheel.originalDiameterMm} mm` }]);
    }
    await measurement.update(
      { measuredOn: input.measuredOn, diameterMm: input.diameterMm, dressed: input.dressed ?? measurement.dressed, sharpenings: input.sharpenings ?? measurement.sharpenings },
      { transaction },
    );
  });
}

/** Removes one of the member's measurements (a wrong entry). */
export async function deleteMeasurement(ctx: AppContext, actor: Actor, wheelId: number, measurementId: number): Promise<void> {
  await ctx.db.write(async (transaction) => {
    const { measurement } = await ownMeasurement(actor, wheelId, measurementId, transaction);
    await measurement.destroy({ transaction });
  });
}
