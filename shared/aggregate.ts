import { median, summarize, type Summary } from './stats';
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

/** Aggregates the results of one cell: statistics of their medians, testers, ranges. */
export function aggregateCell(members: readonly CellMember[]): CellAggregate {
  const retention = members.map((m) => m.retentionCuts).filter((c): c is number => c !== null);
  const hrc = members.map((m) => m.hrc);
  const angle = members.map((m) => m.perSideDeg);
  return {
    n: members.length,
    testers: new Set(members.map((m) => m.authorId)).size,
    sharpnessG: summarize(members.map((m) => m.sharpnessMedianG)),
    retentionMedianCuts: retention.length ? median(retention) : null,
    retentionN: retention.length,
    hrcRange: [Math.min(...hrc), Math.max(...hrc)],
    angleRange: [Math.min(...angle), Math.max(...angle)],
  };
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
  const a = aggregateCell(members);
  let gritUmMin = Infinity;
  let gritUmMax = -Infinity;
  for (const m of members) {
    if (m.gritUm < gritUmMin) gritUmMin = m.gritUm;
    if (m.gritUm > gritUmMax) gritUmMax = m.gritUm;
  }
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
