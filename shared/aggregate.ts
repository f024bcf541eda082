import { medianInPlace, summarizeInPlace, type Summary } from './stats';
import { gritBandPhi } from './grit';

/** One approved result as it enters a comparison cell. */
export interface CellMember {
  authorId: number;
  /** The result's median sharpness reading, g (each result counts once). */
  sharpnessMedianG: number;
  retentionCuts: number | null;
  hrc: number;
  perSideDeg: number;
}

/** A comparison cell's aggregate figures. */
export interface CellAggregate {
  n: number;
  testers: number;
  sharpnessG: Summary;
  retentionMedianCuts: number | null;
  /** How many of the cell's results report a retention count. */
  retentionN: number;
  hrcRange: [number, number];
  angleRange: [number, number];
}

/**
 * One cell's results as parallel typed arrays (`medianG.length` results): each result's author,
 * median reading, retention count (NaN where it reports none), hardness, angle and particle size.
 * The read models gather a cell into these without an object per result.
 */
export interface CellArrays {
  authorIds: Int32Array;
  medianG: Float64Array;
  retentionCuts: Float64Array;
  hrc: Float64Array;
  perSideDeg: Float64Array;
  gritUm: Float64Array;
}

/** The arrays of `members` (gritUm 0 where a member has none: only `cellColumns` reads it). */
function arraysOf(members: readonly (CellMember & { gritUm?: number })[]): CellArrays {
  const n = members.length;
  const a: CellArrays = { authorIds: new Int32Array(n), medianG: new Float64Array(n), retentionCuts: new Float64Array(n), hrc: new Float64Array(n), perSideDeg: new Float64Array(n), gritUm: new Float64Array(n) };
  members.forEach((m, i) => {
    a.authorIds[i] = m.authorId;
    a.medianG[i] = m.sharpnessMedianG;
    a.retentionCuts[i] = m.retentionCuts ?? NaN;
    a.hrc[i] = m.hrc;
    a.perSideDeg[i] = m.perSideDeg;
    a.gritUm[i] = m.gritUm ?? 0;
  });
  return a;
}

const rangeOf = (values: Float64Array): [number, number] => {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = 0; i < values.length; i++) {
    if (values[i] < lo) lo = values[i];
    if (values[i] > hi) hi = values[i];
  }
  return [lo, hi];
};

/** Per id, the number of the count that last met it: ids are counted without a set or a sort. */
let lastCount = new Int32Array(1024);
let counts = 0;

/** How many different ids `ids` holds (non-negative integers, as account ids are). */
function distinctCount(ids: Int32Array): number {
  let max = 0;
  for (let i = 0; i < ids.length; i++) if (ids[i] > max) max = ids[i];
  if (max >= lastCount.length) lastCount = new Int32Array(Math.max(max + 1, 2 * lastCount.length));
  if (++counts === 2 ** 31 - 1) {
    lastCount.fill(0);
    counts = 1;
  }
  let distinct = 0;
  for (let i = 0; i < ids.length; i++) {
    if (lastCount[ids[i]] !== counts) {
      lastCount[ids[i]] = counts;
      distinct++;
    }
  }
  return distinct;
}

/**
 * Aggregates one cell's results held in typed arrays, which it reorders (medians and retention
 * counts selected in place): the one implementation of a cell's figures.
 */
export function aggregateCellArrays(a: CellArrays): CellAggregate {
  const n = a.medianG.length;
  const testers = distinctCount(a.authorIds);
  // The reported retention counts to the front, in order.
  let retentionN = 0;
  for (let i = 0; i < n; i++) if (!Number.isNaN(a.retentionCuts[i])) a.retentionCuts[retentionN++] = a.retentionCuts[i];
  return {
    n,
    testers,
    sharpnessG: summarizeInPlace(a.medianG),
    retentionMedianCuts: retentionN ? medianInPlace(a.retentionCuts.subarray(0, retentionN)) : null,
    retentionN,
    hrcRange: rangeOf(a.hrc),
    angleRange: rangeOf(a.perSideDeg),
  };
}

