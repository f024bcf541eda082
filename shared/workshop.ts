/**
 * The workshop's computations: the gap to set today for each saved setup on each wheel, wheels that
 * share one setting, a wheel's replacement forecast, what a sharpening costs, and where the coolant
 * in the trough must change along a progression.
 *
 * Pure arithmetic: no I/O, no clock (today's date is an argument), no framework imports.
 */
import { gapForAngle, ratedSpeedCheck } from './geometry';
import { gritBand } from './grit';
import { median } from './stats';
import type { Coolant } from './vocabulary';

export interface WorkshopGrinder {
  id: number;
  name: string;
  spindleRpm: number;
  barDiameterMm: number;
}

export interface WorkshopWheel {
  id: number;
  name: string;
  grinderId: number | null;
  /** Whether the wheel wears and is dressed (vitrified) or keeps its diameter (plated CBN, diamond). */
  wears: boolean;
  originalDiameterMm: number;
  minDiameterMm: number | null;
  /** Measured diameters, any order (ISO dates), with the sharpenings done since the entry before. */
  measurements: { measuredOn: string; diameterMm: number; sharpenings: number; dressed: boolean }[];
}

export interface WorkshopSetup {
  id: number;
  name: string;
  projectionMm: number;
  perSideDeg: number;
  /** The jig's blade-plane offset, mm (0 without a jig or an offset). */
  offsetMm: number;
}

/** The latest measured diameter of a wheel, or its diameter when new. */
export function currentDiameterMm(wheel: Pick<WorkshopWheel, 'originalDiameterMm' | 'measurements'>): number {
  const latest = [...wheel.measurements].sort((a, b) => a.measuredOn.localeCompare(b.measuredOn)).pop();
  return latest ? latest.diameterMm : wheel.originalDiameterMm;
}

/** One setting of a setup, shared by the wheels of one diameter on one bar. */
export interface SetupSetting {
  setupId: number;
  diameterMm: number;
  barDiameterMm: number;
  wheelIds: number[];
  /** The gap from bar to rim to set today, mm; null with the reason where the setup cannot reach. */
  gapMm: number | null;
  reason?: string;
  /** For worn wheels: the gap this setup needed on each wheel when new, and how far the setting moved since (mm). */
  movedFromNew: { wheelId: number; gapWhenNewMm: number; movedMm: number }[];
}

// Diameters that differ by less than this share a setting: below what a person measures (mm).
const SAME_DIAMETER_MM = 0.05;

/**
 * For each setup, the settings to use today: wheels on the same bar whose latest diameters agree
 * (within 0.05 mm) share one gap, and the list says which wheels those are. Wheels without a
 * grinder have no bar and are left out.
 */
export function settingsToday(setups: WorkshopSetup[], wheels: WorkshopWheel[], grinders: WorkshopGrinder[]): SetupSetting[] {
  const grinderById = new Map(grinders.map((g) => [g.id, g]));
  const out: SetupSetting[] = [];
  for (const setup of setups) {
    const groups: { diameterMm: number; barDiameterMm: number; wheels: WorkshopWheel[] }[] = [];
    for (const wheel of wheels) {
      const grinder = wheel.grinderId === null ? undefined : grinderById.get(wheel.grinderId);
      if (!grinder) continue;
      const diameterMm = currentDiameterMm(wheel);
      const group = groups.find((g) => g.barDiameterMm === grinder.barDiameterMm && Math.abs(g.diameterMm - diameterMm) < SAME_DIAMETER_MM);
      if (group) group.wheels.push(wheel);
      else groups.push({ diameterMm, barDiameterMm: grinder.barDiameterMm, wheels: [wheel] });
    }
    for (const group of groups) {
      const gap = (diameterMm: number) =>
        gapForAngle({ wheelDiameterMm: diameterMm, barDiameterMm: group.barDiameterMm, projectionMm: setup.projectionMm, perSideDeg: setup.perSideDeg, offsetMm: setup.offsetMm }).gapMm;
      let gapMm: number | null = null;
      let reason: string | undefined;
      try {
        gapMm = gap(group.diameterMm);
      } catch (err) {
        reason = err instanceof Error ? err.message : String(err);
      }
      const movedFromNew: SetupSetting['movedFromNew'] = [];
      if (gapMm !== null) {
        for (const wheel of group.wheels) {
          if (wheel.originalDiameterMm - group.diameterMm < SAME_DIAMETER_MM) continue;
          try {
            const gapWhenNewMm = gap(wheel.originalDiameterMm);
            movedFromNew.push({ wheelId: wheel.id, gapWhenNewMm, movedMm: gapMm - gapWhenNewMm });
          } catch {
            // the setup never reached this wheel when new: nothing moved from
          }
        }
      }
      out.push({
        setupId: setup.id,
        diameterMm: group.diameterMm,
        barDiameterMm: group.barDiameterMm,
        wheelIds: group.wheels.map((w) => w.id),
        gapMm,
        ...(reason ? { reason } : {}),
        movedFromNew,
      });
    }
  }
  return out;
}

