import { Op, QueryTypes } from 'sequelize';
import { ComparisonCell, Result } from '../models';
import type { CellRecord } from './comparison-cells';
import { follow, type CellKey, type Dispatched } from '../changes';

/**
 * An in-process read cache of the precomputed cells, one entry per method and band step. It
 * follows the change feed's `cells`, so an entry is brought up to date exactly when its
 * method's cells change: the changed cells are read again from the table (every cell after a
 * full rebuild).
 */

/** A method's cells for one band step, with the method's totals. */
export interface MethodCells {
  methodId: number;
  step: 1 | 0.5;
  cells: CellRecord[];
  /** Approved results of the method (Σ n over its cells). */
  results: number;
  /** Median of every approved result's median reading for the method, g; null without results. */
  overallMedianG: number | null;
}

const entries = new Map<string, Promise<MethodCells>>();
let totals: Promise<Map<number, number>> | null = null;

/** The whole-φ cells a dispatched batch changed, or 'all' after a rebuild. */
export function changedCells(batch: Dispatched): CellKey[] | 'all' {
  const keys: CellKey[] = [];
  for (const { change } of batch.changes) {
    if (change.kind === 'cells') return 'all';
    if (change.kind === 'result') keys.push(...change.cells);
  }
  return keys;
}

follow(['cells'], (batch) => {
  totals = null;
  const changed = changedCells(batch);
  if (changed === 'all') {
    entries.clear();
    return;
  }
  // A few cells changed (an approval, a retraction): re-read only those, after whatever read
  // of the entry is under way. Re-reading a method's thousand cells took 35–60 ms here.
  const byMethod = new Map<number, CellKey[]>();
  for (const k of changed) byMethod.set(k.methodId, [...(byMethod.get(k.methodId) ?? []), k]);
  for (const [methodId, keys] of byMethod) {
    // Both band steps hold the same results, so the method's overall median is read once.
    const medians = new Map<number, Promise<number | null>>();
    const medianOf = (n: number) => medians.get(n) ?? medians.set(n, overallMedian(methodId, n)).get(n)!;
    for (const step of [1, 0.5] as const) {
      const id = `${methodId}|${step}`;
      const entry = entries.get(id);
      if (!entry) continue;
      const patched = entry.then((e) => patch(e, keys, medianOf)).catch(() => load(methodId, step));
      entries.set(id, patched);
      patched.catch(() => {
        if (entries.get(id) === patched) entries.delete(id);
      });
    }
  }
});

/** `entry` with the cells of `keys` (whole-φ keys: every band inside them) read again; `medianOf(n)` gives the method's overall median over n results. */
async function patch(entry: MethodCells, keys: CellKey[], medianOf: (n: number) => Promise<number | null>): Promise<MethodCells> {
  const whole = (steelId: number, material: string, bandStart: number) => `${steelId}|${material}|${Math.floor(bandStart / 2)}`;
  const changed = new Set(keys.map((k) => whole(k.steelId, k.material, 2 * k.gritPhi)));
  const fresh = (await ComparisonCell.findAll({
    where: {
      methodId: entry.methodId,
      bandWidth: entry.step === 1 ? 2 : 1,
      [Op.or]: keys.map((k) => ({ steelId: k.steelId, material: k.material, bandStart: [2 * k.gritPhi, 2 * k.gritPhi + 1] })),
    },
    raw: true,
  })) as unknown as CellRecord[];
  const cells = [...entry.cells.filter((c) => !changed.has(whole(c.steelId, c.material, c.bandStart))), ...fresh];
  const results = cells.reduce((s, c) => s + c.n, 0);
  return { ...entry, cells, results, overallMedianG: await medianOf(results) };
}

/**
 * The method's overall median, read from the (method, status, median) index: the middle one or
 * two values in order, so the cost is an index walk to the middle, not a sort.
 */
async function overallMedian(methodId: number, n: number): Promise<number | null> {
  if (n === 0) return null;
  const rows = await Result.sequelize!.query<{ g: number }>(
    'SELECT "sharpnessMedianG" AS g FROM results WHERE "sharpnessMethodId" = :methodId AND status = :status ORDER BY "sharpnessMedianG" LIMIT :limit OFFSET :offset',
    { replacements: { methodId, status: 'approved', limit: n % 2 ? 1 : 2, offset: n % 2 ? (n - 1) / 2 : n / 2 - 1 }, type: QueryTypes.SELECT },
  );
  if (!rows.length) return null;
  return rows.reduce((s, r) => s + r.g, 0) / rows.length;
}

async function load(methodId: number, step: 1 | 0.5): Promise<MethodCells> {
  const cells = (await ComparisonCell.findAll({ where: { methodId, bandWidth: step === 1 ? 2 : 1 }, raw: true })) as unknown as CellRecord[];
  const results = cells.reduce((s, c) => s + c.n, 0);
  return { methodId, step, cells, results, overallMedianG: await overallMedian(methodId, results) };
}

/** The cached cells of one method and band step (read from the table on first use after a change). */
export function methodCells(methodId: number, step: 1 | 0.5): Promise<MethodCells> {
  const id = `${methodId}|${step}`;
  let entry = entries.get(id);
  if (!entry) {
    entry = load(methodId, step);
    entries.set(id, entry);
    entry.catch(() => entries.delete(id));
  }
  return entry;
}

/** Approved results per sharpness method id, from the whole-φ cells (cached like the cells). */
export function resultsPerMethod(): Promise<Map<number, number>> {
  if (!totals) {
    const t = (async () => {
      const rows = await Result.sequelize!.query<{ methodId: number; n: number }>('SELECT "methodId", SUM(n) AS n FROM comparison_cells WHERE "bandWidth" = 2 GROUP BY "methodId"', {
        type: QueryTypes.SELECT,
      });
      return new Map(rows.map((r) => [r.methodId, Number(r.n)]));
    })();
    totals = t;
    t.catch(() => {
      if (totals === t) totals = null;
    });
  }
  return totals;
}

/** Drops every entry (tests and the bench use it to measure the uncached path). */
export function clearCellCache(): void {
  entries.clear();
  totals = null;
}
