import { describe, expect, it } from 'vitest';
import * as ss from 'simple-statistics';
import Papa from 'papaparse';
import { bandStartOf, cellColumns, groupIntoCells, type BandedMember } from '../../shared/aggregate';
import { binomialHalfCdf, medianInterval, pairedComparison } from '../../shared/compare-paired';
import { shrinkageShare, shrunkMedian, SHRINKAGE_PSEUDO_RESULTS } from '../../shared/compare-shrinkage';
import { comparisonCsv, comparisonJson, EXPORT_COLUMNS, type ExportContext } from '../../shared/compare-export';
import { bandInfo, formatBand, sortRows, type CompareRow } from '../../shared/compare-view';
import { compareQuerySchema, cellRefSchema } from '../../shared/schemas/compare';

const member = (o: Partial<BandedMember> & { gritUm: number; g: number; author?: number }): BandedMember => ({
  sharpnessMethodId: 1,
  steelId: 1,
  material: 'cbn',
  gritPhi: Math.floor(-Math.log2(o.gritUm / 1000)),
  authorId: o.author ?? 1,
  sharpnessMedianG: o.g,
  retentionCuts: null,
  hrc: 60,
  perSideDeg: 15,
  ...o,
});

describe('grit bands of a cell', () => {
  // Krumbein's φ = −log2(d / 1 mm) (Krumbein 1934, the sedimentologists' grain-size scale):
  // 10 µm → φ = log2(100) = 6.64, so whole band φ 6 (15.625–7.8125 µm) and half band φ 6.5.
  it.each([
    { um: 10, whole: 12, half: 13 },
    { um: 15, whole: 12, half: 12 }, // φ = 6.06
    { um: 15.625, whole: 12, half: 12 }, // exactly on the edge φ = 6: the band it is the coarse edge of
    { um: 7.8125, whole: 14, half: 14 }, // φ = 7 exactly
    { um: 120, whole: 6, half: 6 }, // φ = 3.06
    { um: 100, whole: 6, half: 6 }, // φ = 3.32: in 125–88.4 µm
    { um: 80, whole: 6, half: 7 }, // φ = 3.64: in 88.4–62.5 µm
    { um: 1500, whole: -2, half: -2 }, // φ = −0.58 (a coarse grain: negative φ)
  ])('puts $um µm in whole band start $whole and half band start $half (half-φ units)', ({ um, whole, half }) => {
    const m = member({ gritUm: um, g: 100 });
    expect(bandStartOf(m, 1)).toBe(whole);
    expect(bandStartOf(m, 0.5)).toBe(half);
    // a half band always lies inside its whole band
    expect(half === whole || half === whole + 1).toBe(true);
  });

  it('gives band edges and words', () => {
    expect(bandInfo(6, 1)).toMatchObject({ loUm: 7.8125, hiUm: 15.625, words: 'fine' });
    expect(bandInfo(6.5, 0.5).hiUm).toBeCloseTo(11.0485, 4); // 1000 · 2^−6.5
    expect(formatBand(bandInfo(3, 1))).toBe('62.5–125 µm');
  });

  it('splits whole cells into half cells that hold the same results', () => {
    const members = [10, 11.5, 12, 14, 9, 40, 50].map((um, i) => member({ gritUm: um, g: 100 + i }));
    const whole = groupIntoCells(members, 1);
    const half = groupIntoCells(members, 0.5);
    expect(whole.map((c) => [c.key.bandStart, c.members.length])).toEqual([
      [12, 5],
      [8, 2],
    ]);
    // 11.05 µm is the half edge inside 7.8–15.6 µm: 11.5, 12, 14 in the coarse half (12); 10, 9 in the fine (13).
    const byStart = new Map(half.map((c) => [c.key.bandStart, c.members.map((m) => m.gritUm)]));
    expect(byStart.get(12)).toEqual([11.5, 12, 14]);
    expect(byStart.get(13)).toEqual([10, 9]);
    expect(half.reduce((s, c) => s + c.members.length, 0)).toBe(members.length);
  });
});