/** A wheel's peripheral speed on its grinder against its rating (null without a grinder or a rating). */
export function speedCheck(wheel: { originalDiameterMm: number; ratedSpeedMps: number | null }, grinder: { spindleRpm: number } | undefined) {
  if (!grinder || wheel.ratedSpeedMps === null) return null;
  return ratedSpeedCheck({ diameterMm: wheel.originalDiameterMm, spindleRpm: grinder.spindleRpm, ratedSpeedMps: wheel.ratedSpeedMps });
}

const DAY_MS = 24 * 3600 * 1000;

/**
 * When a wearing wheel reaches its minimum usable diameter, from the least-squares line of
 * diameter against date through its measurements. Null with fewer than two dates, for a wheel
 * that keeps its diameter or has no minimum, or when the line does not fall.
 */
export function replacementForecast(wheel: WorkshopWheel): { onDate: string; mmPer30Days: number; points: number } | null {
  if (!wheel.wears || wheel.minDiameterMm === null) return null;
  const points = wheel.measurements.map((m) => ({ t: Date.parse(m.measuredOn) / DAY_MS, d: m.diameterMm }));
  if (new Set(points.map((p) => p.t)).size < 2) return null;
  const n = points.length;
  const tMean = points.reduce((s, p) => s + p.t, 0) / n;
  const dMean = points.reduce((s, p) => s + p.d, 0) / n;
  const sxy = points.reduce((s, p) => s + (p.t - tMean) * (p.d - dMean), 0);
  const sxx = points.reduce((s, p) => s + (p.t - tMean) ** 2, 0);
  const slope = sxy / sxx; // mm a day
  if (!(slope < 0)) return null;
  const tMin = tMean + (wheel.minDiameterMm - dMean) / slope;
  return { onDate: new Date(Math.round(tMin) * DAY_MS).toISOString().slice(0, 10), mmPer30Days: -slope * 30, points: n };
}

/** Below this many, an estimate is said plainly to rest on little (as the decision view's "thin evidence"). */
export const FEW = 5;

/** What a wheel's sharpenings cost, and what the figure rests on. */
export interface SharpeningCost {
  costPerSharpening: number;
  expectedSharpenings: number;
  basis: 'measured-wear' | 'reported-life';
  /** Sharpenings counted (measured wear) or retired wheels reported (reported life). */
  restsOn: number;
  /** Measured diameters the wear rests on (measured wear; 0 for reported life). */
  measurements: number;
  /** Fewer than FEW measurements, sharpenings or reported lives: a rough estimate, said plainly. */
  rough: boolean;
}

/**
 * Cost per sharpening. A dressable wheel: its usable range (new less minimum diameter) over the
 * diameter lost per sharpening, measured from its own log (first to latest diameter over the
 * sharpenings counted since the first entry). A wheel that keeps its diameter: the median of the
 * sharpenings after which wheels of the same abrasive were retired, as members reported them.
 * Null where there is nothing to rest the figure on.
 */
export function sharpeningCost(
  wheel: WorkshopWheel & { pricePaid: number | null },
  reportedLives: number[],
): SharpeningCost | null {
  if (wheel.pricePaid === null) return null;
  if (wheel.wears) {
    if (wheel.minDiameterMm === null) return null;
    const series = [...wheel.measurements].sort((a, b) => a.measuredOn.localeCompare(b.measuredOn));
    if (series.length < 2) return null;
    const sharpenings = series.slice(1).reduce((s, m) => s + m.sharpenings, 0);
    const lostMm = series[0].diameterMm - series[series.length - 1].diameterMm;
    if (sharpenings <= 0 || lostMm <= 0) return null;
    const expectedSharpenings = (wheel.originalDiameterMm - wheel.minDiameterMm) / (lostMm / sharpenings);
    const rough = series.length < FEW || sharpenings < FEW;
    return { costPerSharpening: wheel.pricePaid / expectedSharpenings, expectedSharpenings, basis: 'measured-wear', restsOn: sharpenings, measurements: series.length, rough };
  }
  if (reportedLives.length === 0) return null;
  const expectedSharpenings = median(reportedLives);
  if (!(expectedSharpenings > 0)) return null;
  const rough = reportedLives.length < FEW;
  return { costPerSharpening: wheel.pricePaid / expectedSharpenings, expectedSharpenings, basis: 'reported-life', restsOn: reportedLives.length, measurements: 0, rough };
}

