import { Op, type WhereOptions } from 'sequelize';
import { LIVE_FILTER_KEYS, type CompareFilters } from '@shared/schemas/compare';
import { bandInfo, cellId, FEW_RESULTS, type CompareRow } from '@shared/compare-view';
import { shrunkMedian } from '@shared/compare-shrinkage';
import { ABRASIVE_MATERIALS, BONDS, STEEL_CATEGORIES } from '@shared/vocabulary';
import { badRequest } from '../errors';
import { Result, User } from '../models';
import type { CellRecord } from '../aggregates/comparison-cells';
import { methodCells, resultsPerMethod } from '../aggregates/cell-cache';
import { lookups, type Lookups, type MethodInfo } from './compare-lookups';
import { approvedResults, type ResultFilter } from '../read-models/approved-results';

/**
 * The comparison view: which method, which cells, from where. Filters that the precomputed
 * cells can answer (steels, steel category, abrasive material, grit band range, band step) are
 * applied to the cached cells; the others (bond, hardness, angle, publisher-only, dates) need
 * each result, so those views are aggregated from the matching results held in memory
 * (server/read-models/approved-results.ts), by the same code.
 */

/** A resolved view: the method, the filters as ids, and whether it must be computed from results. */
export interface ResolvedView {
  filters: CompareFilters;
  method: MethodInfo;
  step: 1 | 0.5;
  look: Lookups;
  /** null: every steel. */
  steelIds: Set<number> | null;
  materials: Set<string> | null;
  /** Filters that need the results table, by name. */
  liveKeys: (typeof LIVE_FILTER_KEYS)[number][];
}

/** Finds the method (the one with the most published results when none is named) and the steel ids. */
export async function resolveView(filters: CompareFilters): Promise<ResolvedView> {
  const look = await lookups();
  let method: MethodInfo | undefined;
  if (filters.method) {
    method = look.methodBySlug.get(filters.method);
    if (!method) throw badRequest('Invalid query.', [{ path: 'method', message: `no method page "${filters.method}"` }]);
  } else {
    const totals = await resultsPerMethod();
    const busiest = [...totals.entries()].sort((a, b) => b[1] - a[1] || b[0] - a[0])[0];
    method = busiest ? look.methods.get(busiest[0]) : undefined;
    // No published results at all: the newest method version, so the page still names one.
    method ??= [...look.methods.values()].sort((a, b) => b.version - a.version || b.id - a.id)[0];
    if (!method) throw badRequest('Invalid query.', [{ path: 'method', message: 'there are no method pages yet' }]);
  }
  let steelIds: Set<number> | null = null;
  if (filters.steel) {
    const unknown = filters.steel.filter((s) => !look.steelBySlug.has(s));
    if (unknown.length) throw badRequest('Invalid query.', [{ path: 'steel', message: `no steel page ${unknown.map((s) => `"${s}"`).join(', ')}` }]);
    steelIds = new Set(filters.steel.map((s) => look.steelBySlug.get(s)!.id));
  }
  if (filters.category) {
    const inCategory = new Set([...look.steels.values()].filter((s) => filters.category!.includes(s.category as never)).map((s) => s.id));
    steelIds = steelIds ? new Set([...steelIds].filter((id) => inCategory.has(id))) : inCategory;
  }
  const liveKeys = LIVE_FILTER_KEYS.filter((k) => filters[k] !== undefined);
  return { filters, method, step: filters.step, look, steelIds, materials: filters.material ? new Set(filters.material) : null, liveKeys };
}

/** True when band (lo, hi] overlaps the query's particle-size range. */
function bandInRange(loUm: number, hiUm: number, f: CompareFilters): boolean {
  return (f.umMax === undefined || loUm < f.umMax) && (f.umMin === undefined || hiUm > f.umMin);
}

/** Whether a cell of the resolved view passes its steel, material and band filters. */
export function cellMatches(view: ResolvedView, c: Pick<CellRecord, 'steelId' | 'material' | 'bandStart' | 'bandWidth'>): boolean {
  if (view.steelIds && !view.steelIds.has(c.steelId)) return false;
  if (view.materials && !view.materials.has(c.material)) return false;
  if (view.filters.umMin !== undefined || view.filters.umMax !== undefined) {
    const b = bandInfo(c.bandStart / 2, (c.bandWidth / 2) as 1 | 0.5);
    if (!bandInRange(b.loUm, b.hiUm, view.filters)) return false;
  }
  return true;
}

const DAY_MS = 24 * 3600 * 1000;

/**
 * The `where` of the view's approved results of its method: steels, materials, the whole-φ
 * bands that can overlap the size range, and every filter the cells cannot answer.
 */
