/**
 * The "ranked" order's low-n shrinkage: a cell's median is pulled toward the method's overall
 * median as if the cell held a few more results sitting exactly at that overall median, so
 * that two lucky results cannot top the table. Pure arithmetic.
 */
import { ComputationError } from './computation-error';

/**
 * How many imaginary results at the method's overall median each cell is given. With 3, a cell
 * of 2 results moves 60 % of the way to the overall median, a cell of 12 moves 20 %, a cell of
 * 57 moves 5 %. (The additive-smoothing idea of a prior worth k observations; the value 3 is
 * Edgeledger's choice, equal to the threshold below which a cell is marked "few results".)
 */
export const SHRINKAGE_PSEUDO_RESULTS = 3;

/**
 * The shrunk median, g: (n · median + k · overall) / (n + k). Throws ComputationError for a
 * negative or non-finite n or k, or non-finite medians.
 */
export function shrunkMedian(n: number, medianG: number, overallMedianG: number, k: number = SHRINKAGE_PSEUDO_RESULTS): number {
  if (!Number.isFinite(n) || n < 0) throw new ComputationError(`n must be 0 or more (got ${String(n)})`, 'n');
  if (!Number.isFinite(k) || k < 0) throw new ComputationError(`k must be 0 or more (got ${String(k)})`, 'k');
  if (!Number.isFinite(medianG)) throw new ComputationError(`the cell's median must be a number (got ${String(medianG)})`, 'medianG');
  if (!Number.isFinite(overallMedianG)) throw new ComputationError(`the overall median must be a number (got ${String(overallMedianG)})`, 'overallMedianG');
  if (n + k === 0) return overallMedianG;
  return (n * medianG + k * overallMedianG) / (n + k);
}

/** The share of the distance to the overall median a cell of n results moves: k / (n + k). */
export function shrinkageShare(n: number, k: number = SHRINKAGE_PSEUDO_RESULTS): number {
  return n + k === 0 ? 1 : k / (n + k);
}
