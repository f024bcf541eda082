import type { Actor } from '@shared/permissions';
import { ratedSpeedCheck } from '@shared/geometry';
import type { GrinderInput, JigInput, PriceReportInput, RetireWheelInput, SetupInput, WorkshopWheelInput } from '@shared/schemas/workshop';
import type { AppContext } from '../context';
import { badRequest, notFound } from '../errors';
import { Abrasive, Grinder, Jig, PriceReport, Setup, Wheel } from '../models';

const invalid = (path: string, message: string) => badRequest('Invalid input.', [{ path, message }]);

async function abrasiveBySlug(slug: string) {
  const abrasive = await Abrasive.findOne({ where: { slug }, attributes: ['id', 'slug', 'wears', 'coolant'] });
  if (!abrasive) throw invalid('abrasive', `no abrasive page "${slug}"`);
  return abrasive;
}

/** Adds a grinder to the member's workshop. */
export async function addGrinder(ctx: AppContext, actor: Actor, input: GrinderInput): Promise<Grinder> {
  return ctx.db.write((transaction) =>
    Grinder.create({ ownerId: actor.id, name: input.name, spindleRpm: input.spindleRpm, barDiameterMm: input.barDiameterMm, barMount: input.barMount, pricePaid: input.pricePaid ?? null, currency: input.currency ?? null }, { transaction }),
  );
}

/** Adds a jig with its blade-plane offset. */
export async function addJig(ctx: AppContext, actor: Actor, input: JigInput): Promise<Jig> {
  return ctx.db.write((transaction) => Jig.create({ ownerId: actor.id, name: input.name, offsetMm: input.offsetMm }, { transaction }));
}

/** Saves a setup ("this knife at 15° per side": jig, projection). The jig must be the member's own. */
export async function saveSetup(ctx: AppContext, actor: Actor, input: SetupInput): Promise<Setup> {
  return ctx.db.write(async (transaction) => {
    if (input.jigId != null && !(await Jig.findOne({ where: { id: input.jigId, ownerId: actor.id }, transaction }))) {
      throw invalid('jigId', 'not one of your jigs');
    }
    return Setup.create({ ownerId: actor.id, name: input.name, jigId: input.jigId ?? null, projectionMm: input.projectionMm, perSideDeg: input.perSideDeg }, { transaction });
  });
}

/**
 * Adds a wheel from an abrasive page to one of the member's grinders. Refused (field
 * 'ratedSpeedMps') when the wheel's rim, at its diameter when new and the grinder's spindle speed,
 * would run faster than its rating: a wheel must never run above its rated speed.
 */
export async function addWorkshopWheel(ctx: AppContext, actor: Actor, input: WorkshopWheelInput): Promise<Wheel> {
  const abrasive = await abrasiveBySlug(input.abrasive);
  return ctx.db.write(async (transaction) => {
    const grinder = await Grinder.findOne({ where: { id: input.grinderId, ownerId: actor.id }, transaction });
    if (!grinder) throw invalid('grinderId', 'not one of your grinders');
    const speed = ratedSpeedCheck({ diameterMm: input.originalDiameterMm, spindleRpm: grinder.spindleRpm, ratedSpeedMps: input.ratedSpeedMps });
    if (speed.overspeed) {
      throw invalid(
        'ratedSpeedMps',
        `on ${grinder.name} at ${grinder.spindleRpm} rpm this wheel's rim would run at ${speed.speedMps.toFixed(1)} m/s, above its rating of ` +
          `${input.ratedSpeedMps} m/s: never run a wheel above its rated speed; follow the machine's and the wheel's instructions and local regulations`,
      );
    }
    return Wheel.create(
      {
        ownerId: actor.id,
        name: input.name,
        abrasiveId: abrasive.id,
        wears: abrasive.wears,
        originalDiameterMm: input.originalDiameterMm,
        // The wheel log's own setup columns: a workshop wheel takes its bar from its grinder and its
        // projections from the member's saved setups, so it keeps no usual angles of its own.
        barDiameterMm: grinder.barDiameterMm,
        projectionMm: 0,
        usualAnglesDeg: [],
        grinderId: grinder.id,
        minDiameterMm: input.minDiameterMm ?? null,
        ratedSpeedMps: input.ratedSpeedMps,
        coolant: input.coolant ?? abrasive.coolant,
        acquiredOn: input.acquiredOn ?? null,
        pricePaid: input.pricePaid ?? null,
        currency: input.currency ?? null,
      },
      { transaction },
    );
  });
}

/** Retires one of the member's wheels, with the sharpenings it gave (its reported life). */
export async function retireWheel(ctx: AppContext, actor: Actor, wheelId: number, input: RetireWheelInput): Promise<void> {
  await ctx.db.write(async (transaction) => {
    const wheel = await Wheel.findOne({ where: { id: wheelId, ownerId: actor.id }, transaction });
    if (!wheel) throw notFound('Wheel');
    await wheel.update({ retiredOn: input.retiredOn, retiredAfterSharpenings: input.retiredAfterSharpenings }, { transaction });
  });
}

/** Records a price a member paid for an abrasive (no shop named). */
export async function reportPrice(ctx: AppContext, actor: Actor, input: PriceReportInput): Promise<void> {
  const abrasive = await abrasiveBySlug(input.abrasive);
  await ctx.db.write((transaction) =>
    PriceReport.create({ abrasiveId: abrasive.id, reporterId: actor.id, price: input.price, currency: input.currency, paidOn: input.paidOn, condition: input.condition }, { transaction }),
  );
}
