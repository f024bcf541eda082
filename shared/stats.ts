/**
 * Summary statistics for a comparison cell: n, median, quartiles, mean, sample standard deviation
 * and the 95 % confidence interval of the mean (Student's t with n − 1 degrees of freedom).
 * Values are in whatever unit the caller measured (grams of force, card cut in mm, …).
 *
 * Pure arithmetic: no I/O, no clock, no framework imports.
 */
import { ComputationError } from './computation-error';

/** The summary of one set of measurements, all in the measurements' own unit. */
export interface Summary {
  n: number;
  median: number;
  /** First quartile (25th percentile, R type 7). */
  q1: number;
  /** Third quartile (75th percentile, R type 7). */
  q3: number;
  mean: number;
  /** Sample standard deviation (n − 1 divisor); null for a single value. */
  sd: number | null;
  /** 95 % confidence interval of the mean, Student's t with n − 1 df; null for a single value. */
  ci95: [number, number] | null;
}

function checkValues(values: readonly number[], field = 'values'): void {
  if (!Array.isArray(values)) throw new ComputationError('give a list of numbers', field);
  if (values.length === 0) throw new ComputationError('there are no values to summarise; give at least one', field);
  for (let i = 0; i < values.length; i++) {
    const v = values[i];
    if (typeof v !== 'number' || !Number.isFinite(v)) {
      throw new ComputationError(`value ${i + 1} is not a finite number (got ${String(v)})`, field);
    }
  }
}

/** Throws, naming the first value that is not a finite number (the typed arrays' `checkValues`). */
function checkFinite(values: Float64Array, field = 'values'): void {
  if (values.length === 0) throw new ComputationError('there are no values to summarise; give at least one', field);
  for (let i = 0; i < values.length; i++) {
    if (!Number.isFinite(values[i])) throw new ComputationError(`value ${i + 1} is not a finite number (got ${String(values[i])})`, field);
  }
}

/**
 * Moves the k-th smallest of a[left..right] to a[k], none larger before it and none smaller
 * after it (Hoare's selection, FIND, with a median-of-three pivot; C. A. R. Hoare, "Algorithm 65:
 * Find", Comm. ACM 4(7), 1961). Linear on average, no allocation.
 */
function select(a: Float64Array, k: number, left: number, right: number): void {
  while (right > left) {
    const mid = (left + right) >> 1;
    const x = a[left];
    const y = a[mid];
    const z = a[right];
    const pivot = x < y ? (y < z ? y : x < z ? z : x) : x < z ? x : y < z ? z : y;
    let i = left;
    let j = right;
    while (i <= j) {
      while (a[i] < pivot) i++;
      while (a[j] > pivot) j--;
      if (i <= j) {
        const t = a[i];
        a[i] = a[j];
        a[j] = t;
        i++;
        j--;
      }
    }
    if (k <= j) right = j;
    else if (k >= i) left = i;
    else return;
  }
}

/**
 * Type 7 quantile by selection: linear interpolation between the order statistics at (n − 1)p,
 * found in place (`a` is reordered). `from`: a position before which every value is known to be
 * no larger than those after it (a lower quantile's, selected before), so the search starts there.
 */
function quantileInPlace(a: Float64Array, p: number, from = 0): number {
  const n = a.length;
  const h = (n - 1) * p;
  const lo = Math.floor(h);
  select(a, lo, from, n - 1);
  let next = a[lo];
  if (h > lo) {
    next = Infinity;
    for (let i = lo + 1; i < n; i++) if (a[i] < next) next = a[i];
  }
  return a[lo] + (h - lo) * (next - a[lo]);
}

/**
 * The p-quantile (0 ≤ p ≤ 1) by linear interpolation between order statistics: position
 * (n − 1)p in the sorted values (Hyndman and Fan's definition 7, the default of R's quantile()
 * and NumPy's quantile()). Throws ComputationError for empty input or p outside 0–1.
 */
export function quantile(values: readonly number[], p: number): number {
  checkValues(values);
  if (typeof p !== 'number' || !Number.isFinite(p) || p < 0 || p > 1) {
    throw new ComputationError(`a quantile's p must lie between 0 and 1 (got ${String(p)})`, 'p');
  }
  return quantileInPlace(Float64Array.from(values), p);
}

/** The median (the 0.5 quantile; the mean of the middle two for an even count). */
export function median(values: readonly number[]): number {
  return quantile(values, 0.5);
}

