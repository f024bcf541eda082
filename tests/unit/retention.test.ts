import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { ICP_CYCLES, ICP_MIN_MM, MAX_CYCLES, TCC_CYCLES, TCC_MIN_MM, cardCutRetention, decimalPlaces } from '@shared/retention';
import { computationError } from '../setup/computation-error';

describe('ISO 8442-5:2004 card-cutting test', () => {
  it('counts ICP over the first 3 cycles and TCC over 60 (R), with minimums 50 mm and 150 mm (from memory)', () => {
    expect(ICP_CYCLES).toBe(3);
    expect(TCC_CYCLES).toBe(60);
    expect(ICP_MIN_MM).toBe(50);
    expect(TCC_MIN_MM).toBe(150);
  });

  it('a blade that dulls by a tenth each cycle: 30, 27, 24.3, … mm', () => {
    // worked by hand: ICP = 30 + 27 + 24.3 = 81.3; TCC = 30 (1 − 0.9⁶⁰)/(1 − 0.9) = 299.46 (geometric series)
    const cuts = Array.from({ length: 60 }, (_, i) => 30 * 0.9 ** i);
    const r = cardCutRetention(cuts);
    expect(r.icpMm).toBeCloseTo(81.3, 10);
    expect(r.tccMm).toBeCloseTo((30 * (1 - 0.9 ** 60)) / 0.1, 9);
    expect(r.cycles).toBe(60);
    expect(r.limits).toEqual({ icpMinMm: 50, tccMinMm: 150 });
    expect(r).toMatchObject({ icpPass: true, tccPass: true });
    expect(r.cumulativeMm).toHaveLength(60);
    expect(r.cumulativeMm[2]).toBeCloseTo(81.3, 10);
  });

  it.each<[string, number[], number, number, boolean | null, boolean | null]>([
    // [case, cuts, icpMm, tccMm, icpPass, tccPass]: arithmetic by hand against the limits above
    ['short of both after 60 cycles', [...Array(3).fill(10), ...Array(57).fill(2)], 30, 144, false, false],
    ['ICP met, TCC short after 60 cycles', [20, 20, 20, ...Array(57).fill(1)], 60, 117, true, false],
    ['both met early: more cycles cannot take card away', [40, 40, 40, 40], 120, 160, true, true],
    ['two cycles, ICP not yet reached: too few to judge', [10, 10], 20, 20, null, null],
    ['two cycles, ICP already reached', [30, 25], 55, 55, true, null],
    ['one cycle of nothing', [0], 0, 0, null, null],
    ['exactly on the minimums', [20, 20, 10, ...Array(50).fill(2), ...Array(7).fill(0)], 50, 150, true, true],
    ['cycles beyond 60 are not counted in TCC', [...Array(60).fill(2), 500], 6, 120, false, false],
  ])('%s', (_case, cuts, icp, tcc, icpPass, tccPass) => {
    const r = cardCutRetention(cuts);
    expect(r.icpMm).toBeCloseTo(icp, 9);
    expect(r.tccMm).toBeCloseTo(tcc, 9);
    expect(r.icpPass).toBe(icpPass);
    expect(r.tccPass).toBe(tccPass);
    expect(r.cycles).toBe(cuts.length);
  });

  it('a series adding up to exactly the minimums in decimal passes (sums at the inputs\' precision)', () => {
    // 0.3 + 32.3 + 17.4 = 50.0 by hand, but 49.99999999999999 in IEEE 754 double arithmetic
    // (checked with a plain reduce below, so the test shows the trap it guards against).
    const icpCuts = [0.3, 32.3, 17.4];
    expect(icpCuts.reduce((a, b) => a + b, 0)).toBeLessThan(50);
    // 50 + 56 × 1.3 + 27.2 = 150.0 by hand; 149.99999999999983 as a plain double sum.
    const cuts = [...icpCuts, ...Array(56).fill(1.3), 27.2];
    expect(cuts.reduce((a, b) => a + b, 0)).toBeLessThan(150);
    const r = cardCutRetention(cuts);
    expect(r.icpMm).toBe(50);
    expect(r.tccMm).toBe(150);
    expect(r).toMatchObject({ icpPass: true, tccPass: true });
    // a tenth under the minimum still fails: the rounding is to the inputs' precision, not looser
    expect(cardCutRetention([0.3, 32.3, 17.3]).icpPass).toBe(false);
  });

  it.each<[number, number]>([
    [40, 0],
    [1.25, 2],
    [3e-7, 7],
    [1.5e-8, 9],
    [2.5e21, 0],
  ])('decimal places of %s: %i', (x, places) => {
    expect(decimalPlaces(x)).toBe(places);
  });

  it.each<[string, unknown, string, RegExp]>([
    ['no cycles', [], 'cutsMm', /at least one cycle/],
    ['not a list', 'lots', 'cutsMm', /list of millimetres/],
    ['a negative cut', [10, -2, 5], 'cutsMm.1', /cycle 2 must be a non-negative number/],
    ['NaN', [10, Number.NaN], 'cutsMm.1', /cycle 2/],
    ['Infinity', [Infinity], 'cutsMm.0', /cycle 1/],
    ['a string', [10, '5'], 'cutsMm.1', /cycle 2/],
    ['too many cycles', Array(MAX_CYCLES + 1).fill(1), 'cutsMm', /at most 200 cycles/],
  ])('refuses %s', (_case, cuts, field, message) => {
    const err = computationError(() => cardCutRetention(cuts as number[]));
    expect(err.field).toBe(field);
    expect(err.message).toMatch(message);
  });

  it(`accepts up to ${MAX_CYCLES} cycles`, () => {
    expect(cardCutRetention(Array(MAX_CYCLES).fill(1)).tccMm).toBe(60);
  });

  it('property: TCC ≥ ICP, the running total never falls, and both equal the sums of their cycles', () => {
    fc.assert(
      fc.property(fc.array(fc.double({ min: 0, max: 100, noNaN: true }), { minLength: 1, maxLength: MAX_CYCLES }), (cuts) => {
        const r = cardCutRetention(cuts);
        const sum = (xs: number[]) => xs.reduce((a, b) => a + b, 0);
        expect(r.icpMm).toBeCloseTo(sum(cuts.slice(0, 3)), 9);
        expect(r.tccMm).toBeCloseTo(sum(cuts.slice(0, 60)), 9);
        expect(r.tccMm).toBeGreaterThanOrEqual(r.icpMm);
        for (let i = 1; i < r.cumulativeMm.length; i++) expect(r.cumulativeMm[i]).toBeGreaterThanOrEqual(r.cumulativeMm[i - 1]);
        // a verdict is given only when it cannot change with more cycles
        if (r.tccPass === false) expect(cuts.length).toBeGreaterThanOrEqual(60);
        if (r.tccPass === null) expect(r.tccMm).toBeLessThan(150);
      }),
    );
  });
});
