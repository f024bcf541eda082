/**
 * Lengths in mm or inches (src/lib/lengths.ts). The inch is exactly 25.4 mm (international
 * yard and pound agreement, 1959; NIST Handbook 44, Appendix C).
 */
import { describe, expect, it } from 'vitest';
import { formatLength, lengthsIn, lengthText, toMillimetres } from '../../src/lib/lengths';

describe('lengths in the chosen unit', () => {
  it('an inch is 25.4 mm both ways (NIST: 1 in = 25.4 mm exactly)', () => {
    expect(toMillimetres('1', 'in')).toBe(25.4);
    expect(toMillimetres('10', 'in')).toBeCloseTo(254, 12);
    expect(toMillimetres('0,5', 'in')).toBeCloseTo(12.7, 12); // decimal comma
    expect(toMillimetres('250', 'mm')).toBe(250);
    expect(toMillimetres('', 'in')).toBeNaN();
    // 25.4 has one decimal, so a decimal in inches is exact in mm with one more place (arithmetic, NIST's exact inch)
    expect(toMillimetres('0.1', 'in')).toBe(2.54); // the binary product alone is 2.5400000000000005
    expect(toMillimetres('0.4724', 'in')).toBe(11.99896);
    expect(toMillimetres('1e-1', 'in')).toBeCloseTo(2.54, 12);
    expect(formatLength(254, 'in')).toBe('10\u00a0in');
    expect(formatLength(12, 'in')).toBe('0.472\u00a0in'); // 12 / 25.4 = 0.47244…
    expect(formatLength(-0.5, 'mm', true)).toBe('−0.5\u00a0mm');
  });

  it('a box rewritten in the other unit gives back the same length in mm', () => {
    for (const mm of [250, 12, 80.25, 0.1]) {
      expect(toMillimetres(lengthText(mm, 'in'), 'in')).toBeCloseTo(mm, 2);
      expect(toMillimetres(lengthText(mm, 'mm'), 'mm')).toBeCloseTo(mm, 9);
    }
    expect(lengthText(250, 'in')).toBe('9.8425'); // 250 / 25.4 = 9.84252…
  });

  it('a computation\'s message in mm is shown in inches', () => {
    const message = "the bar would have to sit inside the wheel (25.4 mm of overlap); lengthen the projection to at least 127 mm";
    expect(lengthsIn(message, 'in')).toBe('the bar would have to sit inside the wheel (1\u00a0in of overlap); lengthen the projection to at least 5\u00a0in');
    expect(lengthsIn(message, 'mm')).toBe(message);
  });
});
