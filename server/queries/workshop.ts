import { Op } from 'sequelize';
import { median } from '@shared/stats';
import { formatGrade, type GritStandard } from '@shared/grit';
import type { Coolant } from '@shared/vocabulary';
import {
  coolantPlan,
  currentDiameterMm,
  kitSharpeningCost,
  replacementForecast,
  settingsToday,
  sharpeningCost,
  speedCheck,
  type WorkshopWheel,
} from '@shared/workshop';
import { Abrasive, Grinder, Jig, PriceReport, Setup, Wheel, WheelMeasurement } from '../models';

/** Prices members reported for one abrasive: median and n per currency and condition, with the dates they span. */
export async function priceSummary(abrasiveId: number) {
  const reports = await PriceReport.findAll({ where: { abrasiveId }, attributes: ['price', 'currency', 'paidOn', 'condition'], order: [['paidOn', 'ASC']] });
  const groups = new Map<string, PriceReport[]>();
  for (const r of reports) {
    const key = `${r.currency} ${r.condition}`;
    groups.set(key, [...(groups.get(key) ?? []), r]);
  }
  return [...groups.values()].map((rs) => ({
    currency: rs[0].currency,
    condition: rs[0].condition,
    medianPrice: median(rs.map((r) => r.price)),
    n: rs.length,
    from: rs[0].paidOn,
    to: rs[rs.length - 1].paidOn,
  }));
}

/**
 * Everything on a member's workshop page, read only for that member: grinders, jigs, setups with
 * today's settings, wheels with their log, speed check, forecast and cost, and the kit's totals and
 * coolant plan.
 */