/** Mean with a correction pass: the second pass adds back the rounding error of the first. */
function meanOf(values: ArrayLike<number>): number {
  const n = values.length;
  let sum = 0;
  for (let i = 0; i < n; i++) sum += values[i];
  let m = sum / n;
  let correction = 0;
  for (let i = 0; i < n; i++) correction += values[i] - m;
  m += correction / n;
  return m;
}

/** The arithmetic mean. Throws ComputationError for empty input. */
export function mean(values: readonly number[]): number {
  checkValues(values);
  return meanOf(values);
}

/**
 * The sample standard deviation (divisor n − 1), by the corrected two-pass algorithm (sum of
 * squared deviations from the mean, less the square of the rounding residue; Chan, Golub and
 * LeVeque 1983), which stays accurate for large values with small spread. Null for a single
 * value; throws ComputationError for empty input.
 */
export function sampleSd(values: readonly number[]): number | null {
  checkValues(values);
  return sdAbout(values, meanOf(values));
}

/** The corrected two-pass standard deviation about the values' mean `m`; null below two values. */
function sdAbout(values: ArrayLike<number>, m: number): number | null {
  const n = values.length;
  if (n < 2) return null;
  let squares = 0;
  let residue = 0;
  for (let i = 0; i < n; i++) {
    const dev = values[i] - m;
    squares += dev * dev;
    residue += dev;
  }
  const variance = (squares - (residue * residue) / n) / (n - 1);
  return Math.sqrt(Math.max(0, variance));
}

// ---------------------------------------------------------------------------------------------
// Student's t distribution
// ---------------------------------------------------------------------------------------------

// Lanczos approximation (g = 7, 9 coefficients), relative error about 1e-15 for x > 0.
const LANCZOS = [
  0.99999999999980993, 676.5203681218851, -1259.1392167224028, 771.32342877765313, -176.61502916214059, 12.507343278686905,
  -0.13857109526572012, 9.9843695780195716e-6, 1.5056327351493116e-7,
];

/** Natural log of the gamma function, for x > 0. */
function logGamma(x: number): number {
  if (x < 0.5) return Math.log(Math.PI / Math.sin(Math.PI * x)) - logGamma(1 - x);
  const z = x - 1;
  let a = LANCZOS[0];
  const t = z + 7.5;
  for (let i = 1; i < LANCZOS.length; i++) a += LANCZOS[i] / (z + i);
  return 0.5 * Math.log(2 * Math.PI) + (z + 0.5) * Math.log(t) - t + Math.log(a);
}