export async function resultWhere(view: ResolvedView): Promise<WhereOptions<Result>> {
  const f = view.filters;
  const where: Record<string | symbol, unknown> = { status: 'approved', sharpnessMethodId: view.method.id };
  if (view.steelIds) where.steelId = [...view.steelIds];
  if (view.materials) where.material = [...view.materials];
  if (f.umMin !== undefined || f.umMax !== undefined) {
    // Whole band φ overlaps [umMin, umMax] iff log2(1000 / umMax) − 1 < φ < log2(1000 / umMin); its half bands lie inside it.
    const phi: Record<symbol, number> = {};
    if (f.umMax !== undefined) phi[Op.gt] = Math.log2(1000 / f.umMax) - 1 - 1e-9;
    if (f.umMin !== undefined) phi[Op.lt] = Math.log2(1000 / f.umMin) + 1e-9;
    where.gritPhi = phi;
  }
  const range = (lo?: number, hi?: number) => ({ ...(lo !== undefined ? { [Op.gte]: lo } : {}), ...(hi !== undefined ? { [Op.lte]: hi } : {}) });
  if (f.hrcMin !== undefined || f.hrcMax !== undefined) where.hrc = range(f.hrcMin, f.hrcMax);
  if (f.angleMin !== undefined || f.angleMax !== undefined) where.perSideDeg = range(f.angleMin, f.angleMax);
  if (f.postedFrom || f.postedTo) {
    where.createdAt = {
      ...(f.postedFrom ? { [Op.gte]: new Date(`${f.postedFrom}T00:00:00Z`) } : {}),
      ...(f.postedTo ? { [Op.lt]: new Date(Date.parse(`${f.postedTo}T00:00:00Z`) + DAY_MS) } : {}),
    };
  }
  if (f.bond) {
    const bonds = new Set<string>(f.bond);
    where.abrasiveId = [...view.look.abrasives.values()].filter((a) => bonds.has(a.bond)).map((a) => a.id);
  }
  if (f.via) where[Op.or] = f.via.map((m) => ({ progressionMaterials: { [Op.like]: `%,${m},%` } }));
  if (f.steps) where.progressionSteps = f.steps.map(Number);
  if (f.publisher) {
    const publishers = await User.findAll({ where: { role: 'publisher' }, attributes: ['id'], raw: true });
    where.authorId = publishers.map((u) => u.id);
  }
  return where as WhereOptions<Result>;
}

/** The view as a scan of the approved results held in memory (the same selection as `resultWhere`). */
export async function resultFilter(view: ResolvedView): Promise<ResultFilter> {
  const f = view.filters;
  const bonds = f.bond ? new Set<string>(f.bond) : null;
  return {
    methodId: view.method.id,
    steelIds: view.steelIds,
    materials: view.materials,
    gritPhiAbove: f.umMax !== undefined ? Math.log2(1000 / f.umMax) - 1 - 1e-9 : undefined,
    gritPhiBelow: f.umMin !== undefined ? Math.log2(1000 / f.umMin) + 1e-9 : undefined,
    hrcMin: f.hrcMin,
    hrcMax: f.hrcMax,
    angleMin: f.angleMin,
    angleMax: f.angleMax,
    createdFrom: f.postedFrom ? Date.parse(`${f.postedFrom}T00:00:00Z`) : undefined,
    createdBefore: f.postedTo ? Date.parse(`${f.postedTo}T00:00:00Z`) + DAY_MS : undefined,
    abrasiveIds: bonds ? new Set([...view.look.abrasives.values()].filter((a) => bonds.has(a.bond)).map((a) => a.id)) : null,
    publishers: f.publisher === true,
    via: f.via ? new Set(f.via) : null,
    steps: f.steps ? new Set(f.steps.map(Number)) : null,
  };
}

/** The view's cells, as rows, with where they came from and the method's overall median. */
export async function viewRows(view: ResolvedView): Promise<{ rows: CompareRow[]; source: 'cells' | 'results'; overallMedianG: number | null; methodResults: number }> {
  const cached = await methodCells(view.method.id, view.step);
  // Filters the cells cannot answer: the view's cells from the approved results held in memory.
  const live = view.liveKeys.length > 0;
  const cells = (live ? await approvedResults.cells(await resultFilter(view), view.step) : cached.cells).filter((c) => cellMatches(view, c));
  const overall = cached.overallMedianG;
  return { rows: cells.map((c) => presentCell(view, c, overall)), source: live ? 'results' : 'cells', overallMedianG: overall, methodResults: cached.results };
}