describe('cell figures', () => {
  it('computes quartiles, mean, sd and CI of an even-sized cell', () => {
    // Worked by hand (Hyndman and Fan 1996, definition 7: h = (n − 1)p): 10, 20, 30, 40 →
    // q1 at h = 0.75: 17.5; median 25; q3 at h = 2.25: 32.5.
    const c = cellColumns([10, 40, 20, 30].map((g, i) => ({ ...member({ gritUm: 10, g, author: i % 2 }), retentionCuts: i === 0 ? 100 : null })));
    expect(c).toMatchObject({ n: 4, testers: 2, medianG: 25, q1G: 17.5, q3G: 32.5, meanG: 25, retentionN: 1, retentionMedianCuts: 100, gritUmMin: 10, gritUmMax: 10 });
    // simple-statistics (a general-purpose npm package): sample sd and median.
    expect(c.sdG).toBeCloseTo(ss.sampleStandardDeviation([10, 20, 30, 40]), 12);
    expect(c.medianG).toBe(ss.median([10, 20, 30, 40]));
    // 95 % CI of the mean, Student's t(0.975, 3) = 3.182 (NIST/SEMATECH e-Handbook §1.3.6.7.2, t table).
    const half = (3.182 * ss.sampleStandardDeviation([10, 20, 30, 40])) / 2;
    expect(c.ciLoG!).toBeCloseTo(25 - half, 1);
    expect(c.ciHiG!).toBeCloseTo(25 + half, 1);
  });
});

describe('low-n shrinkage', () => {
  it('pulls a small cell toward the overall median as if it had k more results there', () => {
    expect(SHRINKAGE_PSEUDO_RESULTS).toBe(3);
    // By hand: n = 2, median 150 g, overall 240 g, k = 3 → (2·150 + 3·240) / 5 = 204 g.
    expect(shrunkMedian(2, 150, 240)).toBe(204);
    // The same as the weighted mean of the cell's median (weight n) and the overall median (weight k).
    expect(shrunkMedian(2, 150, 240)).toBeCloseTo(ss.sum([2 * 150, 3 * 240]) / ss.sum([2, 3]), 12);
    expect(shrinkageShare(2)).toBeCloseTo(0.6, 12);
    expect(shrinkageShare(57)).toBeCloseTo(0.05, 12);
    // A big cell hardly moves; ranking order: two lucky results no longer beat 40 good ones.
    expect(shrunkMedian(2, 120, 240)).toBeGreaterThan(shrunkMedian(40, 150, 240));
    expect(() => shrunkMedian(-1, 1, 1)).toThrow(/n must be/);
  });
});

