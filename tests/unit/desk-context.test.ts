import { describe, expect, it } from 'vitest';
import * as ss from 'simple-statistics';
import { cellPosition, isNearDuplicate, percentileRank, readingsCheck, tukeyOutlier } from '../../shared/desk-context';

describe('the desk context computations', () => {
  it('percentile rank counts ties half: (below + ½ · equal) / n × 100 (the usual textbook definition, common practice)', () => {
    expect(percentileRank([10, 20, 20, 30], 20)).toBe(50); // (1 + 1) / 4
    expect(percentileRank([10, 20, 30, 40], 5)).toBe(0);
    expect(percentileRank([10, 20, 30, 40], 45)).toBe(100);
    expect(percentileRank([], 1)).toBeNull();
  });

  it('says in words where a value falls against the quartiles', () => {
    const values = [100, 110, 120, 130, 140, 150, 160, 170, 180];
    expect(cellPosition(values, 90)!.words).toMatch(/below the lower quartile \(120 g\)/);
    expect(cellPosition(values, 140)!.band).toBe('median');
    expect(cellPosition(values, 175)!.words).toMatch(/above the upper quartile \(160 g\)/);
    expect(cellPosition([], 1)).toBeNull();
  });

  it("puts Tukey's fences 1.5 IQR beyond the quartiles, recomputed with simple-statistics (Tukey 1977, recalled from memory)", () => {
    const values = [152, 160, 161, 163, 165, 168, 170, 171, 175, 240];
    const iqr = ss.interquartileRange(values);
    const hint = tukeyOutlier(values, 240);
    expect(hint.fences![0]).toBeCloseTo(ss.quantile(values, 0.25) - 1.5 * iqr, 9);
    expect(hint.fences![1]).toBeCloseTo(ss.quantile(values, 0.75) + 1.5 * iqr, 9);
    expect(hint.outside).toBe('high');
    expect(tukeyOutlier(values, 165).outside).toBeNull();
    expect(tukeyOutlier([150, 160, 170], 500)).toMatchObject({ fences: null, outside: null });
  });

  it('counts readings short of the method, and applies the near-duplicate tolerances at their edges', () => {
    expect(readingsCheck(5, 3)).toMatchObject({ short: 2 });
    expect(readingsCheck(5, 6)).toMatchObject({ short: 0 });
    const a = { steelId: 1, abrasiveId: 2, gritGrade: 'F400', sharpnessMethodId: 3, perSideDeg: 15, sharpnessMedianG: 200 };
    expect(isNearDuplicate(a, { ...a, perSideDeg: 15.25, sharpnessMedianG: 210 })).toBe(true); // 10 / 210 < 5 %
    expect(isNearDuplicate(a, { ...a, sharpnessMedianG: 211 })).toBe(false); // 11 / 211 > 5 %
    expect(isNearDuplicate(a, { ...a, perSideDeg: 15.3 })).toBe(false);
    expect(isNearDuplicate(a, { ...a, gritGrade: 'F500' })).toBe(false);
  });
});
