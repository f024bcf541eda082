/**
 * What the review desk shows beside a pending result, computed from plain numbers: the cell it
 * would join (n, median, quartiles of the approved results' median readings), where the result
 * falls in it, an outlier hint, the method's required readings, and the near-duplicate rule.
 *
 * Pure: no I/O, no clock. Quartiles are the project's (`summarize`, type 7).
 */
import { summarize } from './stats';

/** A cell's figures as the desk shows them (sharpness medians in g; fewer grams is sharper). */
export interface DeskCell {
  n: number;
  median: number;
  q1: number;
  q3: number;
}

/** Where a reading falls in a cell: percentile rank and a sentence in words. */
export interface CellPosition {
  /** Percent of the cell's results below it, plus half of those equal to it (0–100). */
  percentileRank: number;
  /** 'below-q1' | 'q1-median' | 'median' | 'median-q3' | 'above-q3'. */
  band: 'below-q1' | 'q1-median' | 'median' | 'median-q3' | 'above-q3';
  words: string;
}

/** The outlier hint: the rule, its source, the fences and whether the reading lies outside them. */
export interface OutlierHint {
  rule: string;
  source: string;
  /** Null when the cell has too few results for quartiles to mean much (see MIN_CELL_FOR_FENCES). */
  fences: [number, number] | null;
  outside: 'low' | 'high' | null;
  words: string;
}

/** Tukey's fences lie 1.5 interquartile ranges beyond the quartiles. */
export const TUKEY_K = 1.5;
/** Below four results the quartiles rest on one or two values each; no hint is given (the project's choice). */
export const MIN_CELL_FOR_FENCES = 4;

/** The cell's figures, or null for an empty cell. */
export function deskCell(medians: readonly number[]): DeskCell | null {
  if (medians.length === 0) return null;
  const s = summarize(medians);
  return { n: s.n, median: s.median, q1: s.q1, q3: s.q3 };
}

/**
 * Percentile rank of `x` among `values`: (below + ½ · equal) / n × 100, the usual textbook
 * definition that counts ties half (common practice in test scoring). Null for no values.
 */
export function percentileRank(values: readonly number[], x: number): number | null {
  if (values.length === 0) return null;
  let below = 0;
  let equal = 0;
  for (const v of values) {
    if (v < x) below += 1;
    else if (v === x) equal += 1;
  }
  return ((below + equal / 2) / values.length) * 100;
}

const g = (v: number) => `${Math.round(v * 10) / 10} g`;

/** Where `x` falls in the cell (its quartiles and the percentile rank among `values`), in words. */
export function cellPosition(values: readonly number[], x: number): CellPosition | null {
  const cell = deskCell(values);
  const rank = percentileRank(values, x);
  if (!cell || rank === null) return null;
  const pr = Math.round(rank);
  const band: CellPosition['band'] =
    x < cell.q1 ? 'below-q1' : x > cell.q3 ? 'above-q3' : x === cell.median ? 'median' : x < cell.median ? 'q1-median' : 'median-q3';
  const where = {
    'below-q1': `below the lower quartile (${g(cell.q1)}): sharper than three quarters of the cell`,
    'q1-median': `between the lower quartile (${g(cell.q1)}) and the median (${g(cell.median)})`,
    median: `at the cell's median (${g(cell.median)})`,
    'median-q3': `between the median (${g(cell.median)}) and the upper quartile (${g(cell.q3)})`,
    'above-q3': `above the upper quartile (${g(cell.q3)}): duller than three quarters of the cell`,
  }[band];
  return { percentileRank: rank, band, words: `${g(x)} is ${where}; percentile rank ${pr} of ${values.length}.` };
}

/**
 * Tukey's fences: a value below Q1 − 1.5 · IQR or above Q3 + 1.5 · IQR is worth a second look
 * (Tukey 1977, Exploratory Data Analysis, the "inner fences"; recalled from memory). Tukey drew
 * them from his hinges; the project's type-7 quartiles stand in for them, which differ from the
 * hinges by at most part of one gap between neighbouring values.
 */
export function tukeyOutlier(values: readonly number[], x: number): OutlierHint {
  const rule = `Tukey's fences: outside Q1 − ${TUKEY_K} × IQR … Q3 + ${TUKEY_K} × IQR of the cell`;
  const source = 'J. W. Tukey, Exploratory Data Analysis (Addison-Wesley, 1977)';
  if (values.length < MIN_CELL_FOR_FENCES) {
    return { rule, source, fences: null, outside: null, words: `No hint: the cell has ${values.length} approved result${values.length === 1 ? '' : 's'}; fences need at least ${MIN_CELL_FOR_FENCES}.` };
  }
  const cell = deskCell(values)!;
  const iqr = cell.q3 - cell.q1;
  const fences: [number, number] = [cell.q1 - TUKEY_K * iqr, cell.q3 + TUKEY_K * iqr];
  const outside = x < fences[0] ? 'low' : x > fences[1] ? 'high' : null;
  const span = `${g(fences[0])} … ${g(fences[1])}`;
  const words =
    outside === 'low'
      ? `Possible outlier: ${g(x)} is below the lower fence (${span}). Unusually sharp for this cell; check the readings.`
      : outside === 'high'
        ? `Possible outlier: ${g(x)} is above the upper fence (${span}). Unusually dull for this cell; check the readings.`
        : `Within the fences (${span}).`;
  return { rule, source, fences, outside, words };
}

/** The method's required readings against the result's count. */
export function readingsCheck(required: number, given: number): { required: number; given: number; short: number; words: string } {
  const short = Math.max(0, required - given);
  const words = short
    ? `The method asks for ${required} readings per edge; this result has ${given} (${short} short).`
    : `The method asks for ${required} readings per edge; this result has ${given}.`;
  return { required, given, short, words };
}

/** The near-duplicate rule's tolerances (the project's choice, said on the desk). */
export const NEAR_DUPLICATE = { angleDeg: 0.25, medianRel: 0.05 } as const;

/** Words for the rule, shown on the desk beside the list. */
export const NEAR_DUPLICATE_RULE =
  `Near-duplicate: another pending or published result on the same steel, final abrasive, grit and sharpness method, ` +
  `with an angle per side within ${NEAR_DUPLICATE.angleDeg}° and a median reading within ${NEAR_DUPLICATE.medianRel * 100} % of this one's (by any author; the same author is marked).`;

/** A result as the near-duplicate rule compares it. */
export interface DuplicateKey {
  steelId: number;
  abrasiveId: number;
  gritGrade: string;
  sharpnessMethodId: number;
  perSideDeg: number;
  sharpnessMedianG: number;
}

/** Whether `b` is a near-duplicate of `a` by NEAR_DUPLICATE_RULE. */
export function isNearDuplicate(a: DuplicateKey, b: DuplicateKey): boolean {
  return (
    a.steelId === b.steelId &&
    a.abrasiveId === b.abrasiveId &&
    a.gritGrade === b.gritGrade &&
    a.sharpnessMethodId === b.sharpnessMethodId &&
    Math.abs(a.perSideDeg - b.perSideDeg) <= NEAR_DUPLICATE.angleDeg + 1e-9 &&
    Math.abs(a.sharpnessMedianG - b.sharpnessMedianG) <= NEAR_DUPLICATE.medianRel * Math.max(a.sharpnessMedianG, b.sharpnessMedianG) + 1e-9
  );
}

/** The band of medians a near-duplicate of `median` may have (for a query's prefilter). */
export function nearDuplicateMedianRange(median: number): [number, number] {
  return [median * (1 - NEAR_DUPLICATE.medianRel), median / (1 - NEAR_DUPLICATE.medianRel)];
}
