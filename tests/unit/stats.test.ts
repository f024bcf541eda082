import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as ss from 'simple-statistics';
import { mean, meanCi95, median, medianInPlace, quantile, sampleSd, studentTCdf, studentTQuantile, summarize, summarizeInPlace } from '@shared/stats';
import { computationError } from '../setup/computation-error';

function relativeError(actual: number, expected: number): number {
  return Math.abs(actual - expected) / Math.abs(expected);
}

/**
 * NIST StRD NumAcc2–4: the first value, then 500 pairs (value − 0.1, value + 0.1), written as the
 * decimal literals of the certified data file (so 1000000.1 is the nearest double to 1000000.1,
 * not 1000000.2 − 0.1).
 */
function numAcc(whole: string): number[] {
  const values = [Number(`${whole}.2`)];
  for (let i = 0; i < 500; i++) values.push(Number(`${whole}.1`), Number(`${whole}.3`));
  return values;
}

describe('NIST StRD univariate summary statistics (certified values, s with n − 1)', () => {
  it.each<[string, number[], number, number, number]>([
    // [dataset, values, certified mean, certified sd, relative tolerance]
    ['NumAcc1', [10000001, 10000003, 10000002], 10000002, 1, 1e-15], // NIST StRD NumAcc1 (R)
    ['NumAcc2', numAcc('1'), 1.2, 0.1, 1e-13], // NIST StRD NumAcc2 (R)
    ['NumAcc3', numAcc('1000000'), 1000000.2, 0.1, 1e-8], // NIST StRD NumAcc3 (R)
    ['NumAcc4', numAcc('10000000'), 10000000.2, 0.1, 1e-8], // NIST StRD NumAcc4 (R); decimal inputs limit it to ~1e-8
  ])('%s', (_name, values, certifiedMean, certifiedSd, tolerance) => {
    expect(values.length === 3 || values.length === 1001).toBe(true);
    expect(relativeError(mean(values), certifiedMean)).toBeLessThanOrEqual(1e-15);
    expect(relativeError(sampleSd(values)!, certifiedSd)).toBeLessThanOrEqual(tolerance);
    const s = summarize(values);
    expect(s.mean).toBe(mean(values));
    expect(s.sd).toBe(sampleSd(values));
  });
});

describe('quantiles: linear interpolation between order statistics (Hyndman & Fan type 7)', () => {
  it.each<[string, number[], number, number]>([
    // R: quantile(1:10) → 1, 3.25, 5.5, 7.75, 10 (R's default type 7; worked by hand: h = 9p)
    ['1:10 at 0', [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0, 1],
    ['1:10 at 0.25', [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0.25, 3.25],
    ['1:10 at 0.5', [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0.5, 5.5],
    ['1:10 at 0.75', [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 0.75, 7.75],
    ['1:10 at 1', [1, 2, 3, 4, 5, 6, 7, 8, 9, 10], 1, 10],
    // by hand: sorted 1, 3, 7, 9; h = 3p → 0.25: 1 + 0.75·2 = 2.5; 0.75: 7 + 0.25·2 = 7.5
    ['7 1 3 9 at 0.25', [7, 1, 3, 9], 0.25, 2.5],
    ['7 1 3 9 at 0.75', [7, 1, 3, 9], 0.75, 7.5],
    // NumPy documentation, numpy.percentile: a = [[10, 7, 4], [3, 2, 1]], percentile 50 → 3.5 (from memory)
    ['NumPy docs example', [10, 7, 4, 3, 2, 1], 0.5, 3.5],
    ['a single value', [42], 0.3, 42],
  ])('%s', (_case, values, p, expected) => {
    expect(quantile(values, p)).toBeCloseTo(expected, 12);
  });

  it('does not reorder its input', () => {
    const values = [3, 1, 2];
    quantile(values, 0.5);
    expect(values).toEqual([3, 1, 2]);
  });

  it('agrees with simple-statistics 7.12 quantile() and quantileSorted(), documented as type 7', () => {
    // simple-statistics 7.12.1, src quantile_sorted.js: "(n − 1) · p for index, matching numpy's linear method (type=7)"
    fc.assert(
      fc.property(
        fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 60 }),
        fc.double({ min: 0, max: 1, noNaN: true }),
        (values, p) => {
          const sorted = [...values].sort((a, b) => a - b);
          const ours = quantile(values, p);
          expect(ours).toBeCloseTo(ss.quantileSorted(sorted, p), 6);
          expect(ours).toBeCloseTo(ss.quantile(values, p), 6);
        },
      ),
    );
  });

  it('median agrees with simple-statistics median()', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e6, max: 1e6, noNaN: true }), { minLength: 1, maxLength: 60 }), (values) => {
        expect(median(values)).toBeCloseTo(ss.median(values), 6);
      }),
    );
  });

  it.each([-0.1, 1.1, Number.NaN])('refuses p = %f', (p) => {
    expect(computationError(() => quantile([1, 2], p)).field).toBe('p');
  });
});