/** A wheel of the kit as its cost per sharpening sees it. */
export interface KitWheelCost {
  wheelId: number;
  pricePaid: number | null;
  currency: string | null;
  cost: SharpeningCost | null;
}

/** The kit's cost per sharpening in one currency: the sum over the wheels that have a figure in it. */
export interface KitSharpeningCost {
  currency: string;
  costPerSharpening: number;
  /** The wheels summed, each with its own figure. */
  wheelIds: number[];
  /** One or more of those figures is a rough estimate (the per-wheel rule). */
  rough: boolean;
}

/**
 * What one sharpening costs on the whole kit. The rule: a sharpening takes the blade across every
 * active wheel once, coarse to fine (the same kit the trough's plan orders), so its cost is the sum
 * of each wheel's cost per sharpening. Sums are per currency, never converted. A wheel without a
 * price, or whose figure has nothing to rest on yet, is not summed and is named in `missing`: the
 * sum is then a lower bound. Rough when any summed figure is.
 */
export function kitSharpeningCost(wheels: KitWheelCost[]): { byCurrency: KitSharpeningCost[]; missing: { wheelId: number; why: 'no-price' | 'no-estimate' }[] } {
  const byCurrency = new Map<string, KitSharpeningCost>();
  const missing: { wheelId: number; why: 'no-price' | 'no-estimate' }[] = [];
  for (const w of wheels) {
    if (w.pricePaid === null || !w.currency) missing.push({ wheelId: w.wheelId, why: 'no-price' });
    else if (!w.cost) missing.push({ wheelId: w.wheelId, why: 'no-estimate' });
    else {
      const sum = byCurrency.get(w.currency) ?? { currency: w.currency, costPerSharpening: 0, wheelIds: [], rough: false };
      sum.costPerSharpening += w.cost.costPerSharpening;
      sum.wheelIds.push(w.wheelId);
      sum.rough ||= w.cost.rough;
      byCurrency.set(w.currency, sum);
    }
  }
  return { byCurrency: [...byCurrency.values()], missing };
}

/** One step of a progression with the coolant its abrasive runs on. */
export interface CoolantStep {
  label: string;
  coolant: Coolant;
  /** Representative particle size, µm; steps of the same whole-φ band may swap places. */
  micrometres: number | null;
}

/** Where the trough must change: after which step, from what to what. */
export interface CoolantChange {
  afterStep: number;
  from: Coolant;
  to: Coolant;
}

function changesOf(steps: CoolantStep[]): CoolantChange[] {
  const out: CoolantChange[] = [];
  for (let i = 1; i < steps.length; i++) {
    if (steps[i].coolant !== steps[i - 1].coolant) out.push({ afterStep: i - 1, from: steps[i - 1].coolant, to: steps[i].coolant });
  }
  return out;
}

/**
 * The coolant changes along a progression as given, and an order with the fewest changes that
 * still goes from coarse to fine: steps whose sizes fall in the same whole-φ grit band
 * (⌊−log2(d / 1 mm)⌋) may swap places, bands keep their order. Found by dynamic programming over
 * the bands: within a band, the steps are grouped by coolant, and the first and last group are
 * chosen to meet the neighbouring bands.
 */