const r2 = (x: number) => Math.round(x * 100) / 100;
const materialLabel = (m: string) => ABRASIVE_MATERIALS[m as keyof typeof ABRASIVE_MATERIALS] ?? m;

/** One cell as the API gives it. */
export function presentCell(view: Pick<ResolvedView, 'method' | 'look'>, c: CellRecord, overallMedianG: number | null): CompareRow {
  const steel = view.look.steels.get(c.steelId);
  const band = bandInfo(c.bandStart / 2, (c.bandWidth / 2) as 1 | 0.5);
  const steelSlug = steel?.slug ?? String(c.steelId);
  return {
    cell: cellId(steelSlug, c.material, band.phi),
    method: view.method.slug,
    methodName: view.method.name,
    methodVersion: view.method.version,
    steel: steelSlug,
    steelName: steel?.name ?? steelSlug,
    steelCategory: steel?.category ?? '',
    material: c.material,
    materialLabel: materialLabel(c.material),
    band,
    gritBand: { loUm: band.loUm, hiUm: band.hiUm },
    n: c.n,
    testers: c.testers,
    fewResults: c.n < FEW_RESULTS,
    singleTester: c.testers === 1,
    // Grams to 0.01 g, degrees to 0.01°, HRC to 0.1, µm to 3 significant figures: finer than
    // any instrument reads, and a fraction of the bytes of full doubles.
    sharpnessG: {
      median: r2(c.medianG),
      q1: r2(c.q1G),
      q3: r2(c.q3G),
      mean: r2(c.meanG),
      sd: c.sdG === null ? null : r2(c.sdG),
      ci95: c.ciLoG !== null && c.ciHiG !== null ? [r2(c.ciLoG), r2(c.ciHiG)] : null,
    },
    rankedMedianG: r2(shrunkMedian(c.n, c.medianG, overallMedianG ?? c.medianG)),
    retentionCuts: c.retentionMedianCuts !== null ? { median: c.retentionMedianCuts, n: c.retentionN } : null,
    hrcRange: [Math.round(c.hrcMin * 10) / 10, Math.round(c.hrcMax * 10) / 10],
    angleRange: [r2(c.angleMinDeg), r2(c.angleMaxDeg)],
    gritUmRange: [Number(c.gritUmMin.toPrecision(3)), Number(c.gritUmMax.toPrecision(3))],
  };
}

/** The view's filters in words, for the export's citation ("steels AISI D2; material CBN; …"). */
export function filtersInWords(view: ResolvedView): string {
  const f = view.filters;
  const parts: string[] = [`method ${view.method.name}`];
  if (f.steel) parts.push(`steel ${f.steel.map((s) => view.look.steelBySlug.get(s)?.name ?? s).join(', ')}`);
  if (f.category) parts.push(`category ${f.category.map((c) => STEEL_CATEGORIES[c]).join(', ')}`);
  if (f.material) parts.push(`abrasive material ${f.material.map(materialLabel).join(', ')}`);
  if (f.bond) parts.push(`bond ${f.bond.map((b) => BONDS[b]).join(', ')}`);
  if (f.umMin !== undefined || f.umMax !== undefined) parts.push(`particle size ${f.umMin ?? 0}–${f.umMax ?? '∞'} µm`);
  if (f.hrcMin !== undefined || f.hrcMax !== undefined) parts.push(`hardness ${f.hrcMin ?? 'any'}–${f.hrcMax ?? 'any'} HRC`);
  if (f.angleMin !== undefined || f.angleMax !== undefined) parts.push(`angle ${f.angleMin ?? 'any'}–${f.angleMax ?? 'any'}° per side`);
  if (f.via) parts.push(`progression through ${f.via.map(materialLabel).join(' or ')}`);
  if (f.steps) parts.push(`${f.steps.join(' or ')} steps before the final abrasive`);
  if (f.publisher) parts.push('publishers only');
  if (f.postedFrom || f.postedTo) parts.push(`posted ${f.postedFrom ?? 'any day'} to ${f.postedTo ?? 'today'}`);
  return parts.join('; ');
}

/** The view's query string as the comparison page's URL carries it (filters only; defaults left out). */
export function filtersQueryString(f: CompareFilters, extra: Record<string, string | undefined> = {}): string {
  const q = new URLSearchParams();
  const set = (k: string, v: unknown) => {
    if (v === undefined || v === null || v === '') return;
    q.set(k, Array.isArray(v) ? v.join(',') : String(v));
  };
  for (const [k, v] of Object.entries(f)) {
    if (k === 'step' && v === 1) continue;
    if (k === 'publisher') set(k, v ? '1' : undefined);
    else set(k, v);
  }
  for (const [k, v] of Object.entries(extra)) set(k, v);
  return q.toString();
}