describe('mean and sample standard deviation', () => {
  it('agree with simple-statistics mean() and sampleStandardDeviation()', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: -1e4, max: 1e4, noNaN: true }), { minLength: 2, maxLength: 80 }), (values) => {
        expect(mean(values)).toBeCloseTo(ss.mean(values), 8);
        expect(sampleSd(values)!).toBeCloseTo(ss.sampleStandardDeviation(values), 7);
      }),
    );
  });

  it('sd is null for one value; both refuse empty input and non-numbers', () => {
    expect(sampleSd([5])).toBeNull();
    for (const fn of [() => mean([]), () => sampleSd([]), () => median([]), () => summarize([]), () => meanCi95([])]) {
      const err = computationError(fn);
      expect(err.field).toBe('values');
      expect(err.message).toMatch(/no values/);
    }
    expect(computationError(() => mean([1, Number.NaN])).message).toMatch(/value 2 is not a finite number/);
    expect(computationError(() => summarize([1, Infinity])).field).toBe('values');
  });
});

describe("Student's t quantiles", () => {
  // NIST/SEMATECH e-Handbook of Statistical Methods §1.3.6.7.2, upper critical values (R, as cited in the brief)
  it.each([
    [0.975, 1, 12.706],
    [0.975, 2, 4.303],
    [0.975, 10, 2.228],
    [0.975, 30, 2.042],
    [0.975, 100, 1.984],
  ])('t(%f, %i) = %f (NIST/SEMATECH §1.3.6.7.2)', (p, df, t) => {
    expect(studentTQuantile(p, df)).toBeCloseTo(t, 3);
  });

  // NIST/SEMATECH e-Handbook §1.3.6.7.2, other cells of the same table (from memory)
  it.each([
    [0.95, 1, 6.314],
    [0.95, 10, 1.812],
    [0.9, 30, 1.31],
    [0.975, 5, 2.571],
    [0.975, 9, 2.262],
    [0.975, 20, 2.086],
    [0.99, 5, 3.365],
    [0.995, 20, 2.845],
    [0.999, 10, 4.144],
  ])('t(%f, %i) = %f (NIST/SEMATECH §1.3.6.7.2, from memory)', (p, df, t) => {
    expect(studentTQuantile(p, df)).toBeCloseTo(t, 3);
  });

  it('approaches the normal quantile 1.959964 for large df', () => {
    // Φ⁻¹(0.975) = 1.959963985 (standard normal tables, from memory); t − z ≈ (z³ + z)/(4 df) = 2.4e-7 at df 1e7
    expect(studentTQuantile(0.975, 1e7)).toBeCloseTo(1.959964, 6);
  });

  it('property: matches the closed forms for 1 and 2 degrees of freedom', () => {
    // Closed forms of Student's t quantile: ν = 1 (Cauchy) t = tan(π(p − ½)); ν = 2: t = (2p − 1)/√(2p(1 − p))
    fc.assert(
      fc.property(fc.double({ min: 0.001, max: 0.999, noNaN: true }), (p) => {
        fc.pre(Math.abs(p - 0.5) > 1e-6);
        expect(relativeError(studentTQuantile(p, 1), Math.tan(Math.PI * (p - 0.5)))).toBeLessThan(1e-9);
        expect(relativeError(studentTQuantile(p, 2), (2 * p - 1) / Math.sqrt(2 * p * (1 - p)))).toBeLessThan(1e-9);
      }),
    );
  });

  it('property: symmetric, rising in p, and inverse to the CDF', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.0005, max: 0.9995, noNaN: true }),
        fc.double({ min: 0.0005, max: 0.9995, noNaN: true }),
        fc.double({ min: 0.5, max: 500, noNaN: true }),
        (p, p2, df) => {
          const t = studentTQuantile(p, df);
          expect(Number.isFinite(t)).toBe(true);
          // 1 − p is itself rounded, so symmetry holds to a relative tolerance
          expect(Math.abs(studentTQuantile(1 - p, df) + t)).toBeLessThanOrEqual(1e-9 * Math.abs(t) + 1e-12);
          expect(studentTCdf(t, df)).toBeCloseTo(p, 10);
          if (p2 - p > 1e-9) expect(studentTQuantile(p2, df)).toBeGreaterThan(t);
        },
      ),
    );
  });

  it('quantile 0.5 is 0; refuses p outside (0, 1) and df ≤ 0', () => {
    expect(studentTQuantile(0.5, 7)).toBe(0);
    for (const p of [0, 1, -0.2, Number.NaN]) expect(computationError(() => studentTQuantile(p, 5)).field).toBe('p');
    for (const df of [0, -1, Number.NaN, Infinity]) expect(computationError(() => studentTQuantile(0.975, df)).field).toBe('df');
  });
});

