/**
 * Tester-adjusted comparison of two comparison cells: for every tester who measured both, the
 * difference between that tester's own median in cell A and in cell B. An instrument that
 * reads high shifts both sides alike, so it cancels in the difference. The point estimate is
 * the median of the per-tester differences; its 95 % interval is the distribution-free
 * order-statistic interval for a median (the sign-test interval: Conover, Practical
 * Nonparametric Statistics, 3rd ed., 1999, §3.2), which needs no assumption about the shape of
 * the differences, only that testers are independent. Pure arithmetic.
 */
import { median } from './stats';

/** One result as the paired comparison uses it. */
export interface PairedMember {
  authorId: number;
  /** The result's median reading, g. */
  sharpnessMedianG: number;
}

/** One tester who measured both cells. */
export interface TesterPair {
  authorId: number;
  nA: number;
  nB: number;
  /** The tester's median in each cell, g. */
  medianAG: number;
  medianBG: number;
  /** medianAG − medianBG, g: negative means A gave the keener edge for this tester. */
  diffG: number;
}

/** An interval for the median difference with its exact coverage. */
export interface OrderInterval {
  lo: number;
  hi: number;
  /** Exact coverage probability under the sign test's null (a fraction, e.g. 0.979). */
  coverage: number;
  /** 1-based ranks of the order statistics used: [k, n − k + 1]. */
  ranks: [number, number];
}

/** The paired comparison of two cells. */
export interface PairedComparison {
  /** Testers in both cells. */
  pairs: TesterPair[];
  n: number;
  /** Median of the per-tester differences, g; null without pairs. */
  medianDiffG: number | null;
  /** 95 % interval; null when there are too few testers for one (fewer than 6). */
  ci95: OrderInterval | null;
  /** With too few testers for 95 %: the widest interval there is (min to max) and its coverage. */
  widest: OrderInterval | null;
  /** How many testers found A keener (lower), B keener, or no difference. */
  signs: { aLower: number; bLower: number; ties: number };
  /** Testers found in only one of the cells (left out of the pairing). */
  unpairedTesters: { a: number; b: number };
}

/** P(X ≤ x) for X ~ Binomial(n, 1/2), exactly, by summing C(n, i) / 2ⁿ. */
export function binomialHalfCdf(x: number, n: number): number {
  if (x < 0) return 0;
  if (x >= n) return 1;
  let term = 2 ** -n; // C(n, 0) / 2^n
  let sum = term;
  for (let i = 1; i <= x; i++) {
    term = (term * (n - i + 1)) / i;
    sum += term;
  }
  return sum;
}

/**
 * The order-statistic interval [d(k), d(n−k+1)] for the median of n sorted values with the
 * largest k whose coverage 1 − 2·P(B ≤ k − 1), B ~ Binomial(n, ½), is at least `level`.
 * Null when even k = 1 covers less than `level` (n < 6 for 95 %).
 */
export function medianInterval(sorted: readonly number[], level = 0.95): OrderInterval | null {
  const n = sorted.length;
  let best: OrderInterval | null = null;
  for (let k = 1; k <= Math.floor((n + 1) / 2); k++) {
    const coverage = 1 - 2 * binomialHalfCdf(k - 1, n);
    if (coverage < level) break;
    best = { lo: sorted[k - 1], hi: sorted[n - k], coverage, ranks: [k, n - k + 1] };
  }
  return best;
}

function byTester(members: readonly PairedMember[]): Map<number, number[]> {
  const out = new Map<number, number[]>();
  for (const m of members) {
    const list = out.get(m.authorId);
    if (list) list.push(m.sharpnessMedianG);
    else out.set(m.authorId, [m.sharpnessMedianG]);
  }
  return out;
}

/** Pairs two cells' results by tester and summarises the per-tester differences (A − B). */
export function pairedComparison(a: readonly PairedMember[], b: readonly PairedMember[]): PairedComparison {
  const inA = byTester(a);
  const inB = byTester(b);
  const pairs: TesterPair[] = [];
  for (const [authorId, valuesA] of inA) {
    const valuesB = inB.get(authorId);
    if (!valuesB) continue;
    const medianAG = median(valuesA);
    const medianBG = median(valuesB);
    pairs.push({ authorId, nA: valuesA.length, nB: valuesB.length, medianAG, medianBG, diffG: medianAG - medianBG });
  }
  pairs.sort((x, y) => x.diffG - y.diffG || x.authorId - y.authorId);
  const diffs = pairs.map((p) => p.diffG);
  const n = diffs.length;
  const widestCoverage = n ? 1 - 2 * binomialHalfCdf(0, n) : 0;
  const ci95 = n ? medianInterval(diffs, 0.95) : null;
  return {
    pairs,
    n,
    medianDiffG: n ? median(diffs) : null,
    ci95,
    widest: n && !ci95 ? { lo: diffs[0], hi: diffs[n - 1], coverage: widestCoverage, ranks: [1, n] } : null,
    signs: { aLower: diffs.filter((d) => d < 0).length, bLower: diffs.filter((d) => d > 0).length, ties: diffs.filter((d) => d === 0).length },
    unpairedTesters: { a: inA.size - n, b: inB.size - n },
  };
}