/** Aggregates the results of one cell: statistics of their medians, testers, ranges. */
export function aggregateCell(members: readonly CellMember[]): CellAggregate {
  return aggregateCellArrays(arraysOf(members));
}

/** A result as it is grouped into cells: its cell key parts beside its figures. */
export interface BandedMember extends CellMember {
  sharpnessMethodId: number;
  steelId: number;
  material: string;
  /** Whole-φ band as stored with the result (⌊−log2(d / 1 mm)⌋). */
  gritPhi: number;
  /** Particle size, µm. */
  gritUm: number;
}

/**
 * The band a result falls in, as the φ of the band's coarse edge counted in half-φ units
 * (so whole band φ 6 is 12; the half bands inside it are 12 and 13). A half band always lies
 * inside the result's stored whole band, so whole and half cells hold the same results.
 */
export function bandStartOf(m: Pick<BandedMember, 'gritPhi' | 'gritUm'>, step: 1 | 0.5): number {
  if (step === 1) return 2 * m.gritPhi;
  const half = Math.round(2 * gritBandPhi(m.gritUm, 0.5));
  return Math.min(2 * m.gritPhi + 1, Math.max(2 * m.gritPhi, half));
}

/** The key of a comparison cell for one band step; `bandStart` in half-φ units. */
export interface BandedCellKey {
  methodId: number;
  steelId: number;
  material: string;
  /** Band width in half-φ units: 2 for whole φ, 1 for half φ. */
  bandWidth: 1 | 2;
  bandStart: number;
}

/** Groups results into the cells of one band step, in first-seen order. */
export function groupIntoCells<T extends BandedMember>(members: readonly T[], step: 1 | 0.5): { key: BandedCellKey; members: T[] }[] {
  const groups = new Map<string, { key: BandedCellKey; members: T[] }>();
  const bandWidth = step === 1 ? 2 : 1;
  for (const m of members) {
    const bandStart = bandStartOf(m, step);
    const id = `${m.sharpnessMethodId}|${m.steelId}|${m.material}|${bandStart}`;
    let g = groups.get(id);
    if (!g) groups.set(id, (g = { key: { methodId: m.sharpnessMethodId, steelId: m.steelId, material: m.material, bandWidth, bandStart }, members: [] }));
    g.members.push(m);
  }
  return [...groups.values()];
}

/** A cell's figures as flat columns, as the comparison_cells table stores them (grams, HRC, degrees, µm). */
export interface CellColumns {
  n: number;
  testers: number;
  medianG: number;
  q1G: number;
  q3G: number;
  meanG: number;
  sdG: number | null;
  ciLoG: number | null;
  ciHiG: number | null;
  retentionN: number;
  retentionMedianCuts: number | null;
  hrcMin: number;
  hrcMax: number;
  angleMinDeg: number;
  angleMaxDeg: number;
  gritUmMin: number;
  gritUmMax: number;
}

/** The stored columns of one cell from its results (which must not be empty). */
export function cellColumns(members: readonly (CellMember & { gritUm: number })[]): CellColumns {
  return cellColumnsOfArrays(arraysOf(members));
}

/** `cellColumns` of one cell's results held in typed arrays, which it reorders. */
export function cellColumnsOfArrays(arrays: CellArrays): CellColumns {
  const [gritUmMin, gritUmMax] = rangeOf(arrays.gritUm);
  const a = aggregateCellArrays(arrays);
  return {
    n: a.n,
    testers: a.testers,
    medianG: a.sharpnessG.median,
    q1G: a.sharpnessG.q1,
    q3G: a.sharpnessG.q3,
    meanG: a.sharpnessG.mean,
    sdG: a.sharpnessG.sd,
    ciLoG: a.sharpnessG.ci95?.[0] ?? null,
    ciHiG: a.sharpnessG.ci95?.[1] ?? null,
    retentionN: a.retentionN,
    retentionMedianCuts: a.retentionMedianCuts,
    hrcMin: a.hrcRange[0],
    hrcMax: a.hrcRange[1],
    angleMinDeg: a.angleRange[0],
    angleMaxDeg: a.angleRange[1],
    gritUmMin,
    gritUmMax,
  };
}