describe('paired differences', () => {
  it('pairs testers and gives the median difference with its order-statistic interval (worked example)', () => {
    const A = [
      { authorId: 1, sharpnessMedianG: 200 },
      { authorId: 1, sharpnessMedianG: 210 },
      { authorId: 2, sharpnessMedianG: 180 },
      { authorId: 3, sharpnessMedianG: 250 },
      { authorId: 4, sharpnessMedianG: 170 },
      { authorId: 5, sharpnessMedianG: 230 },
      { authorId: 6, sharpnessMedianG: 190 },
      { authorId: 7, sharpnessMedianG: 300 }, // only in A
    ];
    const B = [
      { authorId: 1, sharpnessMedianG: 220 },
      { authorId: 2, sharpnessMedianG: 190 },
      { authorId: 2, sharpnessMedianG: 200 },
      { authorId: 2, sharpnessMedianG: 196 },
      { authorId: 3, sharpnessMedianG: 240 },
      { authorId: 4, sharpnessMedianG: 200 },
      { authorId: 5, sharpnessMedianG: 255 },
      { authorId: 6, sharpnessMedianG: 195 },
    ];
    const p = pairedComparison(A, B);
    // By hand: per-tester medians A − B: 205 − 220 = −15, 180 − 196 = −16, +10, −30, −25, −5.
    expect(p.pairs.map((x) => x.diffG)).toEqual([-30, -25, -16, -15, -5, 10]);
    expect(p.n).toBe(6);
    expect(p.medianDiffG).toBe(-15.5);
    expect(p.medianDiffG).toBe(ss.median([-30, -25, -16, -15, -5, 10]));
    // n = 6: [d(1), d(6)] covers 1 − 2·(1/2)^6 = 0.96875 (by hand); [d(2), d(5)] only 1 − 2·7/64 = 0.78.
    expect(p.ci95).toEqual({ lo: -30, hi: 10, coverage: 0.96875, ranks: [1, 6] });
    expect(p.signs).toEqual({ aLower: 5, bLower: 1, ties: 0 });
    expect(p.unpairedTesters).toEqual({ a: 1, b: 0 });
  });

  it('says when there are too few testers for a 95 % interval', () => {
    const A = [1, 2, 3, 4, 5].map((id) => ({ authorId: id, sharpnessMedianG: 100 + id }));
    const B = [1, 2, 3, 4, 5].map((id) => ({ authorId: id, sharpnessMedianG: 110 }));
    const p = pairedComparison(A, B);
    expect(p.ci95).toBeNull();
    // n = 5: even min to max covers only 1 − 2/32 = 0.9375.
    expect(p.widest).toEqual({ lo: -9, hi: -5, coverage: 0.9375, ranks: [1, 5] });
    expect(pairedComparison(A, []).medianDiffG).toBeNull();
  });

  it('computes the binomial tail exactly, checked against simple-statistics', () => {
    for (const n of [6, 10, 17, 30]) {
      const pmf = ss.binomialDistribution(n, 0.5)!;
      // the lower tail, which the interval uses (simple-statistics stops its list once the
      // cumulative probability is within its epsilon of 1, so its upper tail is cut short)
      for (let x = 0; x <= n / 2; x++) {
        const reference = pmf.slice(0, x + 1).reduce((s, v) => s + v, 0);
        expect(binomialHalfCdf(x, n)).toBeCloseTo(reference, 10);
      }
    }
    // n = 10: P(B ≤ 1) = 11/1024, so [d(2), d(9)] covers 1 − 22/1024 = 0.978515625 (by hand).
    const sorted = Array.from({ length: 10 }, (_, i) => i);
    expect(medianInterval(sorted)).toEqual({ lo: 1, hi: 8, coverage: 1 - 22 / 1024, ranks: [2, 9] });
  });

  it('covers the true median of a skewed distribution at least 95 % of the time (seeded simulation)', () => {
    // Differences drawn from an exponential distribution (median ln 2), where a t interval of
    // the mean would aim at the mean (1) instead. Fixed seed: the outcome is the same each run.
    let a = 0x5eed;
    const rand = () => {
      a = (a + 0x6d2b79f5) >>> 0;
      let t = a;
      t = Math.imul(t ^ (t >>> 15), t | 1);
      t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
      return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
    };
    let covered = 0;
    const trials = 4000;
    for (let i = 0; i < trials; i++) {
      const d = Array.from({ length: 10 }, () => -Math.log(1 - rand())).sort((x, y) => x - y);
      const ci = medianInterval(d)!;
      if (ci.lo <= Math.LN2 && Math.LN2 <= ci.hi) covered++;
    }
    // Expected 0.9785 (exact coverage for n = 10); ± 3 standard errors ≈ ± 0.007.
    expect(covered / trials).toBeGreaterThan(0.97);
    expect(covered / trials).toBeLessThan(0.987);
  });
});

const row = (o: Partial<CompareRow>): CompareRow => {
  const band = bandInfo(6, 1);
  return {
    cell: 'aisi-d2:cbn:6',
    method: 'push-cut-test-v2',
    methodName: 'Push-cut sharpness test, version 2',
    methodVersion: 2,
    steel: 'aisi-d2',
    steelName: 'AISI D2',
    steelCategory: 'tool',
    material: 'cbn',
    materialLabel: 'CBN',
    band,
    gritBand: { loUm: band.loUm, hiUm: band.hiUm },
    n: 5,
    testers: 3,
    fewResults: false,
    singleTester: false,
    sharpnessG: { median: 150, q1: 140, q3: 160, mean: 151, sd: 10, ci95: [140, 162] },
    rankedMedianG: 160,
    retentionCuts: { median: 300, n: 2 },
    hrcRange: [60, 62],
    angleRange: [15, 17],
    gritUmRange: [10, 12],
    ...o,
  };
};

