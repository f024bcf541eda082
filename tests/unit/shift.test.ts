import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import * as ss from 'simple-statistics';
import { MAX_EXACT_PAIRS, mannWhitneyNull, shiftEstimate } from '@shared/shift';
import { computationError } from '../setup/computation-error';

/** Every way of choosing k of 0 … total − 1 (as index lists). */
function* combinations(total: number, k: number, start = 0, chosen: number[] = []): Generator<number[]> {
  if (chosen.length === k) {
    yield chosen;
    return;
  }
  for (let i = start; i <= total - (k - chosen.length); i++) yield* combinations(total, k, i + 1, [...chosen, i]);
}

/**
 * U's null distribution by counting: every way to place the n values of b among m + n ranks is
 * equally likely; U = number of (a, b) pairs with b above a. Independent of the generating function.
 */
function countedNull(m: number, n: number): number[] {
  const counts = new Array<number>(m * n + 1).fill(0);
  let total = 0;
  for (const ranksOfB of combinations(m + n, n)) {
    // U = Σ over b of (its rank − how many b lie below it) = number of a below each b.
    const u = ranksOfB.reduce((sum, r, j) => sum + (r - j), 0);
    counts[u]++;
    total++;
  }
  return counts.map((c) => c / total);
}

/** The interval by brute force: all differences sorted, k from the counted distribution. */
function bruteForce(a: number[], b: number[]) {
  const diffs = a.flatMap((x) => b.map((y) => y - x)).sort((p, q) => p - q);
  const pmf = countedNull(a.length, b.length);
  let k = 0;
  let below = 0;
  while (2 * (below + pmf[k]) <= 0.05 + 1e-12) below += pmf[k++];
  return { estimate: ss.median(diffs), k, lo: k ? diffs[k - 1] : null, hi: k ? diffs[diffs.length - k] : null, coverage: 1 - 2 * below };
}

describe('Mann–Whitney U null distribution', () => {
  it('equals the distribution counted over every arrangement of ranks (brute-force enumeration)', () => {
    for (const [m, n] of [[1, 1], [2, 3], [3, 3], [4, 4], [5, 3], [3, 7], [6, 6], [10, 5]]) {
      const exact = mannWhitneyNull(m, n);
      const counted = countedNull(m, n);
      expect(exact.length).toBe(counted.length);
      counted.forEach((p, u) => expect(exact[u]).toBeCloseTo(p, 14));
    }
  });

  it('matches scipy 1.17.1 (scipy.stats._mannwhitneyu._MWU(30, 30).cdf, computed for this test) far into the tails', () => {
    const pmf = mannWhitneyNull(30, 30);
    const cdf = (k: number) => pmf.slice(0, k + 1).reduce((s, p) => s + p, 0);
    // scipy 1.17.1 values (its own recursion over U's frequencies).
    expect(cdf(0) / 8.45561694607237e-18).toBeCloseTo(1, 8);
    expect(cdf(100) / 1.088630702416935e-8).toBeCloseTo(1, 8);
    expect(cdf(200) / 7.162746953413218e-5).toBeCloseTo(1, 8);
    expect(cdf(300)).toBeCloseTo(0.013165980151289586, 12);
    expect(cdf(449)).toBeCloseTo(0.49707325608811315, 12);
  });

  it('4 × 4: P(U = 0) = 1/70, P(U ≤ 1) = 2/70, P(U ≤ 2) = 4/70 (partitions in a 4 × 4 box; common textbook table values)', () => {
    const pmf = mannWhitneyNull(4, 4);
    expect(pmf[0]).toBeCloseTo(1 / 70, 15);
    expect(pmf[0] + pmf[1]).toBeCloseTo(2 / 70, 15);
    expect(pmf[0] + pmf[1] + pmf[2]).toBeCloseTo(4 / 70, 15);
  });
});