/** Continued fraction of the incomplete beta function (modified Lentz's method). */
function betaContinuedFraction(a: number, b: number, x: number): number {
  const TINY = 1e-300;
  const EPS = 1e-16;
  const qab = a + b;
  const qap = a + 1;
  const qam = a - 1;
  let c = 1;
  let d = 1 - (qab * x) / qap;
  if (Math.abs(d) < TINY) d = TINY;
  d = 1 / d;
  let h = d;
  for (let m = 1; m <= 100_000; m++) {
    const m2 = 2 * m;
    let aa = (m * (b - m) * x) / ((qam + m2) * (a + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    h *= d * c;
    aa = (-(a + m) * (qab + m) * x) / ((a + m2) * (qap + m2));
    d = 1 + aa * d;
    if (Math.abs(d) < TINY) d = TINY;
    c = 1 + aa / c;
    if (Math.abs(c) < TINY) c = TINY;
    d = 1 / d;
    const step = d * c;
    h *= step;
    if (Math.abs(step - 1) < EPS) break;
  }
  return h;
}

/**
 * Regularized incomplete beta I_x(a, b), given x and y = 1 − x separately so that x near 1 keeps
 * its precision.
 */
function incompleteBeta(a: number, b: number, x: number, y: number): number {
  if (x <= 0) return 0;
  if (y <= 0) return 1;
  const front = Math.exp(logGamma(a + b) - logGamma(a) - logGamma(b) + a * Math.log(x) + b * Math.log(y));
  // The continued fraction converges fast for x < (a + 1)/(a + b + 2); otherwise use symmetry.
  if (x < (a + 1) / (a + b + 2)) return (front * betaContinuedFraction(a, b, x)) / a;
  return 1 - (front * betaContinuedFraction(b, a, y)) / b;
}

/** Upper tail P(T > t) of Student's t with df degrees of freedom, for t ≥ 0. */
function tUpperTail(t: number, df: number): number {
  const t2 = t * t;
  return 0.5 * incompleteBeta(df / 2, 0.5, df / (df + t2), t2 / (df + t2));
}

/**
 * Cumulative probability P(T ≤ t) of Student's t distribution with df > 0 degrees of freedom,
 * via the regularized incomplete beta function.
 */
export function studentTCdf(t: number, df: number): number {
  checkDf(df);
  if (typeof t !== 'number' || Number.isNaN(t)) throw new ComputationError(`t must be a number (got ${String(t)})`, 't');
  if (t === Infinity) return 1;
  if (t === -Infinity) return 0;
  const tail = tUpperTail(Math.abs(t), df);
  return t >= 0 ? 1 - tail : tail;
}

function checkDf(df: number): void {
  if (typeof df !== 'number' || !Number.isFinite(df) || df <= 0) {
    throw new ComputationError(`degrees of freedom must be a positive number (got ${String(df)})`, 'df');
  }
}

/**
 * The p-quantile of Student's t distribution with df > 0 degrees of freedom (e.g. p = 0.975 for a
 * two-sided 95 % interval): the t with P(T ≤ t) = p, found by bisection on the upper tail computed
 * from the regularized incomplete beta function, to about 1e-14 relative. Throws ComputationError
 * for p outside (0, 1) or df ≤ 0.
 */
export function studentTQuantile(p: number, df: number): number {
  checkDf(df);
  if (typeof p !== 'number' || !Number.isFinite(p) || p <= 0 || p >= 1) {
    throw new ComputationError(`p must lie strictly between 0 and 1 (got ${String(p)})`, 'p');
  }
  if (p === 0.5) return 0;
  const q = p < 0.5 ? p : 1 - p; // the tail probability to match
  let lo = 0;
  let hi = 1;
  while (tUpperTail(hi, df) > q) {
    lo = hi;
    hi *= 2;
    if (hi > 1e300) break; // p so extreme that t overflows; bisection below still narrows down
  }
  for (let i = 0; i < 2000 && hi - lo > 1e-15 * hi; i++) {
    const mid = (lo + hi) / 2;
    if (mid === lo || mid === hi) break;
    if (tUpperTail(mid, df) > q) lo = mid;
    else hi = mid;
  }
  const t = (lo + hi) / 2;
  return p < 0.5 ? -t : t;
}

/**
 * The 95 % confidence interval of the mean, mean ± t(0.975, n − 1) · s / √n, as [low, high].
 * Null for a single value; throws ComputationError for empty input.
 */
export function meanCi95(values: readonly number[]): [number, number] | null {
  checkValues(values);
  const m = meanOf(values);
  return ci95About(values.length, m, sdAbout(values, m));
}

/** t(0.975, df) by degrees of freedom, computed once each (a cell's interval asks it again and again). */
const t975 = new Map<number, number>();

function ci95About(n: number, m: number, sd: number | null): [number, number] | null {
  if (sd === null) return null;
  let t = t975.get(n - 1);
  if (t === undefined) t975.set(n - 1, (t = studentTQuantile(0.975, n - 1)));
  const half = (t * sd) / Math.sqrt(n);
  return [m - half, m + half];
}

/**
 * n, median, quartiles (type 7), mean, sample standard deviation and 95 % confidence interval of
 * the mean of a set of measurements. sd and ci95 are null for a single value; throws
 * ComputationError for empty input or a value that is not a finite number.
 */
export function summarize(values: readonly number[]): Summary {
  checkValues(values);
  return summarizeInPlace(Float64Array.from(values));
}

/**
 * `summarize` of values held in a typed array, which it reorders (the quartiles are found by
 * selection, not by sorting a copy): the read models' way, with no allocation per value.
 */
export function summarizeInPlace(values: Float64Array): Summary {
  checkFinite(values);
  // Mean and spread first, in the values' own order (the sums' rounding depends on it).
  const m = meanOf(values);
  const sd = sdAbout(values, m);
  const n = values.length;
  const q1 = quantileInPlace(values, 0.25);
  const median = quantileInPlace(values, 0.5, Math.floor((n - 1) * 0.25));
  const q3 = quantileInPlace(values, 0.75, Math.floor((n - 1) * 0.5));
  return { n, median, q1, q3, mean: m, sd, ci95: ci95About(n, m, sd) };
}

/** The median of values held in a typed array, which it reorders (selection). */
export function medianInPlace(values: Float64Array): number {
  checkFinite(values);
  return quantileInPlace(values, 0.5);
}
