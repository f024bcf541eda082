/**
 * The shift between two independent samples: how much larger b's values run than a's.
 * The point estimate is the Hodges–Lehmann estimate, the median of all m·n differences
 * b_j − a_i; its interval is the distribution-free one built on the exact null distribution of
 * the Mann–Whitney U statistic, [D_(k), D_(mn+1−k)] with k the largest whole number for which
 * 2·P(U ≤ k − 1) ≤ 0.05 (Hollander, Wolfe & Chicken, Nonparametric Statistical Methods,
 * 3rd ed., 2014, §4.3). Because U takes whole values, the actual coverage 1 − 2·P(U ≤ k − 1) is
 * at least 95 %, and it is reported. When even the widest such interval, [min D, max D],
 * covers less than 95 %, no interval exists and null is returned.
 *
 * The interval assumes only that each sample's values are independent and the two
 * distributions differ by a shift; with ties the coverage is approximate. Pure arithmetic.
 */
import { ComputationError } from './computation-error';

/**
 * The exact null distribution of the Mann–Whitney U for samples of sizes m and n: entry u is
 * P(U = u), u = 0 … m·n. It comes from the generating function of U, the Gaussian binomial
 * coefficient [m+n choose n]_q = ∏_{i=1..s} (1 − q^{l+i}) / (1 − q^i) (s, l the smaller and larger
 * size), built one factor at a time. Each partial product is the distribution for sizes (i, l)
 * times C(l + i, i); it is rescaled to probabilities after every factor so that nothing overflows.
 * Cost about s²·l operations: callers keep m·n within MAX_EXACT_PAIRS.
 */
export function mannWhitneyNull(m: number, n: number): Float64Array {
  checkSize(m, 'm');
  checkSize(n, 'n');
  const [small, large] = m < n ? [m, n] : [n, m];
  const top = small * large;
  const p = new Float64Array(top + 1);
  p[0] = 1;
  for (let i = 1; i <= small; i++) {
    // Multiply by (1 − q^{large+i}), highest coefficient first so each reads an old value; the
    // terms beyond degree i·large cancel in the division below, so they are never written.
    const step = large + i;
    const degree = i * large;
    for (let u = degree; u >= step; u--) p[u] -= p[u - step];
    // Divide by (1 − q^i): p[u] += p[u − i], lowest first so each reads a new value; then
    // scale by C(l + i − 1, i − 1) / C(l + i, i) = i / (l + i) to keep a distribution.
    for (let u = i; u <= degree; u++) p[u] += p[u - i];
    const scale = i / (large + i);
    for (let u = 0; u <= degree; u++) p[u] *= scale;
  }
  return p;
}

function checkSize(k: number, field: string): void {
  if (!Number.isInteger(k) || k < 1) throw new ComputationError(`a sample needs at least one value (got ${String(k)})`, field);
}

/** Beyond this many pairs (m·n) the interval uses the large-sample normal approximation of U. */
export const MAX_EXACT_PAIRS = 40_000;
/** The largest sample either side may have (its m·n differences are sorted in memory). */
export const MAX_SAMPLE = 1000;
/** z at 0.975, the standard normal's 97.5th percentile. */
const Z_975 = 1.959963984540054;

/**
 * Standard normal CDF through erfc's rational approximation of Abramowitz and Stegun, Handbook
 * of Mathematical Functions, 7.1.26 (absolute error below 1.5e-7): used only to state the
 * approximate coverage of a large-sample interval.
 */
function normalCdf(x: number): number {
  const z = Math.abs(x) / Math.SQRT2;
  const t = 1 / (1 + 0.3275911 * z);
  const erfc = t * (0.254829592 + t * (-0.284496736 + t * (1.421413741 + t * (-1.453152027 + t * 1.061405429)))) * Math.exp(-z * z);
  return x >= 0 ? 1 - erfc / 2 : erfc / 2;
}

/** A shift estimate with its interval. */
export interface ShiftEstimate {
  /** Sizes of a and b. */
  nA: number;
  nB: number;
  /** Hodges–Lehmann estimate of b − a, in the samples' unit. */
  estimate: number;
  /** The distribution-free 95 % interval of b − a, or null where none reaches 95 %. */
  interval: {
    lo: number;
    hi: number;
    /** Coverage under the U null distribution, a fraction (≥ 0.95 when exact). */
    coverage: number;
    /** 1-based ranks of the differences used: [k, m·n + 1 − k]. */
    ranks: [number, number];
  } | null;
  /** The coverage of the widest possible interval [min, max] of the differences; below 0.95, no interval. */
  widestCoverage: number;
  /** 'exact': U's exact null distribution; 'normal': its large-sample approximation (m·n > MAX_EXACT_PAIRS). */
  distribution: 'exact' | 'normal';
}

function checkSample(values: readonly number[], field: string): void {
  if (!Array.isArray(values) || values.length === 0) throw new ComputationError('give at least one value', field);
  if (values.length > MAX_SAMPLE) throw new ComputationError(`at most ${MAX_SAMPLE} values per sample`, field);
  values.forEach((v, i) => {
    if (typeof v !== 'number' || !Number.isFinite(v)) throw new ComputationError(`value ${i + 1} is not a finite number (got ${String(v)})`, field);
  });
}

/**
 * The Hodges–Lehmann estimate of the shift b − a and its distribution-free 95 % interval from
 * the exact Mann–Whitney null distribution (Hollander, Wolfe & Chicken §4.3); beyond
 * MAX_EXACT_PAIRS pairs, k from the book's large-sample approximation
 * k = round(mn/2 − z·√(mn(m + n + 1)/12)). Throws ComputationError for an empty or too large
 * sample or a value that is not a finite number.
 */
export function shiftEstimate(a: readonly number[], b: readonly number[]): ShiftEstimate {
  checkSample(a, 'a');
  checkSample(b, 'b');
  const m = a.length;
  const n = b.length;
  const N = m * n;
  const diffs = new Float64Array(N);
  let i = 0;
  for (const x of a) for (const y of b) diffs[i++] = y - x;
  diffs.sort();
  const estimate = N % 2 ? diffs[(N - 1) / 2] : (diffs[N / 2 - 1] + diffs[N / 2]) / 2;
  const alpha = 0.05;
  let k: number;
  let coverage: number;
  let widestCoverage: number;
  let distribution: ShiftEstimate['distribution'];
  if (N <= MAX_EXACT_PAIRS) {
    distribution = 'exact';
    const pmf = mannWhitneyNull(m, n);
    // Largest k with 2·P(U ≤ k − 1) ≤ α; `below` holds P(U ≤ k − 1). The relative allowance
    // keeps an exact tie with α on the covering side despite rounding.
    k = 0;
    let below = 0;
    while (k < N / 2 && 2 * (below + pmf[k]) <= alpha * (1 + 1e-9)) {
      below += pmf[k];
      k++;
    }
    coverage = 1 - 2 * below;
    widestCoverage = 1 - 2 * pmf[0];
  } else {
    distribution = 'normal';
    const sd = Math.sqrt((N * (m + n + 1)) / 12);
    k = Math.max(0, Math.round(N / 2 - Z_975 * sd));
    // P(U ≤ k − 1) with the continuity correction.
    coverage = 1 - 2 * normalCdf((k - 0.5 - N / 2) / sd);
    widestCoverage = 1 - 2 * normalCdf((0.5 - N / 2) / sd);
  }
  const interval = k >= 1 ? { lo: diffs[k - 1], hi: diffs[N - k], coverage, ranks: [k, N + 1 - k] as [number, number] } : null;
  return { nA: m, nB: n, estimate, interval, widestCoverage, distribution };
}