describe('Hodges–Lehmann shift with its exact Mann–Whitney interval', () => {
  // Permeability constants of the human chorioamnion at term (x) and at 12–26 weeks (y):
  // Hollander & Wolfe (1973) p. 69 and Hollander, Wolfe & Chicken (2014) ch. 4, the same data as
  // R's wilcox.test help page. Data, the estimate Δ̂ = 0.305 (x − y) and the 95 % interval
  // (−0.15, 0.76) for x − y are recalled from memory (R's wilcox.test(x, y, conf.int = TRUE));
  // the interval and its coverage 0.9600 were recomputed for this test with scipy 1.17.1 (exact
  // U distribution) and agree.
  const term = [0.8, 0.83, 1.89, 1.04, 1.45, 1.38, 1.91, 1.64, 0.73, 1.46];
  const early = [1.15, 0.88, 0.9, 0.74, 1.21];

  it('chorioamnion example: shift early − term = −0.305, 95 % interval (−0.76, 0.15), coverage 0.960', () => {
    const s = shiftEstimate(term, early);
    expect(s.distribution).toBe('exact');
    expect(s.estimate).toBeCloseTo(-0.305, 10);
    expect(s.interval!.lo).toBeCloseTo(-0.76, 10);
    expect(s.interval!.hi).toBeCloseTo(0.15, 10);
    expect(s.interval!.ranks).toEqual([9, 42]); // k = 9 of 50 differences (scipy 1.17.1)
    expect(s.interval!.coverage).toBeCloseTo(0.9600399600399601, 12); // 1 − 2·P(U ≤ 8), scipy 1.17.1
  });

  it('reversing the samples mirrors the shift and its interval', () => {
    const s = shiftEstimate(early, term);
    expect(s.estimate).toBeCloseTo(0.305, 10);
    expect(s.interval!.lo).toBeCloseTo(-0.15, 10);
    expect(s.interval!.hi).toBeCloseTo(0.76, 10);
  });

  it('a second set (invented readings in g) matches scipy 1.17.1: −1.95 (−3.6, −0.7), coverage 0.95991', () => {
    const a = [12.5, 14.1, 13.3, 15.8, 12.9, 16.2, 13.7, 14.4];
    const b = [11.2, 12.0, 13.9, 10.8, 12.6, 11.7, 12.2];
    const s = shiftEstimate(a, b);
    expect(s.estimate).toBeCloseTo(-1.95, 10);
    expect(s.interval!.lo).toBeCloseTo(-3.6, 10);
    expect(s.interval!.hi).toBeCloseTo(-0.7, 10);
    expect(s.interval!.coverage).toBeCloseTo(0.9599067599067599, 12);
  });

  it('no 95 % interval with 3 and 3 or 3 and 4 values (P(U = 0) = 1/20 and 1/35 exceed 2.5 %); 4 and 4 give [min, max] at 97.1 %', () => {
    const three = shiftEstimate([1, 2, 3], [4, 5, 6]);
    expect(three.interval).toBeNull();
    expect(three.widestCoverage).toBeCloseTo(1 - 2 / 20, 14);
    expect(shiftEstimate([1, 2, 3], [4, 5, 6, 7]).interval).toBeNull();
    const four = shiftEstimate([1, 2, 3, 4], [5, 6, 7, 9]);
    expect(four.interval).toMatchObject({ lo: 1, hi: 8, ranks: [1, 16] });
    expect(four.interval!.coverage).toBeCloseTo(1 - 2 / 70, 14);
  });

  it('agrees with brute force (all differences, U counted over every arrangement) on random samples', () => {
    fc.assert(
      fc.property(
        fc.array(fc.integer({ min: 0, max: 400 }), { minLength: 1, maxLength: 7 }),
        fc.array(fc.integer({ min: 0, max: 400 }), { minLength: 1, maxLength: 7 }),
        (ra, rb) => {
          const a = ra.map((x) => x / 4);
          const b = rb.map((x) => x / 4 + 3);
          const s = shiftEstimate(a, b);
          const bf = bruteForce(a, b);
          expect(s.estimate).toBeCloseTo(bf.estimate, 10);
          expect(s.interval?.ranks[0] ?? 0).toBe(bf.k);
          if (bf.k) {
            expect(s.interval!.lo).toBe(bf.lo);
            expect(s.interval!.hi).toBe(bf.hi);
            expect(s.interval!.coverage).toBeCloseTo(bf.coverage, 12);
          } else expect(s.interval).toBeNull();
        },
      ),
      { numRuns: 60 },
    );
  });

  it('beyond the exact limit uses the large-sample approximation, whose k is close to the exact one', () => {
    const a = Array.from({ length: 201 }, (_, i) => (i * 37) % 101);
    const b = Array.from({ length: 201 }, (_, i) => ((i * 53) % 103) + 5);
    expect(a.length * b.length).toBeGreaterThan(MAX_EXACT_PAIRS);
    const s = shiftEstimate(a, b);
    expect(s.distribution).toBe('normal');
    // k = round(mn/2 − 1.96·√(mn(m + n + 1)/12)) (Hollander, Wolfe & Chicken §4.3, large-sample approximation).
    expect(s.interval!.ranks[0]).toBe(Math.round((201 * 201) / 2 - 1.959963984540054 * Math.sqrt((201 * 201 * 403) / 12)));
    expect(s.interval!.coverage).toBeGreaterThan(0.949);
    expect(s.interval!.coverage).toBeLessThan(0.952);
    expect(s.estimate).toBeCloseTo(ss.median(a.flatMap((x) => b.map((y) => y - x))), 10);
  });

  it('refuses empty samples and values that are not numbers, naming the sample', () => {
    expect(computationError(() => shiftEstimate([], [1])).field).toBe('a');
    expect(computationError(() => shiftEstimate([1], [Number.NaN])).field).toBe('b');
  });
});