describe('summarize', () => {
  it('1:10 as R reports it', () => {
    // R: summary(1:10) quartiles 3.25 / 5.5 / 7.75; sd(1:10) = 3.02765; t.test(1:10) 95 % CI 3.334149 7.665851 (from memory)
    const s = summarize([1, 2, 3, 4, 5, 6, 7, 8, 9, 10]);
    expect(s).toMatchObject({ n: 10, median: 5.5, q1: 3.25, q3: 7.75, mean: 5.5 });
    expect(s.sd).toBeCloseTo(3.02765, 5);
    expect(s.ci95![0]).toBeCloseTo(3.334149, 6);
    expect(s.ci95![1]).toBeCloseTo(7.665851, 6);
    // and the interval is mean ± t(0.975, 9) s/√n by the NIST table value t(0.975, 9) = 2.262 (from memory)
    expect((s.ci95![1] - s.ci95![0]) / 2).toBeCloseTo((2.262 * Math.sqrt(55 / 6)) / Math.sqrt(10), 3);
  });

  it('a single value has no spread: sd and ci95 are null', () => {
    expect(summarize([250])).toEqual({ n: 1, median: 250, q1: 250, q3: 250, mean: 250, sd: null, ci95: null });
    expect(meanCi95([250])).toBeNull();
  });

  it('property: q1 ≤ median ≤ q3, the interval holds the mean, and nothing is NaN', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 10_000, noNaN: true }), { minLength: 1, maxLength: 100 }), (values) => {
        const s = summarize(values);
        expect(s.n).toBe(values.length);
        expect(s.q1).toBeLessThanOrEqual(s.median);
        expect(s.median).toBeLessThanOrEqual(s.q3);
        expect(s.mean).toBeGreaterThanOrEqual(Math.min(...values) - 1e-9);
        expect(s.mean).toBeLessThanOrEqual(Math.max(...values) + 1e-9);
        if (values.length > 1) {
          expect(s.ci95![0]).toBeLessThanOrEqual(s.mean);
          expect(s.ci95![1]).toBeGreaterThanOrEqual(s.mean);
          expect(Number.isFinite(s.sd!)).toBe(true);
        }
      }),
    );
  });
});

describe('the in-place summary of a typed array (selection instead of sorting)', () => {
  it('gives the quartiles and median of simple-statistics (type 7), and the mean and sd of the list summary, for lists with many ties', () => {
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 100, max: 130 }).map((g) => g + 0.25), { minLength: 1, maxLength: 400 }), (values) => {
        const s = summarizeInPlace(Float64Array.from(values));
        // simple-statistics' quantileSorted interpolates as type 7 (general-purpose library); the
        // quarter-gram values keep every interpolation exact, so the figures must be equal.
        const sorted = [...values].sort((a, b) => a - b);
        expect(s.q1).toBe(ss.quantileSorted(sorted, 0.25));
        expect(s.median).toBe(ss.quantileSorted(sorted, 0.5));
        expect(s.q3).toBe(ss.quantileSorted(sorted, 0.75));
        expect(s.mean).toBe(mean(values));
        expect(s.sd).toBe(sampleSd(values));
        expect(s.ci95).toEqual(meanCi95(values));
        expect(medianInPlace(Float64Array.from(values))).toBe(ss.median(values));
      }),
      { numRuns: 300 },
    );
  });

  it('refuses an empty array or a value that is not finite, naming it', () => {
    expect(computationError(() => summarizeInPlace(new Float64Array(0))).field).toBe('values');
    expect(computationError(() => medianInPlace(Float64Array.from([1, NaN]))).message).toContain('value 2');
  });
});