describe('export', () => {
  const ctx: ExportContext = {
    url: 'http://127.0.0.1:3000/compare?steel=aisi-d2',
    retrievedOn: '2026-11-02',
    methods: [{ slug: 'push-cut-test-v2', name: 'Push-cut sharpness test, version 2', version: 2 }],
    filters: 'steel AISI D2',
    step: 1,
  };

  it('writes a CSV with licence, citation, methods, and rows that papaparse reads back', () => {
    const rows = [
      row({}),
      row({ steelName: '=cmd|"/c calc"!A1', steel: 'x', cell: 'x:cbn:6', sharpnessG: { median: 90, q1: 90, q3: 90, mean: 90, sd: null, ci95: null }, retentionCuts: null, n: 1, testers: 1, fewResults: true, singleTester: true }),
      row({ steelName: 'Steel, "quoted"', band: bandInfo(-1, 1) }),
    ];
    const csv = comparisonCsv(rows, ctx);
    const lines = csv.split('\r\n');
    expect(lines[0]).toMatch(/^# .*Licence: CC BY 4\.0.*creativecommons\.org\/licenses\/by\/4\.0/);
    expect(lines[1]).toContain('Retrieved 2026-11-02 from http://127.0.0.1:3000/compare?steel=aisi-d2');
    expect(lines[2]).toContain('push-cut-test-v2 (Push-cut sharpness test, version 2; version 2)');
    const parsed = Papa.parse<Record<string, string>>(csv, { header: true, comments: '#', skipEmptyLines: true });
    expect(parsed.errors).toEqual([]);
    expect(parsed.meta.fields).toEqual(EXPORT_COLUMNS.map((c) => c.header));
    expect(parsed.data).toHaveLength(3);
    expect(parsed.data[0]).toMatchObject({ steel: 'aisi-d2', median_g: '150', mean_ci95_low_g: '140', n: '5', marks: '' });
    expect(parsed.data[1].steel_name.startsWith("'=")).toBe(true);
    expect(parsed.data[1]).toMatchObject({ marks: 'few results; one tester', sd_g: '', retention_median_cuts: '', retention_n: '0' });
    expect(parsed.data[2].steel_name).toBe('Steel, "quoted"');
    // numbers are never prefixed, negative φ of a coarse band included
    expect(parsed.data[2].band_phi_from).toBe('-1');
  });

  it('writes a JSON document with the same columns', () => {
    const doc = comparisonJson([row({})], ctx);
    expect(doc.licence.name).toBe('CC BY 4.0');
    expect(doc.citation).toContain(ctx.url);
    expect(doc.methods).toEqual(ctx.methods);
    expect(doc.rows[0]).toMatchObject({ median_g: 150, ranked_median_g: 160, grit_band: '7.81–15.6 µm' });
  });
});

describe('sorting and the query', () => {
  it('sorts by any column with missing values last and a stable tie-break', () => {
    const rows = [
      row({ steelName: 'B', sharpnessG: { ...row({}).sharpnessG, median: 200 }, retentionCuts: null }),
      row({ steelName: 'A', sharpnessG: { ...row({}).sharpnessG, median: 100 }, retentionCuts: { median: 50, n: 1 } }),
      row({ steelName: 'C', sharpnessG: { ...row({}).sharpnessG, median: 150 }, retentionCuts: { median: 70, n: 1 } }),
    ];
    expect(sortRows(rows, 'median').map((r) => r.steelName)).toEqual(['A', 'C', 'B']);
    expect(sortRows(rows, '-median').map((r) => r.steelName)).toEqual(['B', 'C', 'A']);
    expect(sortRows(rows, 'retention').map((r) => r.steelName)).toEqual(['A', 'C', 'B']);
    expect(sortRows(rows, '-retention').map((r) => r.steelName)).toEqual(['C', 'A', 'B']);
    expect(sortRows(rows).map((r) => r.steelName)).toEqual(['A', 'B', 'C']);
  });

  it('parses lists, flags and ranges from a URL and names bad fields', () => {
    const q = compareQuerySchema.parse({ steel: 'aisi-d2,aisi-m2', material: ['cbn', 'diamond'], publisher: '1', step: '0.5', hrcMin: '58' });
    expect(q).toMatchObject({ steel: ['aisi-d2', 'aisi-m2'], material: ['cbn', 'diamond'], publisher: true, step: 0.5, hrcMin: 58, page: 1, pageSize: 100 });
    const bad = compareQuerySchema.safeParse({ hrcMin: '62', hrcMax: '58', step: '2', sort: 'colour', material: 'unobtainium' });
    expect(bad.success).toBe(false);
    const paths = bad.error!.issues.map((i) => i.path.join('.'));
    expect(paths).toEqual(expect.arrayContaining(['step', 'sort', 'material.0']));
    expect(cellRefSchema.parse('aisi-d2:cbn:6.5')).toEqual({ steel: 'aisi-d2', material: 'cbn', phi: 6.5 });
    expect(cellRefSchema.safeParse('aisi-d2:cbn').success).toBe(false);
  });
});
