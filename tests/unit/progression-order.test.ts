import { describe, expect, it } from 'vitest';
import { coarserAfterFiner } from '@shared/progression';
import { parseGrit } from '@shared/grit';

// Going from coarse to fine along a progression is common practice in sharpening; the hint names
// each place where a step is coarser (larger particle size) than the sized step before it.
describe('coarserAfterFiner', () => {
  it('finds nothing along a progression that only gets finer, and skips steps of unknown size', () => {
    expect(coarserAfterFiner([180, null, 63, 15, 3])).toEqual([]);
  });

  it('names the neighbouring pair that goes back to a coarser size, across an unknown step', () => {
    // A fine stone (63 µm) before a coarse wheel (116 µm): step 1 then step 3 (step 2 has no size).
    expect(coarserAfterFiner([63, null, 116, 15])).toEqual([{ earlier: 0, later: 2 }]);
  });

  it('reads sizes through the grit tables: FEPA F220 is finer than ISO 6106 B126, so B126 after F220 is flagged', () => {
    // FEPA F220 ≈ 58–63 µm and ISO 6106 B126 ≈ 107–126 µm (published tables, see tests/unit/grit.test.ts).
    const f220 = parseGrit('F220').micrometres;
    const b126 = parseGrit('B126').micrometres;
    expect(f220).toBeLessThan(b126);
    expect(coarserAfterFiner([f220, b126])).toEqual([{ earlier: 0, later: 1 }]);
  });

  it('compares the last step with the final abrasive too', () => {
    expect(coarserAfterFiner([125, 46, 62.5])).toEqual([{ earlier: 1, later: 2 }]);
  });
});