export function coolantPlan<T extends CoolantStep>(steps: T[]): { changes: CoolantChange[]; suggested: T[]; suggestedChanges: CoolantChange[] } {
  const bandOf = (s: CoolantStep) => (s.micrometres === null ? null : Math.floor(-Math.log2(s.micrometres / 1000)));
  // Runs of consecutive steps in one band (a step without a size is a band of its own).
  const bands: T[][] = [];
  for (const step of steps) {
    const last = bands[bands.length - 1];
    const b = bandOf(step);
    if (last && b !== null && bandOf(last[0]) === b) last.push(step);
    else bands.push([step]);
  }
  // For each band, each way to order it is: groups by coolant, with a chosen first and last coolant.
  type State = { cost: number; order: T[] };
  let best = new Map<Coolant | null, State>([[null, { cost: 0, order: [] }]]);
  for (const band of bands) {
    const kinds = [...new Set(band.map((s) => s.coolant))];
    const next = new Map<Coolant | null, State>();
    for (const [prev, state] of best) {
      for (const first of kinds) {
        for (const last of kinds) {
          if (first === last && kinds.length > 1) continue;
          const middle = kinds.filter((k) => k !== first && k !== last);
          const seq = [first, ...middle, ...(last !== first ? [last] : [])];
          const order = seq.flatMap((k) => band.filter((s) => s.coolant === k));
          const cost = state.cost + (prev !== null && prev !== first ? 1 : 0) + (seq.length - 1);
          const known = next.get(last);
          if (!known || cost < known.cost) next.set(last, { cost, order: [...state.order, ...order] });
        }
      }
    }
    best = next;
  }
  const changes = changesOf(steps);
  const fewest = [...best.values()].sort((a, b) => a.cost - b.cost)[0];
  // Keep the order as given unless another changes the trough fewer times.
  const suggested = fewest && fewest.cost < changes.length ? fewest.order : steps;
  return { changes, suggested, suggestedChanges: changesOf(suggested) };
}

/** Where a per-side angle taken from a saved setup on one wheel came from. */
export interface AngleSource {
  perSideDeg: number;
  gapMm: number;
  diameterMm: number;
  barDiameterMm: number;
  projectionMm: number;
}

/**
 * The per-side angle a saved setup grinds on one wheel today, with the setting it rests on (the
 * gap for the wheel's latest diameter on its grinder's bar); the reason instead where the setup
 * cannot reach that wheel or the wheel is on no grinder.
 */
export function angleFromSavedSetup(
  setup: { perSideDeg: number; projectionMm: number; settings: Omit<SetupSetting, 'setupId'>[] },
  wheelId: number,
): AngleSource | { reason: string } {
  const setting = setup.settings.find((s) => s.wheelIds.includes(wheelId));
  if (!setting) return { reason: 'this wheel is on no grinder, so it has no setting for this setup' };
  if (setting.gapMm === null) return { reason: setting.reason ?? 'this setup cannot reach this wheel' };
  return { perSideDeg: setup.perSideDeg, gapMm: setting.gapMm, diameterMm: setting.diameterMm, barDiameterMm: setting.barDiameterMm, projectionMm: setup.projectionMm };
}

/**
 * The trough along a result's progression and its final abrasive: where the coolant must change,
 * and an order of the progression's steps with the fewest changes that still goes coarse to fine
 * (same-band steps may swap) and ends on the final abrasive. `order` holds the steps' indices.
 */
export function progressionCoolant(steps: CoolantStep[], final: CoolantStep) {
  // The final abrasive is a band of its own (no size), so it stays last whatever its grit.
  const indexed = [...steps, { ...final, micrometres: null }].map((step, index) => ({ ...step, index }));
  const plan = coolantPlan(indexed);
  return { changes: plan.changes, suggestedOrder: plan.suggested.slice(0, -1).map((s) => s.index), suggestedChanges: plan.suggestedChanges };
}

/** The coolants one option of the decision view (an abrasive material at a grit band) runs on. */
export interface OptionCoolants {
  /** 'band': from the abrasive pages of that material in that band; 'material': none is in the band, so from every page of the material. */
  basis: 'band' | 'material' | 'none';
  coolants: { coolant: Coolant; pages: string[] }[];
}

/**
 * Which coolants an option of the decision view needs, as its abrasive pages say: the pages of
 * the option's material whose own size falls in the option's band (bands are (loUm, hiUm], as
 * `gritBand`), or, when none does, every page of the material. Grouped by coolant, in the order
 * first met.
 */
export function optionCoolants(
  pages: readonly { name: string; material: string; gritUm: number | null; coolant: Coolant }[],
  option: { material: string; band: { hiUm: number; step: 1 | 0.5 } },
): OptionCoolants {
  const ofMaterial = pages.filter((p) => p.material === option.material);
  const inBand = ofMaterial.filter((p) => p.gritUm !== null && Math.abs(gritBand(p.gritUm, option.band.step).hiUm - option.band.hiUm) < 1e-9 * option.band.hiUm);
  const chosen = inBand.length ? inBand : ofMaterial;
  const coolants: OptionCoolants['coolants'] = [];
  for (const page of chosen) {
    const group = coolants.find((c) => c.coolant === page.coolant);
    if (group) group.pages.push(page.name);
    else coolants.push({ coolant: page.coolant, pages: [page.name] });
  }
  return { basis: inBand.length ? 'band' : ofMaterial.length ? 'material' : 'none', coolants };
}