export async function readWorkshop(ownerId: number) {
  const [grinders, jigs, setups, wheels] = await Promise.all([
    Grinder.findAll({ where: { ownerId }, order: [['id', 'ASC']] }),
    Jig.findAll({ where: { ownerId }, order: [['id', 'ASC']] }),
    Setup.findAll({ where: { ownerId }, order: [['id', 'ASC']] }),
    Wheel.findAll({ where: { ownerId, grinderId: { [Op.ne]: null } }, include: [{ model: WheelMeasurement, as: 'measurements' }], order: [['id', 'ASC']] }),
  ]);
  const abrasiveIds = [...new Set(wheels.map((w) => w.abrasiveId).filter((id): id is number => id !== null))];
  const [abrasives, retired] = await Promise.all([
    Abrasive.findAll({ where: { id: abrasiveIds }, attributes: ['id', 'slug', 'name', 'coolant', 'sideUsable', 'gritStandard', 'gritGrade', 'gritUm'] }),
    // Reported lives: the sharpenings after which members retired wheels of these abrasives (anyone's, counted only).
    Wheel.findAll({ where: { abrasiveId: abrasiveIds, retiredAfterSharpenings: { [Op.ne]: null } }, attributes: ['abrasiveId', 'retiredAfterSharpenings'] }),
  ]);
  const abrasiveById = new Map(abrasives.map((a) => [a.id, a]));
  const grinderById = new Map(grinders.map((g) => [g.id, g]));
  const jigById = new Map(jigs.map((j) => [j.id, j]));
  const lives = (abrasiveId: number | null) => retired.filter((w) => w.abrasiveId === abrasiveId).map((w) => w.retiredAfterSharpenings as number);

  const logged: (WorkshopWheel & { row: Wheel })[] = wheels.map((w) => ({
    row: w,
    id: w.id,
    name: w.name,
    grinderId: w.grinderId ?? null,
    wears: w.wears,
    originalDiameterMm: w.originalDiameterMm,
    minDiameterMm: w.minDiameterMm ?? null,
    measurements: (w.measurements ?? []).map((m) => ({ measuredOn: m.measuredOn, diameterMm: m.diameterMm, sharpenings: m.sharpenings, dressed: m.dressed })),
  }));
  const active = logged.filter((w) => !w.row.retiredOn);
  const settings = settingsToday(
    setups.map((s) => ({ id: s.id, name: s.name, projectionMm: s.projectionMm, perSideDeg: s.perSideDeg, offsetMm: s.jigId ? (jigById.get(s.jigId)?.offsetMm ?? 0) : 0 })),
    active,
    grinders.map((g) => ({ id: g.id, name: g.name, spindleRpm: g.spindleRpm, barDiameterMm: g.barDiameterMm })),
  );

  const presentedWheels = logged.map((w) => {
    const abrasive = w.row.abrasiveId ? abrasiveById.get(w.row.abrasiveId) : undefined;
    return {
      id: w.id,
      name: w.name,
      abrasive: abrasive
        ? { slug: abrasive.slug, name: abrasive.name, sideUsable: abrasive.sideUsable, grit: formatGrade({ standard: abrasive.gritStandard as GritStandard, grade: abrasive.gritGrade }), gritUm: abrasive.gritUm }
        : null,
      grinderId: w.grinderId,
      wears: w.wears,
      originalDiameterMm: w.originalDiameterMm,
      minDiameterMm: w.minDiameterMm,
      currentDiameterMm: currentDiameterMm(w),
      ratedSpeedMps: w.row.ratedSpeedMps ?? null,
      speed: speedCheck({ originalDiameterMm: w.originalDiameterMm, ratedSpeedMps: w.row.ratedSpeedMps ?? null }, grinderById.get(w.grinderId ?? -1)),
      coolant: w.row.coolant,
      acquiredOn: w.row.acquiredOn ?? null,
      pricePaid: w.row.pricePaid ?? null,
      currency: w.row.currency ?? null,
      retiredOn: w.row.retiredOn ?? null,
      retiredAfterSharpenings: w.row.retiredAfterSharpenings ?? null,
      measurements: [...(w.row.measurements ?? [])]
        .sort((a, b) => a.measuredOn.localeCompare(b.measuredOn) || a.id - b.id)
        .map((m) => ({ id: m.id, measuredOn: m.measuredOn, diameterMm: m.diameterMm, dressed: m.dressed, sharpenings: m.sharpenings })),
      forecast: replacementForecast(w),
      cost: sharpeningCost({ ...w, pricePaid: w.row.pricePaid ?? null }, lives(w.row.abrasiveId)),
    };
  });

  // The kit: active wheels, totals per currency, against the machines' prices.
  const totals = new Map<string, { wheels: number; wheelCount: number; machines: number }>();
  for (const w of presentedWheels.filter((x) => !x.retiredOn && x.pricePaid !== null && x.currency)) {
    const t = totals.get(w.currency!) ?? { wheels: 0, wheelCount: 0, machines: 0 };
    t.wheels += w.pricePaid!;
    t.wheelCount += 1;
    totals.set(w.currency!, t);
  }
  for (const g of grinders.filter((x) => x.pricePaid !== null && x.currency)) {
    const t = totals.get(g.currency!) ?? { wheels: 0, wheelCount: 0, machines: 0 };
    t.machines += g.pricePaid!;
    totals.set(g.currency!, t);
  }
  const kitSteps = presentedWheels
    .filter((w) => !w.retiredOn && w.coolant)
    .sort((a, b) => (b.abrasive?.gritUm ?? 0) - (a.abrasive?.gritUm ?? 0))
    .map((w) => ({ label: w.name, coolant: w.coolant as Coolant, micrometres: w.abrasive?.gritUm ?? null, wheelId: w.id }));
  const plan = coolantPlan(kitSteps);
  const perSharpening = kitSharpeningCost(
    presentedWheels.filter((w) => !w.retiredOn).map((w) => ({ wheelId: w.id, pricePaid: w.pricePaid, currency: w.currency, cost: w.cost })),
  );

  return {
    grinders: grinders.map((g) => ({ id: g.id, name: g.name, spindleRpm: g.spindleRpm, barDiameterMm: g.barDiameterMm, barMount: g.barMount, pricePaid: g.pricePaid, currency: g.currency })),
    jigs: jigs.map((j) => ({ id: j.id, name: j.name, offsetMm: j.offsetMm })),
    setups: setups.map((s) => ({
      id: s.id,
      name: s.name,
      jigId: s.jigId,
      projectionMm: s.projectionMm,
      perSideDeg: s.perSideDeg,
      settings: settings.filter((x) => x.setupId === s.id).map(({ setupId: _setupId, ...rest }) => rest),
    })),
    wheels: presentedWheels,
    kit: {
      totals: [...totals.entries()].map(([currency, t]) => ({ currency, wheelsTotal: t.wheels, wheelCount: t.wheelCount, machinesTotal: t.machines })),
      perSharpening,
      coolant: {
        order: kitSteps.map((s) => s.wheelId),
        changes: plan.changes,
        suggestedOrder: plan.suggested.map((s) => s.wheelId),
        suggestedChanges: plan.suggestedChanges,
      },
    },
  };
}

/** An abrasive page's id and slug by its slug, or null. */
export async function abrasiveBySlug(slug: string) {
  return Abrasive.findOne({ where: { slug }, attributes: ['id', 'slug'] });
}
