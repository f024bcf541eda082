import { describe, expect, it } from 'vitest';
import * as ss from 'simple-statistics';
import { aggregateCell, type CellMember } from '../../shared/aggregate';

const member = (authorId: number, g: number, cuts: number | null = null): CellMember => ({ authorId, sharpnessMedianG: g, retentionCuts: cuts, hrc: 60, perSideDeg: 15 });

describe('aggregateCell', () => {
  it('summarises the medians of a cell, counting testers and retention', () => {
    // Worked by hand: sorted 150, 160, 170, 200, 220 (n = 5).
    // Median 170. Quartiles by linear interpolation between order statistics (R type 7):
    // h = (n − 1)p → q1 at h = 1 → 160; q3 at h = 3 → 200. Mean 180.
    const cell = aggregateCell([member(1, 200, 300), member(2, 150, 200), member(1, 170, null), member(3, 220, 260), member(2, 160, 250)]);
    expect(cell.n).toBe(5);
    expect(cell.testers).toBe(3);
    expect(cell.sharpnessG.median).toBe(170);
    expect(cell.sharpnessG.q1).toBe(160);
    expect(cell.sharpnessG.q3).toBe(200);
    expect(cell.sharpnessG.mean).toBe(180);
    // sd checked against simple-statistics' sampleStandardDeviation (n − 1), a general-purpose package.
    expect(cell.sharpnessG.sd).toBeCloseTo(ss.sampleStandardDeviation([200, 150, 170, 220, 160]), 10);
    // 95 % CI: mean ± t(0.975, 4) · s/√n with t = 2.776 (NIST/SEMATECH e-Handbook §1.3.6.7.2, t table).
    const half = (2.776 * ss.sampleStandardDeviation([200, 150, 170, 220, 160])) / Math.sqrt(5);
    expect(cell.sharpnessG.ci95![0]).toBeCloseTo(180 - half, 1);
    expect(cell.sharpnessG.ci95![1]).toBeCloseTo(180 + half, 1);
    // Retention median over the four results that report it: 200, 250, 260, 300 → 255.
    expect(cell.retentionMedianCuts).toBe(255);
  });

  it('gives no spread for a single result', () => {
    const cell = aggregateCell([member(1, 210)]);
    expect(cell.sharpnessG).toMatchObject({ n: 1, median: 210, q1: 210, q3: 210, sd: null, ci95: null });
    expect(cell.retentionMedianCuts).toBeNull();
  });
});
